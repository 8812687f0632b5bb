/**
 * The values stored statuses and kinds may take, defined once: the database schema builds its CHECK constraints from
 * these lists, the zod schemas validate against them and the screens label them. This module imports nothing, so
 * every other module may use it. Lists that carry more than their values live beside what they carry (categories,
 * tiers and zones with their labels and rates in shared/catalog.ts and shared/pricing.ts, return kinds and condition
 * grades in shared/schemas/warehouse.ts) and the schema takes them from there.
 */

export const PART_STATUSES = ['active', 'superseded', 'discontinued'] as const;
export type PartStatus = (typeof PART_STATUSES)[number];
/** What the part form may set; "superseded" comes only from superseding. */
export const EDITABLE_PART_STATUSES = ['active', 'discontinued'] as const;

export const ORDER_STATUSES = ['pending_payment', 'paid', 'on_account', 'picking', 'packed', 'dispatched', 'back_ordered', 'cancelled', 'returned'] as const;
export type OrderStatus = (typeof ORDER_STATUSES)[number];
export const ORDER_STATUS_LABELS: Record<OrderStatus, string> = {
  pending_payment: 'Awaiting payment',
  paid: 'Paid',
  on_account: 'On account',
  picking: 'Picking',
  packed: 'Packed',
  dispatched: 'Dispatched',
  back_ordered: 'Back-ordered',
  cancelled: 'Cancelled',
  returned: 'Returned',
};

export const PART_CONDITIONS = ['new', 'exchange'] as const;
export type PartCondition = (typeof PART_CONDITIONS)[number];

/** How a part is known by another number: a cross-reference, or a number it replaced. */
export const ALIAS_KINDS = ['cross-reference', 'superseded'] as const;

