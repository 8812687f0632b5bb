/**
 * What a buyer may change on an order before picking starts, and what the order costs afterwards. Pure: the order
 * change service asks these inside its transaction and the order page shows the same answers.
 */
import { priceOrder, type DeliveryZone } from './pricing';
import type { OrderStatus } from './allowed-values';

/** Orders waiting for the warehouse: nothing has been picked from a shelf yet (the lines say so too). */
export const CHANGEABLE_STATUSES: readonly OrderStatus[] = ['paid', 'on_account', 'back_ordered'];

export type ChangeKind = 'change' | 'cancel';

/** Why an order cannot be changed (or cancelled) now, in the buyer's words; null when it can. */
export function changeRefusal(
  order: { number: string; status: OrderStatus },
  lines: ReadonlyArray<{ quantityPicked: number; quantityDispatched: number }>,
  kind: ChangeKind,
): string | null {
  const { number, status } = order;
  if (status === 'cancelled') return `Order ${number} is already cancelled.`;
  if (status === 'dispatched' || status === 'returned' || lines.some((l) => l.quantityDispatched > 0)) {
    return `Order ${number} has left the warehouse, so it can no longer be changed. You can send back what you do not need from the Returns page once it arrives.`;
  }
  if (status === 'picking' || status === 'packed' || lines.some((l) => l.quantityPicked > 0)) {
    return `The warehouse has started picking order ${number}, so it can no longer be changed or cancelled. You can send back what you do not need once it arrives.`;
  }
  if (status === 'pending_payment') {
    return kind === 'cancel' ? null : `The card payment of order ${number} is not confirmed yet: you can cancel the order now, or change it once the payment is confirmed.`;
  }
  return CHANGEABLE_STATUSES.includes(status) ? null : `Order ${number} cannot be changed now.`;
}

/**
 * Taking units off a line: units still waiting for stock go first (nothing is held for them), then units held on
 * the shelf, which go back to stock.
 */
export function reduceLine(line: { quantity: number; quantityBackordered: number }, newQuantity: number): { dropBackordered: number; release: number } {
  if (!Number.isInteger(newQuantity) || newQuantity < 0 || newQuantity > line.quantity) throw new RangeError(`quantity ${newQuantity} is not between 0 and ${line.quantity}`);
  const removed = line.quantity - newQuantity;
  const dropBackordered = Math.min(removed, line.quantityBackordered);
  return { dropBackordered, release: removed - dropBackordered };
}

export interface StoredLine {
  partNumber: string;
  quantity: number;
  /** The price the buyer was charged per unit (trade discount already taken off). */
  unitPriceCents: number;
  retailUnitPriceCents: number;
  coreDepositCents: number;
  weightGrams: number;
}

/**
 * The order's totals for the lines it has now, at the prices it was placed at: the same freight table and tax rule as
 * at checkout (shared/pricing.ts), so an unchanged order prices to what it was placed for.
 */
export function repriceOrder(lines: readonly StoredLine[], zone: DeliveryZone, taxRatePct: number) {
  const kept = lines.filter((l) => l.quantity > 0);
  const totals = priceOrder(
    kept.map((l) => ({ partNumber: l.partNumber, quantity: l.quantity, retailUnitCents: l.unitPriceCents, coreDepositCents: l.coreDepositCents, weightGrams: l.weightGrams })),
    { kind: 'retail' },
    zone,
    taxRatePct,
  );
  const retailGoodsCents = kept.reduce((s, l) => s + l.retailUnitPriceCents * l.quantity, 0);
  return {
    goodsCents: totals.goodsCents,
    discountCents: retailGoodsCents - totals.goodsCents,
    coreDepositCents: totals.coreDepositCents,
    freightCents: totals.freightCents,
    taxCents: totals.taxCents,
    totalCents: totals.totalCents,
    weightGrams: totals.weightGrams,
  };
}
