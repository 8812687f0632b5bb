import type { CartLineView, CartView } from '../../../../shared/schemas/orders';
import { QUANTITY_MAX } from '../../../../shared/order-limits';

/** Units of a line that stock cannot cover now: what a dealer may back-order, or a buyer must take off. */
export const shortBy = (line: Pick<CartLineView, 'quantity' | 'available'>): number => Math.max(0, line.quantity - line.available);

/** Lines that cannot be ordered as they stand: short of stock with no back-order allowed. */
export function blockedLines(cart: CartView): CartLineView[] {
  const dealer = cart.buyer.kind === 'dealer';
  return cart.lines.filter((l) => shortBy(l) > 0 && !(dealer && l.allowBackorder));
}

/** A typed quantity, or null when it is not a whole number from 1 to the cart's most per line. */
export function readQuantity(text: string): number | null {
  const n = Number(text.trim());
  return text.trim() !== '' && Number.isInteger(n) && n >= 1 && n <= QUANTITY_MAX ? n : null;
}

/** One step of the − / + buttons, held between 1 and the most per line. */
export const stepQuantity = (value: number, delta: number): number => Math.min(QUANTITY_MAX, Math.max(1, value + delta));
