import { z } from 'zod';

/** The counts on the Office index: what waits for an administrator, each cheap to count. */
export const OfficeSummarySchema = z.object({
  /** Parts on sale (not superseded or discontinued). */
  activeParts: z.number().int(),
  /** Trade applications waiting for a decision. */
  pendingApplications: z.number().int(),
  /** Payment alerts whose refund has not gone through (pending or refused). */
  openPaymentAlerts: z.number().int(),
  /** Mail that gave up after its retries. */
  failedMail: z.number().int(),
  /** Price-list uploads checked but not applied. */
  priceImportPreviews: z.number().int(),
});
export type OfficeSummary = z.infer<typeof OfficeSummarySchema>;