/** `workshop`: the Bench's staff (service requests, inspections, quotes, rebuilds); a role of its own. */
export const ROLES = ['customer', 'dealer', 'warehouse', 'workshop', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const DEALER_STATUSES = ['pending', 'approved', 'declined'] as const;
export type DealerStatus = (typeof DEALER_STATUSES)[number];

export const PAYMENT_METHODS = ['card', 'account'] as const;
export const PAYMENT_STATES = ['awaiting', 'requires_action', 'failed', 'paid', 'on_account', 'refunded', 'partially_refunded'] as const;
export type PaymentState = (typeof PAYMENT_STATES)[number];
/** Where the automatic refund of a payment that arrived for an order no longer awaiting one stands. */
export const PAYMENT_ALERT_REFUND_STATES = ['pending', 'refunded', 'failed'] as const;
export type PaymentAlertRefundState = (typeof PAYMENT_ALERT_REFUND_STATES)[number];

/** Every row of the stock ledger is one of these movements. */
/** `workshop`: parts the Bench fitted in a rebuild (the service request's number is in the note). */
export const STOCK_MOVEMENT_KINDS = ['goods-in', 'reserve', 'release', 'pick', 'dispatch', 'adjustment', 'return', 'workshop'] as const;
export type StockMovementKind = (typeof STOCK_MOVEMENT_KINDS)[number];

export const RETURN_STATUSES = ['requested', 'refunded', 'credited', 'rejected'] as const;
export type ReturnStatus = (typeof RETURN_STATUSES)[number];

/** What a buyer may do to an order before picking starts: take units off (a change) or cancel all of it. */
export const ORDER_CHANGE_KINDS = ['change', 'cancel'] as const;
export type OrderChangeKind = (typeof ORDER_CHANGE_KINDS)[number];
/**
 * How the money follows an order change: a refund to the card that paid, an amended invoice on account, or a card
 * payment that had not been taken and was cancelled with the provider.
 */
export const ORDER_CHANGE_SETTLEMENTS = ['card-refund', 'amended-invoice', 'payment-cancelled'] as const;
export type OrderChangeSettlement = (typeof ORDER_CHANGE_SETTLEMENTS)[number];
/** Where the card refund of an order change stands with the provider. */
export const ORDER_CHANGE_REFUND_STATES = ['pending', 'refunded', 'failed'] as const;
export type OrderChangeRefundState = (typeof ORDER_CHANGE_REFUND_STATES)[number];

export const PRICE_IMPORT_STATUSES = ['preview', 'applied'] as const;

/** The e-mails the shop sends; each outbox row is one of these. */
export const MAIL_KINDS = [
  'order-confirmation',
  'payment-failed',
  'back-order',
  'short-pick',
  'dispatch',
  'return-decision',
  'dealer-application-received',
  'dealer-approved',
  'dealer-declined',
  'password-reset',
  'account-confirm',
  'existing-account-notice',
  'order-changed',
  'service-reminder',
  'service-booked',
  'service-quote',
  'service-decision',
  'service-shipped',
] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

/** An outbox message waits (queued), is being handed to the mail server (sending), went (sent) or was given up on (failed). */
export const MAIL_STATES = ['queued', 'sending', 'sent', 'failed'] as const;
export type MailState = (typeof MAIL_STATES)[number];
export const MAIL_STATE_LABELS = {
  queued: 'Waiting',
  sending: 'Sending',
  sent: 'Sent',
  failed: 'Gave up',
} as const satisfies Record<MailState, string>;

/** `column IN ('a', 'b', …)` for a CHECK constraint; the values are our own constants, never user input. */
export function inListSql(column: string, values: readonly string[]): string {
  for (const v of values) if (!/^[\w :-]+$/.test(v)) throw new Error(`not a plain allowed value: ${v}`);
  return `${column} IN (${values.map((v) => `'${v}'`).join(', ')})`;
}

/** What an on-site notice tells a buyer: the changes of their orders and returns that also go out by e-mail. */
export const NOTICE_KINDS = ['paid', 'on-account', 'picking', 'back-ordered', 'dispatched', 'return-decided', 'service-due', 'service'] as const;
export type NoticeKind = (typeof NOTICE_KINDS)[number];

/** What a catalogue audit entry records: each change to a part, by hand or by a price import. */
export const AUDIT_ACTIONS = ['part-created', 'part-edited', 'part-superseded', 'part-links-set', 'part-photos-added', 'price-imported', 'part-imported'] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

/** How a unit came onto our books: sold by us (serial given at packing) or first seen when booked in for service. */
export const UNIT_ORIGINS = ['sold', 'booked-in'] as const;
export type UnitOrigin = (typeof UNIT_ORIGINS)[number];

/**
 * One line of a unit's history, newest last. The workshop's steps, the sale, shaft-speed logs and reminders each
 * write one; `ref` names what the line is about (an order number, a service request number, a log id).
 */
export const UNIT_EVENT_KINDS = [
  'sold',
  'registered',
  'booked-in',
  'received',
  'inspected',
  'quoted',
  'approved',
  'declined',
  'rebuilt',
  'tested',
  'shipped',
  'log-uploaded',
  'reminder-sent',
  'note',
] as const;
export type UnitEventKind = (typeof UNIT_EVENT_KINDS)[number];

/**
 * Where a service request stands on the Bench (docs/decisions/0013-bench-service-requests.md): booked in by the
 * customer and on its way, received, inspected, quoted and waiting for the customer, approved (to rebuild) or
 * declined (goes back unrepaired with the inspection fee), rebuilt (to ship), shipped (closed).
 */
export const SERVICE_STATUSES = ['booked', 'received', 'inspected', 'quoted', 'approved', 'declined', 'rebuilt', 'shipped'] as const;
export type ServiceStatus = (typeof SERVICE_STATUSES)[number];
/** How the customer pays for a service request: card at the decision, or on a dealer's account. */
export const SERVICE_PAYMENT_STATES = ['none', 'paid', 'on_account'] as const;
export type ServicePaymentState = (typeof SERVICE_PAYMENT_STATES)[number];
/** When a photo of a serviced unit was taken: by the customer at booking, or on the Bench at inspection. */
export const SERVICE_PHOTO_STAGES = ['booking', 'inspection'] as const;
