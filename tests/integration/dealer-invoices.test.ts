import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDealer, createUser } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let dealer: Client;
let admin: Client;
let dealerId: number;
beforeAll(async () => {
  t = await startTestApp();
  // Standard tier, $5,000.00 limit, 14-day terms: invented terms like the demo data's second dealer.
  const [account, office] = await Promise.all([createDealer(t, { tier: 'standard', creditLimitCents: 500_000, paymentTermsDays: 14 }), createUser(t, { role: 'admin' })]);
  [dealer, admin, dealerId] = [account.client, office.client, account.dealerAccountId];
});
afterAll(async () => {
  await t.close();
});

async function accountOrder(partNumber: string, quantity: number) {
  await dealer.send('POST', '/api/cart/lines', { partNumber, quantity });
  return dealer.send('POST', '/api/checkout', { method: 'account', purchaseOrder: `PO-${quantity}` });
}

describe('dealer invoices', () => {
  it('counts open invoices against the credit limit until the office records them paid', async () => {
    const turbo = t.db.$client
      .prepare("SELECT part_number FROM parts WHERE category = 'turbochargers' AND condition = 'new' AND available >= 2 AND price_cents BETWEEN 200000 AND 280000 ORDER BY price_cents LIMIT 1")
      .pluck()
      .get() as string;
    const first = await accountOrder(turbo, 2);
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    const number = (first.body as { order: { number: string } }).order.number;
    const refused = await accountOrder(turbo, 1);
    expect(refused.status).toBe(409);
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/credit limit of \$5,000\.00/);

    const open = await admin.get(`/api/admin/dealers/${dealerId}/invoices`);
    const items = (open.body as { items: Array<{ number: string; dueDate: string; termsDays: number; openCents: number }> }).items;
    const invoice = items.find((i) => i.number === number)!;
    expect(invoice.termsDays).toBe(14);
    const placed = new Date(t.db.$client.prepare('SELECT created_at FROM orders WHERE number = ?').pluck().get(number) as string);
    expect(invoice.dueDate).toBe(new Date(placed.getTime() + 14 * 86_400_000).toISOString().slice(0, 10));

    expect((await dealer.send('POST', `/api/admin/dealers/${dealerId}/invoices/${number}/paid`, { reference: 'BANK-1' })).status).toBe(403);
    expect((await admin.send('POST', `/api/admin/dealers/${dealerId}/invoices/${number}/paid`, { reference: '' })).status).toBe(400);
    expect((await admin.send('POST', `/api/admin/dealers/${dealerId}/invoices/${number}/paid`, { reference: 'BANK-20261201' })).status).toBe(200);
    expect((await admin.send('POST', `/api/admin/dealers/${dealerId}/invoices/${number}/paid`, { reference: 'BANK-20261201' })).status).toBe(409);

    const me = (await dealer.get('/api/account/me')).body as { user: { dealer: { openBalanceCents: number } } };
    expect(me.user.dealer.openBalanceCents).toBe(0);
    // The cart still holds the refused line; with the invoice paid it goes through.
    expect((await dealer.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-AGAIN' })).status).toBe(201);
    const timeline = (await dealer.get(`/api/orders/${number}`)).body as { timeline: Array<{ status: string; note: string | null }> };
    expect(timeline.timeline.at(-1)).toMatchObject({ status: 'invoice_paid', note: 'Payment received, reference BANK-20261201' });
  });
});
