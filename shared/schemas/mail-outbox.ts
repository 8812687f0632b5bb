import { z } from 'zod';
import { MAIL_KINDS, MAIL_STATES } from '../allowed-values';

/** Labels for the Office's Mail screen, in our words. */
export const MAIL_KIND_LABELS = {
  'order-confirmation': 'Order confirmation',
  'payment-failed': 'Payment not taken',
  'back-order': 'Back-order notice',
  'short-pick': 'Short-pick notice',
  dispatch: 'Dispatch notice',
  'return-decision': 'Return decision',
  'dealer-application-received': 'Dealer application received',
  'dealer-approved': 'Dealer approval',
  'dealer-declined': 'Dealer decline',
  'password-reset': 'Password reset link',
  'account-confirm': 'Account confirmation link',
  'existing-account-notice': 'Sign-up for an existing account',
  'order-changed': 'Order changed or cancelled',
  'service-reminder': 'Service reminder',
  'service-booked': 'Service request booked in',
  'service-quote': 'Service quote ready',
  'service-decision': 'Service quote approved or declined',
  'service-shipped': 'Serviced unit shipped back',
} as const satisfies Record<(typeof MAIL_KINDS)[number], string>;

export { MAIL_STATE_LABELS } from '../allowed-values';

export const MAIL_OUTBOX_PAGE_SIZE = 50;

export const MailOutboxQuerySchema = z.object({
  state: z.enum(MAIL_STATES).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(MAIL_OUTBOX_PAGE_SIZE),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
});
export type MailOutboxQuery = z.infer<typeof MailOutboxQuerySchema>;

export const OutboxMessageSchema = z.object({
  id: z.number().int(),
  kind: z.enum(MAIL_KINDS),
  recipient: z.string(),
  subject: z.string(),
  state: z.enum(MAIL_STATES),
  attempts: z.number().int(),
  /** When a waiting message is next tried; null unless it is waiting. */
  nextAttemptAt: z.string().nullable(),
  lastError: z.string().nullable(),
  lastAttemptAt: z.string().nullable(),
  sentAt: z.string().nullable(),
  createdAt: z.string(),
  /** False for a reset or confirmation link that has gone (it is not kept) and for a message that could not be written. */
  resendable: z.boolean(),
});
export type OutboxMessage = z.infer<typeof OutboxMessageSchema>;

export const MailOutboxListSchema = z.object({
  messages: z.array(OutboxMessageSchema),
  counts: z.object({ queued: z.number().int(), sending: z.number().int(), sent: z.number().int(), failed: z.number().int() }),
  total: z.number().int(),
});
export type MailOutboxList = z.infer<typeof MailOutboxListSchema>;

export const MailResendReplySchema = z.object({ ok: z.literal(true) });
