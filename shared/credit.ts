/**
 * A dealer's credit: which orders are open invoices, the open balance they add up to, whether a new order on
 * account fits under the credit limit, and when an invoice falls due. Pure: the order placement and the
 * dealer-accounts service read the orders and ask these.
 */
import { formatPrice } from './catalog';
import type { OrderStatus } from './schemas/orders';

/** Terms an invoice falls due by when the order recorded none. */
export const DEFAULT_PAYMENT_TERMS_DAYS = 30;

/** What the rule needs of an order. */
export type CreditOrder = {
  paymentMethod: 'card' | 'account';
  paymentState: string;
  status: OrderStatus;
  totalCents: number;
  refundedCents: number;
};

/** Cancelled and returned orders owe nothing, whatever their payment state says. */
const SETTLED_STATUSES: readonly OrderStatus[] = ['cancelled', 'returned'];

/** An order on account that has not been paid yet. */
export function isOpenInvoice(order: CreditOrder): boolean {
  return order.paymentMethod === 'account' && order.paymentState === 'on_account' && !SETTLED_STATUSES.includes(order.status);
}

/** What is still owed on an invoice: credit notes (refunds) come off the total. */
export function invoiceOpenCents(order: Pick<CreditOrder, 'totalCents' | 'refundedCents'>): number {
  return order.totalCents - order.refundedCents;
}

/** The sum of a dealer's open invoices; other orders are ignored, so all of a dealer's orders may be passed. */
export function openBalanceCents(orders: readonly CreditOrder[]): number {
  return orders.reduce((sum, o) => (isOpenInvoice(o) ? sum + invoiceOpenCents(o) : sum), 0);
}

/** What a dealer may still buy on account: the limit less the open balance, never below nothing. */
export function availableCreditCents(input: { openBalanceCents: number; creditLimitCents: number }): number {
  return Math.max(0, input.creditLimitCents - input.openBalanceCents);
}

export type CreditCheck = { fits: true; balanceAfterCents: number } | { fits: false; balanceAfterCents: number; message: string };

/** An order fits when the open balance with it stays at or under the limit; otherwise the buyer is told why. */
export function checkCredit(input: { openBalanceCents: number; orderCents: number; creditLimitCents: number }): CreditCheck {
  const after = input.openBalanceCents + input.orderCents;
  if (after <= input.creditLimitCents) return { fits: true, balanceAfterCents: after };
  return {
    fits: false,
    balanceAfterCents: after,
    message:
      `This order of ${formatPrice(input.orderCents)} would take your open balance from ${formatPrice(input.openBalanceCents)} ` +
      `to ${formatPrice(after)}, over your credit limit of ${formatPrice(input.creditLimitCents)} by ${formatPrice(after - input.creditLimitCents)}. Pay an open invoice, or pay this order by card.`,
  };
}

/**
 * The day an invoice falls due: the order's calendar day (UTC) plus its payment terms, as YYYY-MM-DD. Only the
 * date part of the timestamp is read, so the stored format with "T" or with a space both work.
 */
export function invoiceDueDate(createdAt: string, termsDays: number | null): string {
  const match = /^(\d{4})-(\d{2})-(\d{2})/.exec(createdAt);
  if (!match) throw new RangeError(`Not a date: ${createdAt}`);
  const [, y, m, d] = match;
  const due = new Date(Date.UTC(Number(y), Number(m) - 1, Number(d) + (termsDays ?? DEFAULT_PAYMENT_TERMS_DAYS)));
  return due.toISOString().slice(0, 10);
}
