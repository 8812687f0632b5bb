import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { paymentsClient } from '../support/app-deps';
import { createCustomer } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let clock = Date.now();
beforeAll(async () => {
  t = await startTestApp({ fakes: true, deps: { now: () => new Date(clock) } });
});
afterAll(async () => {
  await t.close();
});

const availableOf = (partNumber: string) => t.db.$client.prepare('SELECT available FROM parts WHERE part_number = ?').pluck().get(partNumber) as number;

describe('unpaid card orders', () => {
  it('give their stock back and cancel the payment once they are too old, and leave fresh ones alone', async () => {
    const { client: buyer } = await createCustomer(t);
    const part = 'BUR-50-0201';
    const before = availableOf(part);
    await buyer.send('POST', '/api/cart/lines', { partNumber: part, quantity: 2 });
    const res = await buyer.send('POST', '/api/checkout', {
      method: 'card',
      paymentMethod: 'pm_card_authenticationRequired',
      delivery: { name: 'Robin Ashdown', line1: '1 Test Street', city: 'Quenchfold', postcode: 'QF1 1AA', zone: 'local' },
    });
    expect(res.status).toBe(201);
    const { order, nextAction } = res.body as { order: { number: string }; nextAction: { paymentIntentId: string } };
    expect(availableOf(part)).toBe(before - 2);

    expect(await t.app.orders.expireUnpaid(30)).toBe(0);
    clock += 31 * 60_000;
    expect(await t.app.orders.expireUnpaid(30)).toBe(1);

    const detail = (await buyer.get(`/api/orders/${order.number}`)).body as { status: string; timeline: Array<{ status: string; note: string | null }> };
    expect(detail.status).toBe('cancelled');
    expect(detail.timeline.at(-1)?.note).toMatch(/Not paid within 30 minutes/);
    expect(availableOf(part)).toBe(before);
    const intent = await paymentsClient(t.payments!.port).paymentIntents.retrieve(nextAction.paymentIntentId);
    expect(intent.status).toBe('canceled');
    // The lines are back in the cart to try again.
    const cart = (await buyer.get('/api/cart')).body as { lines: Array<{ partNumber: string; quantity: number }> };
    expect(cart.lines).toContainEqual(expect.objectContaining({ partNumber: part, quantity: 2 }));
  });
});
