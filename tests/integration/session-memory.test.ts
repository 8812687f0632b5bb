import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { dealerAccounts, user } from '../../server/db/schema';
import { createCustomer, createDealer } from '../support/factories';
import { clientOf } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * Signed-in requests are answered from a memory of recent sessions, and that memory forgets at once whatever the
 * database says has changed: a sign-out, a role, a ban, a trade account's terms.
 */
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ accounts: true });
}, 120_000);
afterAll(() => t?.close());

type Me = { user: null | { role: string; name: string; dealer: null | { creditLimitCents: number } } };
const me = async (client: { get: (p: string) => Promise<{ body: unknown }> }) => ((await client.get('/api/account/me')).body as Me).user;

describe('the memory of recent sessions', () => {
  it('reads a session once for many requests', async () => {
    const buyer = await createCustomer(t);
    const getSession = vi.spyOn(t.app.auth.api, 'getSession');
    for (let i = 0; i < 5; i++) expect((await me(buyer.client))?.name).toBe(buyer.name);
    expect(getSession.mock.calls.length).toBeLessThanOrEqual(1);
    getSession.mockRestore();
  });

  it('forgets a session signed out, even for a copy of its cookie', async () => {
    const buyer = await createCustomer(t);
    expect(await me(buyer.client)).not.toBeNull();
    const copy = clientOf(t, buyer.client.cookie().split('; '));
    expect(await me(copy)).not.toBeNull();
    expect((await buyer.client.send('POST', '/api/auth/sign-out', {})).status).toBe(200);
    expect(await me(copy)).toBeNull();
    expect((await copy.get('/api/orders')).status).toBe(401);
  });

  it('sees a role change and a ban on the next request', async () => {
    const buyer = await createCustomer(t);
    expect((await me(buyer.client))?.role).toBe('customer');
    t.db.update(user).set({ role: 'warehouse' }).where(eq(user.id, buyer.id)).run();
    expect((await me(buyer.client))?.role).toBe('warehouse');
    t.db.update(user).set({ banned: true }).where(eq(user.id, buyer.id)).run();
    expect(await me(buyer.client)).toBeNull();
  });

  it('sees a trade account’s new terms on the next request', async () => {
    const dealer = await createDealer(t, { creditLimitCents: 100_000 });
    expect((await me(dealer.client))?.dealer?.creditLimitCents).toBe(100_000);
    t.db.update(dealerAccounts).set({ creditLimitCents: 250_000 }).where(eq(dealerAccounts.id, dealer.dealerAccountId)).run();
    expect((await me(dealer.client))?.dealer?.creditLimitCents).toBe(250_000);
  });
});
