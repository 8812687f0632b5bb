import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { availableCreditCents, checkCredit, invoiceDueDate, isOpenInvoice, openBalanceCents, type CreditOrder } from '../../shared/credit';
import { ORDER_STATUS_KEYS } from '../../shared/schemas/orders';

function createOrder(overrides: Partial<CreditOrder> = {}): CreditOrder {
  return { paymentMethod: 'account', paymentState: 'on_account', status: 'on_account', totalCents: 10_000, refundedCents: 0, ...overrides };
}

describe('open invoices', () => {
  it('are orders on account not yet paid, and not cancelled or returned', () => {
    expect(isOpenInvoice(createOrder())).toBe(true);
    expect(isOpenInvoice(createOrder({ status: 'dispatched' }))).toBe(true);
    expect(isOpenInvoice(createOrder({ paymentState: 'paid' }))).toBe(false);
    expect(isOpenInvoice(createOrder({ paymentMethod: 'card', paymentState: 'paid', status: 'paid' }))).toBe(false);
    expect(isOpenInvoice(createOrder({ status: 'cancelled' }))).toBe(false);
    expect(isOpenInvoice(createOrder({ status: 'returned' }))).toBe(false);
  });
});

describe('open balance', () => {
  it('adds what is still owed on each open invoice, credit notes taken off', () => {
    const orders = [
      createOrder({ totalCents: 250_000 }),
      createOrder({ totalCents: 120_000, refundedCents: 22_000 }),
      createOrder({ totalCents: 99_999, paymentState: 'paid' }),
      createOrder({ totalCents: 50_000, status: 'cancelled' }),
      createOrder({ paymentMethod: 'card', paymentState: 'paid', status: 'paid', totalCents: 70_000 }),
    ];
    expect(openBalanceCents(orders)).toBe(250_000 + 98_000);
    expect(openBalanceCents([])).toBe(0);
  });

  it('is the sum over the open invoices whatever else the list holds', () => {
    const order = fc.record({
      paymentMethod: fc.constantFrom('card' as const, 'account' as const),
      paymentState: fc.constantFrom('awaiting', 'paid', 'on_account', 'refunded'),
      status: fc.constantFrom(...ORDER_STATUS_KEYS),
      totalCents: fc.integer({ min: 0, max: 10_000_000 }),
      refundedCents: fc.integer({ min: 0, max: 1_000_000 }),
    });
    fc.assert(
      fc.property(fc.array(order, { maxLength: 30 }), (orders) => {
        const open = orders.filter(isOpenInvoice);
        return openBalanceCents(orders) === open.reduce((s, o) => s + o.totalCents - o.refundedCents, 0);
      }),
    );
  });
});

describe('credit check', () => {
  it('lets an order through up to the limit exactly', () => {
    expect(checkCredit({ openBalanceCents: 300_000, orderCents: 200_000, creditLimitCents: 500_000 })).toEqual({ fits: true, balanceAfterCents: 500_000 });
  });

  it('refuses one cent over, naming the amounts with thousands separators', () => {
    const check = checkCredit({ openBalanceCents: 300_000, orderCents: 200_001, creditLimitCents: 500_000 });
    expect(check.fits).toBe(false);
    if (check.fits) return;
    expect(check.balanceAfterCents).toBe(500_001);
    expect(check.message).toBe(
      'This order of $2,000.01 would take your open balance from $3,000.00 to $5,000.01, over your credit limit of $5,000.00 by $0.01. Pay an open invoice, or pay this order by card.',
    );
  });

  it('formats large balances with separators', () => {
    const check = checkCredit({ openBalanceCents: 21_000_000, orderCents: 859_017, creditLimitCents: 20_000_000 });
    expect(check.fits).toBe(false);
    if (!check.fits) expect(check.message).toContain('to $218,590.17, over your credit limit of $200,000.00 by $18,590.17');
  });

  it('refuses any order on account when the limit is zero', () => {
    expect(checkCredit({ openBalanceCents: 0, orderCents: 1, creditLimitCents: 0 }).fits).toBe(false);
  });
});

describe('available credit', () => {
  it('is the limit less the open balance', () => {
    expect(availableCreditCents({ openBalanceCents: 350_000, creditLimitCents: 1_000_000 })).toBe(650_000);
  });

  it('is nothing, not a negative amount, once the balance is over the limit', () => {
    expect(availableCreditCents({ openBalanceCents: 1_200_000, creditLimitCents: 1_000_000 })).toBe(0);
  });

  it('is the most an order may be and still pass the credit check', () => {
    fc.assert(
      fc.property(fc.nat(100_000_000), fc.nat(100_000_000), (openBalance, limit) => {
        const available = availableCreditCents({ openBalanceCents: openBalance, creditLimitCents: limit });
        if (available > 0) expect(checkCredit({ openBalanceCents: openBalance, orderCents: available, creditLimitCents: limit }).fits).toBe(true);
        expect(checkCredit({ openBalanceCents: openBalance, orderCents: available + 1, creditLimitCents: limit }).fits).toBe(false);
      }),
    );
  });
});

describe('invoice due date', () => {
  it('is the order day plus the payment terms, in UTC', () => {
    expect(invoiceDueDate('2026-11-20T23:59:59.999Z', 14)).toBe('2026-12-04');
    expect(invoiceDueDate('2026-12-20T08:00:00.000Z', 14)).toBe('2027-01-03');
    // 2028 is a leap year: 30 days after 10 February is 11 March.
    expect(invoiceDueDate('2028-02-10T12:00:00.000Z', 30)).toBe('2028-03-11');
  });

  it('takes 30 days when the order recorded no terms', () => {
    expect(invoiceDueDate('2026-01-15T10:00:00.000Z', null)).toBe('2026-02-14');
  });

  it('reads the date part whether the timestamp has a T or a space', () => {
    expect(invoiceDueDate('2026-03-01 09:30:00', 7)).toBe('2026-03-08');
  });

  it('refuses a value that is not a date', () => {
    expect(() => invoiceDueDate('soon', 30)).toThrow(RangeError);
  });
});
