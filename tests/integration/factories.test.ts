import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MeSchema } from '../../shared/schemas/accounts';
import { createCustomer, createDealer, createOrder, createPart, createUser } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ fakes: true });
}, 60_000);
afterAll(async () => {
  await t.close();
});

const me = async (c: { get: (p: string) => Promise<{ body: unknown }> }) => MeSchema.parse((await c.get('/api/account/me')).body).user;
const one = <T>(q: string, ...p: unknown[]) => t.db.$client.prepare(q).get(...p) as T;

describe('test factories', () => {
  it('make users that are new each time, signed in with the role asked for', async () => {
    const [a, b, floor] = await Promise.all([createCustomer(t), createCustomer(t), createUser(t, { role: 'warehouse' })]);
    expect(a.email).not.toBe(b.email);
    expect(await me(a.client)).toMatchObject({ id: a.id, email: a.email, role: 'customer', dealer: null });
    expect(await me(floor.client)).toMatchObject({ email: floor.email, role: 'warehouse' });
    expect((await floor.client.get('/api/warehouse/pick-queue')).status).toBe(200);
    expect((await a.client.get('/api/warehouse/pick-queue')).status).toBe(403);
  });

  it('make dealers with their own trade account and terms, or a pending application', async () => {
    const dealer = await createDealer(t, { tier: 'partner', creditLimitCents: 300_000, paymentTermsDays: 14 });
    expect(await me(dealer.client)).toMatchObject({
      role: 'dealer',
      dealer: { id: dealer.dealerAccountId, companyName: dealer.companyName, status: 'approved', tier: 'partner', creditLimitCents: 300_000, paymentTermsDays: 14, openBalanceCents: 0 },
    });
    const other = await createDealer(t);
    expect(other.dealerAccountId).not.toBe(dealer.dealerAccountId);
    const applicant = await createDealer(t, { status: 'pending' });
    expect(await me(applicant.client)).toMatchObject({ role: 'customer', dealer: { status: 'pending', tier: null } });
  });

  it('make parts of their own, stocked through the ledger and found in the catalogue', async () => {
    const part = createPart(t, { stock: 7, priceCents: 4_250 });
    const again = createPart(t);
    expect(again.partNumber).not.toBe(part.partNumber);
    expect(one<{ available: number; price: number }>('SELECT available, price_cents AS price FROM parts WHERE id = ?', part.id)).toEqual({ available: 7, price: 4_250 });
    expect(one<{ n: number }>("SELECT SUM(on_hand_delta) AS n FROM stock_movements WHERE part_id = ? AND kind = 'goods-in'", part.id).n).toBe(7);
    expect((await t.get(`/api/parts/${part.partNumber}`)).status).toBe(200);
    const core = createPart(t, { condition: 'exchange', stock: 1 });
    expect(core.partNumber).toMatch(/-XCH$/);
  });

  it('place orders through checkout: on account for a dealer, by card for anyone else', async () => {
    const part = createPart(t, { stock: 5 });
    const dealer = await createDealer(t);
    const onAccount = await createOrder(dealer, [{ partNumber: part.partNumber, quantity: 2 }]);
    expect(onAccount.order.status).toBe('on_account');
    expect(one<{ available: number }>('SELECT available FROM parts WHERE id = ?', part.id).available).toBe(3);
    expect((await me(dealer.client))?.dealer).toMatchObject({ openBalanceCents: onAccount.order.totalCents });

    const buyer = await createCustomer(t);
    const byCard = await createOrder(buyer, [{ partNumber: part.partNumber, quantity: 1 }]);
    // The provider answers the one create-and-confirm call with a success: the order is paid at checkout.
    expect(byCard.order.status).toBe('paid');
    await expect(createOrder(buyer, [{ partNumber: part.partNumber, quantity: 9 }])).rejects.toThrow(/checkout for .*: 409/);
  });
});
