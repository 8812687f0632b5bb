import { expect, type APIRequestContext } from '@playwright/test';
import { DEMO_EMAILS, DEMO_PASSWORD, type Role } from '../fixtures';
import { emptyCart } from './cart';
import { receiveStock } from './stock';

type NewContext = (options: { baseURL: string }) => Promise<APIRequestContext>;

const DELIVERY = { name: 'Robin Ashdown', line1: '5 Gasket Row', city: 'Emberleigh', postcode: 'EM2 7RD', zone: 'local' };

async function signedIn(newContext: NewContext, baseURL: string, role: Role) {
  const ctx = await newContext({ baseURL });
  const res = await ctx.post('/api/auth/sign-in/email', { data: { email: DEMO_EMAILS[role], password: DEMO_PASSWORD }, headers: { origin: new URL(baseURL).origin } });
  expect(res.ok(), `sign-in as ${role}`).toBe(true);
  return ctx;
}

/**
 * A complete turbocharger bought by `role` (card for a retail buyer, on account for a dealer), picked and packed as the
 * Floor does, so it has a serial. The part is stocked up first and the buyer's cart emptied, so the shared journey
 * database stays usable; the buyer's cart is empty again after.
 */
export async function packedUnit(newContext: NewContext, baseURL: string, role: Role): Promise<{ orderNumber: string; serial: string; partNumber: string }> {
  const origin = new URL(baseURL).origin;
  const headers = { origin };
  const buyer = await signedIn(newContext, baseURL, role);
  const floor = await signedIn(newContext, baseURL, 'warehouse');
  try {
    // A mid-size frame, so the journey's invented engine (3 litres, 600 hp) runs on it sensibly.
    const parts = (await (await buyer.get('/api/parts?category=turbochargers&frame=GIM&limit=40')).json()) as { items: Array<{ partNumber: string; condition: string }> };
    const part = parts.items.find((p) => p.condition === 'new');
    if (!part) throw new Error('no new turbocharger in the catalogue');
    await receiveStock(newContext, baseURL, [part.partNumber], 3);
    await emptyCart(buyer, origin);
    expect((await buyer.post('/api/cart/lines', { data: { partNumber: part.partNumber, quantity: 1 }, headers })).ok()).toBe(true);
    const body = role === 'retail' ? { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY } : { method: 'account', purchaseOrder: `UNIT-${Date.now() % 100_000}` };
    const checkout = await buyer.post('/api/checkout', { data: body, headers });
    expect(checkout.ok(), await checkout.text()).toBe(true);
    const orderNumber = ((await checkout.json()) as { order: { number: string } }).order.number;
    // A card payment is confirmed by the provider's webhook; the Floor picks once it is paid.
    await expect.poll(async () => ((await (await buyer.get(`/api/orders/${orderNumber}`)).json()) as { status: string }).status, { timeout: 15_000 }).not.toBe('pending_payment');
    const list = (await (await floor.get(`/api/warehouse/orders/${orderNumber}/pick-list`)).json()) as { lines: Array<{ lineId: number; partNumber: string; toPick: number }> };
    for (const l of list.lines) {
      const pick = await floor.post(`/api/warehouse/orders/${orderNumber}/picks`, { data: { lineId: l.lineId, scannedPartNumber: l.partNumber, quantity: l.toPick }, headers });
      expect(pick.ok(), await pick.text()).toBe(true);
    }
    const pack = await floor.post(`/api/warehouse/orders/${orderNumber}/pack`, { data: { cartons: 1, weightKg: 22 }, headers });
    expect(pack.ok(), await pack.text()).toBe(true);
    const order = (await (await buyer.get(`/api/orders/${orderNumber}`)).json()) as { lines: Array<{ serials: string[] }> };
    const serial = order.lines[0]?.serials[0];
    if (!serial) throw new Error(`no serial on ${orderNumber}`);
    return { orderNumber, serial, partNumber: part.partNumber };
  } finally {
    await buyer.dispose();
    await floor.dispose();
  }
}
