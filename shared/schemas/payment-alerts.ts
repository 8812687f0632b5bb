import { z } from 'zod';
import { PAYMENT_ALERT_REFUND_STATES } from '../allowed-values';

/** A card payment that arrived for an order no longer awaiting one, and where its automatic refund stands. */
export const PaymentAlertSchema = z.object({
  id: z.number().int(),
  orderNumber: z.string(),
  amountCents: z.number().int(),
  what: z.string(),
  refundState: z.enum(PAYMENT_ALERT_REFUND_STATES),
  refundId: z.string().nullable(),
  lastError: z.string().nullable(),
  attempts: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type PaymentAlert = z.infer<typeof PaymentAlertSchema>;
export const PaymentAlertListSchema = z.object({ items: z.array(PaymentAlertSchema) });

export const REFUND_STATE_LABELS = { pending: 'Refund under way', refunded: 'Refunded', failed: 'Refund refused: retry' } as const;
