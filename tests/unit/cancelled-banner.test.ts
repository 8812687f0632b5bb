import { describe, expect, it } from 'vitest';
import type { OrderDetail } from '../../shared/schemas/orders';
import { cancelledBanner } from '../../src/features/orders/lib/cancelled-banner';

type Order = Parameters<typeof cancelledBanner>[0];
const line = (partNumber: string, quantity: number) => ({ partNumber, quantity }) as OrderDetail['lines'][number];
const createOrder = (overrides: Partial<Order> = {}): Order => ({
  status: 'cancelled',
  paymentState: 'failed',
  lines: [line('CHS-10-0201', 2), line('FLG-50-0201', 1)],
  timeline: [
    { status: 'placed', note: null, at: '2025-03-04T10:00:00.000Z' },
    { status: 'cancelled', note: 'Your card was declined.', at: '2025-03-04T10:00:05.000Z' },
  ],
  ...overrides,
});

describe('the cancelled card order banner', () => {
  it('says when and why the order was cancelled', () => {
    const b = cancelledBanner(createOrder(), undefined);
    expect(b).toEqual({ at: '2025-03-04T10:00:05.000Z', reason: 'Your card was declined.', cart: 'unknown' });
  });

  it('says the parts are in the cart only while the cart holds every line at its quantity', () => {
    expect(cancelledBanner(createOrder(), [{ partNumber: 'FLG-50-0201', quantity: 1 }, { partNumber: 'CHS-10-0201', quantity: 3 }])?.cart).toBe('still-there');
    expect(cancelledBanner(createOrder(), [{ partNumber: 'CHS-10-0201', quantity: 2 }])?.cart).toBe('changed');
    expect(cancelledBanner(createOrder(), [{ partNumber: 'CHS-10-0201', quantity: 1 }, { partNumber: 'FLG-50-0201', quantity: 1 }])?.cart).toBe('changed');
    expect(cancelledBanner(createOrder(), [])?.cart).toBe('changed');
  });

  it('is only for card orders cancelled because the payment failed', () => {
    expect(cancelledBanner(createOrder({ status: 'paid', paymentState: 'paid' }), [])).toBeNull();
    expect(cancelledBanner(createOrder({ paymentState: 'refunded' }), [])).toBeNull();
  });
});
