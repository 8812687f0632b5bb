import type { OrderDetail } from '../../../../shared/schemas/orders';

/** What the buyer's cart holds now, by part number (the order page does not read the cart itself). */
export type CartHolding = ReadonlyArray<{ partNumber: string; quantity: number }>;

export interface CancelledBanner {
  /** When the order was cancelled, from its timeline (null for an old order without the event). */
  at: string | null;
  /** Why, as recorded at the time (the card provider's words or the unpaid-order timeout). */
  reason: string | null;
  /** Where the parts are now: still in the cart, the cart changed since, or the cart is not known yet. */
  cart: 'still-there' | 'changed' | 'unknown';
}

/**
 * The truth about a card order cancelled for non-payment. Its lines went back into the cart when it was cancelled;
 * whether they are still there is a question for today's cart, not for the order.
 */
export function cancelledBanner(order: Pick<OrderDetail, 'status' | 'paymentState' | 'lines' | 'timeline'>, cart: CartHolding | undefined): CancelledBanner | null {
  if (order.status !== 'cancelled' || order.paymentState !== 'failed') return null;
  const event = [...order.timeline].reverse().find((e) => e.status === 'cancelled');
  let state: CancelledBanner['cart'] = 'unknown';
  if (cart) {
    const held = new Map<string, number>();
    for (const l of cart) held.set(l.partNumber, (held.get(l.partNumber) ?? 0) + l.quantity);
    state = order.lines.every((l) => (held.get(l.partNumber) ?? 0) >= l.quantity) ? 'still-there' : 'changed';
  }
  return { at: event?.at ?? null, reason: event?.note ?? null, cart: state };
}
