/**
 * Every value a stored status, kind, tier or zone may take, in one place: the database schema builds its CHECK
 * constraints from these lists, the zod schemas validate against them and the screens label them. Lists that
 * already had a home stay there and are re-exported here, so a new stored value is added in one line.
 */
export { BEARINGS, CATEGORY_SLUGS, PART_STATUSES } from './catalog';
export { DEALER_TIER_KEYS, DELIVERY_ZONE_KEYS } from './pricing';
export { ORDER_STATUS_KEYS } from './schemas/orders';
export { CONDITION_GRADE_KEYS, RETURN_KIND_KEYS } from './schemas/warehouse';
export { BOOST_UNITS } from './schemas/shaft-logs';

export const PART_CONDITIONS = ['new', 'exchange'] as const;
export type PartCondition = (typeof PART_CONDITIONS)[number];

/** How a part is known by another number: a cross-reference, or a number it replaced. */
export const ALIAS_KINDS = ['cross-reference', 'superseded'] as const;

export const ROLES = ['customer', 'dealer', 'warehouse', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const DEALER_STATUSES = ['pending', 'approved', 'declined'] as const;
export type DealerStatus = (typeof DEALER_STATUSES)[number];

export const PAYMENT_METHODS = ['card', 'account'] as const;
export const PAYMENT_STATES = ['awaiting', 'requires_action', 'failed', 'paid', 'on_account', 'refunded', 'partially_refunded'] as const;
export type PaymentState = (typeof PAYMENT_STATES)[number];

/** Every row of the stock ledger is one of these movements. */
export const STOCK_MOVEMENT_KINDS = ['goods-in', 'reserve', 'release', 'pick', 'dispatch', 'adjustment', 'return'] as const;
export type StockMovementKind = (typeof STOCK_MOVEMENT_KINDS)[number];

export const RETURN_STATUSES = ['requested', 'refunded', 'credited', 'rejected'] as const;
export type ReturnStatus = (typeof RETURN_STATUSES)[number];

export const PRICE_IMPORT_STATUSES = ['preview', 'applied'] as const;

/** `column IN ('a', 'b', …)` for a CHECK constraint; the values are our own constants, never user input. */
export function inListSql(column: string, values: readonly string[]): string {
  for (const v of values) if (!/^[\w -]+$/.test(v)) throw new Error(`not a plain allowed value: ${v}`);
  return `${column} IN (${values.map((v) => `'${v}'`).join(', ')})`;
}
