import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CartViewSchema, CheckoutResponseSchema, ImportPreviewSchema, OrderDetailSchema, type CartView } from '../../shared/schemas/orders';
import { paymentsClient, TEST_WEBHOOK_SECRET } from '../support/app-deps';
import { createCustomer, createDealer, createUser, type DealerOverrides, type TestUser } from '../support/factories';
import { setAvailable as setStock } from '../support/stock';
import { startTestApp, type TestApp } from '../support/test-app';

// Demo catalogue parts (catalog-seed): a new AWL turbocharger, its exchange unit, a gasket, and a superseded number.
const TURBO = 'AWL-10-0201';
const EXCHANGE = 'AWL-10-0201-XCH';
const GASKET = 'FLG-50-0201';
const SUPERSEDED = 'AWL-10-0103';
const SUPERSEDED_BY = 'AWL-10-0203';

const DELIVERY = { name: 'Robin Ashdown', line1: '5 Gauge Street', city: 'Emberleigh', postcode: 'EM1 1AA', zone: 'national' } as const;

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ fakes: true });
}, 60_000);
afterAll(async () => {
  await t.close();
});

interface Reply {
  status: number;
  body: unknown;
}

/** A browser-like client: keeps its cookies and sends the app's own Origin; given a user, it starts signed in as them. */
function client(signedIn?: TestUser) {
  const jar = new Map<string, string>();
  for (const pair of signedIn?.client.cookie().split('; ').filter(Boolean) ?? []) {
    const i = pair.indexOf('=');
    jar.set(pair.slice(0, i), pair.slice(i + 1));
  }
  async function call(method: string, path: string, body?: unknown, extra: { form?: FormData; headers?: Record<string, string> } = {}): Promise<Reply> {
    const headers: Record<string, string> = { origin: t.url, ...extra.headers };
    if (jar.size) headers.cookie = [...jar].map(([k, v]) => `${k}=${v}`).join('; ');
    let payload: BodyInit | undefined;
    if (extra.form) payload = extra.form;
    else if (body !== undefined) {
      headers['content-type'] = 'application/json';
      payload = JSON.stringify(body);
    }
    const res = await fetch(`${t.url}${path}`, { method, headers, body: payload });
    for (const c of res.headers.getSetCookie()) {
      const pair = c.split(';')[0]!;
      const i = pair.indexOf('=');
      const name = pair.slice(0, i);
      const value = pair.slice(i + 1);
      if (!value || /max-age=0|expires=thu, 01 jan 1970/i.test(c)) jar.delete(name);
      else jar.set(name, value);
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON */
    }
    return { status: res.status, body: parsed };
  }
  return {
    call,
    async cart(): Promise<CartView> {
      const r = await call('GET', '/api/cart');
      expect(r.status).toBe(200);
      return CartViewSchema.parse(r.body);
    },
    async add(partNumber: string, quantity: number, more: Record<string, unknown> = {}): Promise<CartView> {
      const r = await call('POST', '/api/cart/lines', { partNumber, quantity, ...more });
      expect(r.status, JSON.stringify(r.body)).toBe(201);
      return CartViewSchema.parse(r.body);
    },
  };
}

// Each test buys as users of its own, so no cart, order or open balance carries over from another test.
const asCustomer = async () => client(await createCustomer(t));
const asDealer = async (overrides: DealerOverrides = {}) => client(await createDealer(t, overrides));
const asWarehouse = async () => client(await createUser(t, { role: 'warehouse' }));

async function freshCustomer() {
  const buyer = await createCustomer(t);
  return { c: client(buyer), email: buyer.email };
}

const sql = <T>(query: string, ...params: unknown[]) => t.db.$client.prepare(query).all(...params) as T[];
const one = <T>(query: string, ...params: unknown[]) => t.db.$client.prepare(query).get(...params) as T;
const available = (partNumber: string) =>
  one<{ n: number }>('SELECT COALESCE(SUM(s.on_hand - s.reserved), 0) AS n FROM stock s JOIN parts p ON p.id = s.part_id WHERE p.part_number = ?', partNumber).n;
const orderRow = (number: string) => one<{ id: number; status: string; payment_state: string; payment_intent_id: string | null; total_cents: number }>('SELECT * FROM orders WHERE number = ?', number);

const setAvailable = (partNumber: string, n: number) => setStock(t, partNumber, n);

async function waitForStatus(c: ReturnType<typeof client>, number: string, status: string) {
  for (let i = 0; i < 100; i++) {
    const r = await c.call('GET', `/api/orders/${number}`);
    if ((r.body as { status?: string }).status === status) return OrderDetailSchema.parse(r.body);
    await new Promise((res) => setTimeout(res, 50));
  }
  throw new Error(`order ${number} never became ${status}`);
}

describe('pricing per role and tier', () => {
  it('charges retail to guests and customers and the tier price to dealers', async () => {
    // The catalogue's list price for the part, checked so the hand-worked figures below stay true.
    expect(one<{ p: number }>('SELECT price_cents AS p FROM parts WHERE part_number = ?', TURBO).p).toBe(63_999);

    const guest = client();
    expect((await guest.add(TURBO, 1)).lines[0]).toMatchObject({ unitCents: 63_999, retailUnitCents: 63_999 });

    const retail = await asCustomer();
    const r = await retail.add(TURBO, 2);
    expect(r.buyer).toEqual({ kind: 'retail', tier: null, discountPct: 0 });
    expect(r.lines[0]).toMatchObject({ unitCents: 63_999, lineCents: 127_998 });
    expect(r.totals.discountCents).toBe(0);

    // Trade price = list less the tier's discount, rounded to the cent (common practice). By hand:
    // preferred 15%: 639.99 × 0.85 = 543.9915 → 543.99; standard 10%: 639.99 × 0.90 = 575.991 → 575.99.
    const preferred = await asDealer({ tier: 'preferred' });
    const p = await preferred.add(TURBO, 2);
    expect(p.buyer).toEqual({ kind: 'dealer', tier: 'preferred', discountPct: 15 });
    expect(p.lines[0]).toMatchObject({ unitCents: 54_399, retailUnitCents: 63_999, lineCents: 108_798 });
    expect(p.totals).toMatchObject({ retailGoodsCents: 127_998, goodsCents: 108_798, discountCents: 19_200 });

    const standard = await asDealer({ tier: 'standard' });
    const s = await standard.add(TURBO, 1);
    expect(s.buyer).toEqual({ kind: 'dealer', tier: 'standard', discountPct: 10 });
    expect(s.lines[0]).toMatchObject({ unitCents: 57_599 });
  });

  it('ignores prices and totals sent by the client', async () => {
    const dealer = await asDealer({ tier: 'preferred' });
    const added = await dealer.add(GASKET, 3, { unitCents: 1, priceCents: 1, lineCents: 1, retailUnitCents: 1 });
    expect(added.lines[0]!.unitCents).toBe(1_189); // 13.99 × 0.85 = 11.8915 → 11.89
    const res = await dealer.call('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-TAMPER', totalCents: 1, goodsCents: 1, lines: [{ partNumber: GASKET, unitCents: 1 }] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const { order } = CheckoutResponseSchema.parse(res.body);
    expect(order.totalCents).toBe(added.totals.totalCents);
    const stored = one<{ unit_price_cents: number }>('SELECT l.unit_price_cents FROM order_lines l JOIN orders o ON o.id = l.order_id WHERE o.number = ?', order.number);
    expect(stored.unit_price_cents).toBe(1_189);
  });

  it('adds a core deposit for exchange units, untaxed, on top of the goods', async () => {
    const retail = await asCustomer();
    const deposit = one<{ d: number }>('SELECT core_deposit_cents AS d FROM parts WHERE part_number = ?', EXCHANGE).d;
    expect(deposit).toBe(14_000);
    const cart = await retail.add(EXCHANGE, 1);
    const line = cart.lines[0]!;
    expect(line).toMatchObject({ condition: 'exchange', coreDepositCents: 14_000 });
    const t8 = cart.totals;
    expect(t8.coreDepositCents).toBe(14_000);
    // Tax at 8% on goods and freight only: a refundable deposit is not a sale (the distributor's rule).
    expect(t8.taxCents).toBe(Math.round((t8.goodsCents + t8.freightCents) * 0.08));
    expect(t8.totalCents).toBe(t8.goodsCents + t8.coreDepositCents + t8.freightCents + t8.taxCents);
  });

  it('prices freight by weight band and delivery zone', async () => {
    const retail = await asCustomer();
    expect(one<{ w: number }>('SELECT weight_grams AS w FROM parts WHERE part_number = ?', TURBO).w).toBe(4_500);
    await retail.add(TURBO, 1);
    // Our published rate card (shared/pricing.ts, invented): 1–5 kg band is 11.95 local, 16.95 national, 32.95 remote.
    const byZone: Record<string, number> = {};
    for (const zone of ['local', 'national', 'remote']) {
      const r = await retail.call('PUT', '/api/cart/delivery-zone', { zone });
      byZone[zone] = CartViewSchema.parse(r.body).totals.freightCents;
    }
    expect(byZone).toEqual({ local: 1_195, national: 1_695, remote: 3_295 });
    // 12 × 4.5 kg = 54 kg: the 30–50 kg rate plus one further 10 kg step; remote 134.95 + 26.00, national 69.95 + 14.00.
    const cart = await retail.call('PATCH', `/api/cart/lines/${(await retail.cart()).lines[0]!.id}`, { quantity: 12 });
    expect(CartViewSchema.parse(cart.body).totals.freightCents).toBe(13_495 + 2_600);
    await retail.call('PUT', '/api/cart/delivery-zone', { zone: 'national' });
    expect((await retail.cart()).totals.freightCents).toBe(6_995 + 1_400);
    const bad = await retail.call('PUT', '/api/cart/delivery-zone', { zone: 'moon' });
    expect(bad.status).toBe(400);
  });
});

describe('freight zone at checkout', () => {
  const freightOf = (number: string) => one<{ f: number; z: string }>('SELECT freight_cents AS f, delivery_zone AS z FROM orders WHERE number = ?', number);

  it('comes from the delivery postcode for a retail buyer, whatever zone the client sends', async () => {
    setAvailable(TURBO, 20);
    const retail = await asCustomer();
    await retail.add(TURBO, 1);
    // The buyer sets the cheapest zone on the cart and sends it with the order, but the address is in a remote area.
    await retail.call('PUT', '/api/cart/delivery-zone', { zone: 'local' });
    const res = await retail.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: { ...DELIVERY, postcode: 'PF1 8LD', zone: 'local' } });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    // 4.5 kg in the 1–5 kg band: 32.95 remote (shared/pricing.ts, invented rate card).
    expect(freightOf(CheckoutResponseSchema.parse(res.body).order.number)).toEqual({ f: 3_295, z: 'remote' });
  });

  it('comes from the trade account for a dealer, to the account address or another', async () => {
    setAvailable(TURBO, 20);
    const dealer = await asDealer({ deliveryZone: 'remote' });
    await dealer.add(TURBO, 1);
    await dealer.call('PUT', '/api/cart/delivery-zone', { zone: 'local' });
    expect((await dealer.cart()).totals.freightCents).toBe(3_295);
    const own = await dealer.call('POST', '/api/checkout', { method: 'account', purchaseOrder: 'ZONE-1' });
    expect(own.status, JSON.stringify(own.body)).toBe(201);
    expect(freightOf(CheckoutResponseSchema.parse(own.body).order.number)).toEqual({ f: 3_295, z: 'remote' });
    await dealer.add(TURBO, 1);
    const other = await dealer.call('POST', '/api/checkout', { method: 'account', purchaseOrder: 'ZONE-2', delivery: { ...DELIVERY, zone: 'local' } });
    expect(other.status, JSON.stringify(other.body)).toBe(201);
    expect(freightOf(CheckoutResponseSchema.parse(other.body).order.number)).toEqual({ f: 3_295, z: 'remote' });
  });
});

describe('checkout on account', () => {
  it('refuses an order that would take the dealer over the credit limit', async () => {
    // Standard tier with a $5,000.00 limit, like the demo data's second dealer (invented terms).
    const dealer2 = await asDealer({ tier: 'standard', creditLimitCents: 500_000 });
    setAvailable(TURBO, 10);
    const before = available(TURBO);
    const cart = await dealer2.add(TURBO, 9); // 9 × 575.99 alone is 5,183.91: over the 5,000.00 limit
    expect(cart.totals.totalCents).toBeGreaterThan(500_000);
    const res = await dealer2.call('POST', '/api/checkout', { method: 'account', purchaseOrder: 'QME-1' });
    expect(res.status).toBe(409);
    expect((res.body as { error: { message: string } }).error.message).toMatch(/over your credit limit of \$5,000\.00/);
    expect(available(TURBO)).toBe(before);
    expect((await dealer2.cart()).lines).toHaveLength(1);
    expect(sql('SELECT 1 FROM orders WHERE purchase_order = ?', 'QME-1')).toHaveLength(0);
  });

  it('needs a trade account and a purchase-order number', async () => {
    const retail = await asCustomer();
    await retail.add(GASKET, 1);
    expect((await retail.call('POST', '/api/checkout', { method: 'account', purchaseOrder: 'X1' })).status).toBe(403);
    const dealer = await asDealer();
    await dealer.add(GASKET, 1);
    const missing = await dealer.call('POST', '/api/checkout', { method: 'account', purchaseOrder: '' });
    expect(missing.status).toBe(400);
    expect((missing.body as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors.purchaseOrder).toBeDefined();
  });
});

describe('checkout by card', () => {
  it('a declined card cancels the order, releases the stock, restores the cart and mails the buyer', async () => {
    const { c, email } = await freshCustomer();
    const before = available(TURBO);
    await c.add(TURBO, 2);
    const res = await c.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_chargeDeclined', delivery: DELIVERY });
    expect(res.status).toBe(402);
    expect((res.body as { error: { message: string } }).error.message).toMatch(/declined.*No payment was taken/);
    const orders = sql<{ number: string; status: string; payment_state: string }>('SELECT o.number, o.status, o.payment_state FROM orders o JOIN user u ON u.id = o.user_id WHERE u.email = ?', email);
    expect(orders).toEqual([expect.objectContaining({ status: 'cancelled', payment_state: 'failed' })]);
    expect(available(TURBO)).toBe(before);
    expect((await c.cart()).lines.map((l) => [l.partNumber, l.quantity])).toEqual([[TURBO, 2]]);
    const mail = await t.mail!.waitForMessage((m) => m.to.includes(email) && m.subject.includes('did not go through'), 5_000);
    expect(mail.text).toContain(orders[0]!.number);
    await t.payments!.waitForWebhooks();
    expect(orderRow(orders[0]!.number).status).toBe('cancelled');
  });

  it('a declined card gives the lines back with the fitment check they were bought for', async () => {
    const { c } = await freshCustomer();
    const saved = await c.call('POST', '/api/fitments', {
      name: 'shop car',
      input: { displacementL: 0.5, powerHp: 100, rpm: 9000, fuel: 'petrol', application: 'street' },
    });
    expect(saved.status).toBe(201);
    const fitmentId = (saved.body as { id: number }).id;
    expect((await c.call('POST', '/api/cart/lines', { partNumber: TURBO, quantity: 1, fitmentId })).status).toBe(201);
    const res = await c.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_chargeDeclined', delivery: DELIVERY });
    expect(res.status).toBe(402);
    const [line] = (await c.cart()).lines;
    expect(line).toMatchObject({ partNumber: TURBO, quantity: 1, fitment: { id: fitmentId, name: 'shop car' } });
  });

  it('pays at checkout on the provider’s own answer; its success event, ten times over, writes nothing', async () => {
    const { c, email } = await freshCustomer();
    await c.add(GASKET, 1);
    const res = await c.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY, totalCents: 1 });
    expect(res.status).toBe(201);
    const { order, outcome } = CheckoutResponseSchema.parse(res.body);
    expect(order.status).toBe('paid');
    expect(outcome).toBe('confirmed');
    const { id, payment_intent_id: intent } = orderRow(order.number);
    expect(intent).toMatch(/^pi_/);
    const succeeded = t.payments!.events().find((e) => e.event.type === 'payment_intent.succeeded' && (e.event.data.object as { id: string }).id === intent)!;
    expect(succeeded).toBeDefined();
    await t.payments!.waitForWebhooks();
    for (let i = 0; i < 9; i++) expect((await t.payments!.resendEvent(succeeded.event.id)).status).toBe(200);
    await t.payments!.waitForWebhooks();
    await t.mailSettled();
    expect(sql("SELECT 1 FROM order_events WHERE order_id = ? AND status = 'paid'", id)).toHaveLength(1);
    // Nothing to apply for an order already paid: the event is answered without a write.
    expect(sql('SELECT 1 FROM payment_events WHERE event_id = ?', succeeded.event.id)).toHaveLength(0);
    const confirmations = (await t.mail!.messages()).filter((m) => m.to.includes(email) && m.subject.includes(`Order ${order.number} confirmed`));
    expect(confirmations).toHaveLength(1);
  });

  it('an order still awaiting its payment is paid by the webhook; the same event ten times changes it once', async () => {
    const { c, email } = await freshCustomer();
    await c.add(GASKET, 1);
    const res = await c.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_authenticationRequired', delivery: DELIVERY });
    expect(res.status).toBe(201);
    const placed = CheckoutResponseSchema.parse(res.body);
    expect(placed.order.status).toBe('pending_payment');
    const intent = placed.nextAction!.paymentIntentId;
    t.payments!.authenticate(intent, 'succeed');
    await waitForStatus(c, placed.order.number, 'paid');
    const succeeded = t.payments!.events().find((e) => e.event.type === 'payment_intent.succeeded' && (e.event.data.object as { id: string }).id === intent)!;
    for (let i = 0; i < 9; i++) expect((await t.payments!.resendEvent(succeeded.event.id)).status).toBe(200);
    await t.payments!.waitForWebhooks();
    await t.mailSettled();
    const { id } = orderRow(placed.order.number);
    expect(sql("SELECT 1 FROM order_events WHERE order_id = ? AND status = 'paid'", id)).toHaveLength(1);
    expect(sql('SELECT 1 FROM payment_events WHERE event_id = ?', succeeded.event.id)).toHaveLength(1);
    const confirmations = (await t.mail!.messages()).filter((m) => m.to.includes(email) && m.subject.includes(`Order ${placed.order.number} confirmed`));
    expect(confirmations).toHaveLength(1);
  });

  it('takes a card payment in one call to the provider (created and confirmed together)', async () => {
    const { c } = await freshCustomer();
    await c.add(GASKET, 1);
    const { order } = CheckoutResponseSchema.parse((await c.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY })).body);
    await waitForStatus(c, order.number, 'paid');
    const intent = orderRow(order.number).payment_intent_id!;
    const events = t.payments!.events().filter((e) => (e.event.data.object as { id: string }).id === intent);
    expect(events.map((e) => e.event.type)).toEqual(expect.arrayContaining(['payment_intent.created', 'payment_intent.succeeded']));
    // Every event of the payment came from one API request, made with the order's key.
    expect(new Set(events.map((e) => e.event.request.id)).size).toBe(1);
    expect(events[0]!.event.request.idempotency_key).toBe(`order-${order.number}-intent`);
  });

  it('a card declined in the one payment call is cancelled at the provider before the order', async () => {
    const { c, email } = await freshCustomer();
    await c.add(GASKET, 1);
    const res = await c.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_chargeDeclined', delivery: DELIVERY });
    expect(res.status).toBe(402);
    const [row] = sql<{ status: string; intent: string | null }>('SELECT o.status, o.payment_intent_id AS intent FROM orders o JOIN user u ON u.id = o.user_id WHERE u.email = ?', email);
    expect(row).toMatchObject({ status: 'cancelled', intent: expect.stringMatching(/^pi_/) });
    const held = await paymentsClient(t.payments!.port).paymentIntents.retrieve(row!.intent!);
    expect(held).toMatchObject({ status: 'canceled', amount_received: 0 });
  });

  it('a late payment_failed after succeeded never downgrades a paid order', async () => {
    const { c } = await freshCustomer();
    await c.add(GASKET, 1);
    const { order } = CheckoutResponseSchema.parse((await c.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY })).body);
    await waitForStatus(c, order.number, 'paid');
    const intent = orderRow(order.number).payment_intent_id!;
    const payload = JSON.stringify({
      id: `evt_late_failure_${order.number}`,
      object: 'event',
      type: 'payment_intent.payment_failed',
      api_version: '2025-01-01',
      created: Math.floor(Date.now() / 1000),
      livemode: false,
      pending_webhooks: 1,
      request: null,
      data: { object: { id: intent, object: 'payment_intent', status: 'requires_payment_method' } },
    });
    const signature = Stripe.webhooks.generateTestHeaderString({ payload, secret: TEST_WEBHOOK_SECRET });
    const res = await fetch(`${t.url}/api/webhooks/payments`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signature }, body: payload });
    expect(res.status).toBe(200);
    expect(orderRow(order.number)).toMatchObject({ status: 'paid', payment_state: 'paid' });
    expect(sql("SELECT 1 FROM order_events WHERE order_id = ? AND status = 'cancelled'", orderRow(order.number).id)).toHaveLength(0);
  });

  it('rejects a forged webhook and changes nothing', async () => {
    const { c } = await freshCustomer();
    await c.add(GASKET, 1);
    const res = await c.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_authenticationRequired', delivery: DELIVERY });
    const placed = CheckoutResponseSchema.parse(res.body);
    expect(placed.nextAction).toMatchObject({ type: 'authenticate' });
    const intent = placed.nextAction!.paymentIntentId;
    const payload = JSON.stringify({ id: 'evt_forged_1', object: 'event', type: 'payment_intent.succeeded', data: { object: { id: intent, object: 'payment_intent', status: 'succeeded' } } });
    const post = (signature: string) => fetch(`${t.url}/api/webhooks/payments`, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signature }, body: payload });
    expect((await post(`t=${Math.floor(Date.now() / 1000)},v1=${'0'.repeat(64)}`)).status).toBe(400);
    expect((await post(Stripe.webhooks.generateTestHeaderString({ payload, secret: 'whsec_not_ours' }))).status).toBe(400);
    expect((await fetch(`${t.url}/api/webhooks/payments`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: payload })).status).toBe(400);
    expect(orderRow(placed.order.number)).toMatchObject({ status: 'pending_payment', payment_state: 'requires_action' });
    expect(sql('SELECT 1 FROM payment_events WHERE event_id = ?', 'evt_forged_1')).toHaveLength(0);

    // The development authentication step then completes it for real.
    const auth = await c.call('POST', `/api/dev/payments/${intent}/authenticate`, { outcome: 'succeed' });
    expect(auth.status).toBe(200);
    await waitForStatus(c, placed.order.number, 'paid');
  });

  it('sells the last unit once when two checkouts race for it; stock never goes negative', async () => {
    setAvailable(TURBO, 1);
    const a = await freshCustomer();
    const b = await freshCustomer();
    await a.c.add(TURBO, 1);
    await b.c.add(TURBO, 1);
    const body = { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY };
    const results = await Promise.all([a.c.call('POST', '/api/checkout', body), b.c.call('POST', '/api/checkout', body)]);
    expect(results.map((r) => r.status).sort()).toEqual([201, 409]);
    expect((results.find((r) => r.status === 409)!.body as { error: { message: string } }).error.message).toMatch(/out of stock/);
    expect(available(TURBO)).toBe(0);
    const negative = sql('SELECT 1 FROM stock WHERE on_hand < 0 OR reserved < 0 OR reserved > on_hand');
    expect(negative).toHaveLength(0);
    await t.payments!.waitForWebhooks();
    setAvailable(TURBO, 10);
  });
});

describe('CSV stock-list import', () => {
  const upload = (c: ReturnType<typeof client>, content: string, name = 'list.csv', type = 'text/csv') => {
    const form = new FormData();
    form.append('file', new Blob([content], { type }), name);
    return c.call('POST', '/api/cart/import', undefined, { form });
  };

  it('checks every row with a message a person can act on', async () => {
    const retail = await asCustomer();
    const csv = ['part,qty', `${TURBO},1`, 'AWL-10-020,1', `${SUPERSEDED},1`, `${GASKET},2.5`, `${GASKET},abc`, `${GASKET},0`, `${TURBO},500`, ',3'].join('\n');
    const res = await upload(retail, csv);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const { rows, validCount, errorCount } = ImportPreviewSchema.parse(res.body);
    expect([validCount, errorCount]).toEqual([2, 6]);
    const [ok, unknown, replaced, fraction, letters, zero, tooMany, empty] = rows;
    expect(ok).toMatchObject({ status: 'ok', partNumber: TURBO, quantity: 1 });
    expect(unknown).toMatchObject({ status: 'error', message: expect.stringMatching(/^No part AWL-10-020\. Did you mean AWL-10-02/) });
    expect(unknown!.suggestions.length).toBeGreaterThan(0);
    expect(replaced).toMatchObject({ status: 'replaced', partNumber: SUPERSEDED_BY, message: expect.stringContaining(`${SUPERSEDED} is superseded by ${SUPERSEDED_BY}`) });
    expect(fraction).toMatchObject({ status: 'error', message: 'Quantity “2.5” is not a whole number' });
    expect(letters).toMatchObject({ status: 'error', message: 'Quantity “abc” is not a whole number' });
    expect(zero).toMatchObject({ status: 'error', message: 'Quantity must be between 1 and 999' });
    expect(tooMany).toMatchObject({ status: 'error', message: expect.stringMatching(new RegExp(`^Only \\d+ of ${TURBO} available$`)) });
    expect(empty).toMatchObject({ status: 'error', message: 'Part number is missing' });
    // Nothing reaches the cart until the buyer adds the valid rows.
    expect((await retail.cart()).lines).toHaveLength(0);
    const bulk = await retail.call('POST', '/api/cart/bulk', { lines: rows.filter((r) => r.status !== 'error').map((r) => ({ partNumber: r.partNumber, quantity: r.quantity })) });
    expect(bulk.status).toBe(201);
    expect(CartViewSchema.parse(bulk.body).lines.map((l) => l.partNumber).sort()).toEqual([TURBO, SUPERSEDED_BY].sort());
  });

  it('lets a dealer take more than is in stock as a back-order', async () => {
    const dealer = await asDealer();
    const { rows } = ImportPreviewSchema.parse((await upload(dealer, `part,quantity\n${TURBO},500\n`)).body);
    expect(rows[0]).toMatchObject({ status: 'ok', message: expect.stringMatching(/will be back-ordered/) });
  });

  it('refuses a file over 200 kB (413), a file that is not CSV (415) and a signed-out upload (401)', async () => {
    const retail = await asCustomer();
    const big = `part,qty\n${`${GASKET},1\n`.repeat(Math.ceil(200_001 / 14))}`;
    expect(big.length).toBeGreaterThan(200_000);
    expect((await upload(retail, big)).status).toBe(413);
    expect((await upload(retail, '%PDF-1.4', 'list.pdf', 'application/pdf')).status).toBe(415);
    expect((await upload(client(), `part,qty\n${GASKET},1`)).status).toBe(401);
  });
});

describe('reorder', () => {
  it('rebuilds the cart from a past order, replacing a part superseded since, with a notice', async () => {
    const dealer = await asDealer();
    await dealer.add(GASKET, 2);
    await dealer.add('AWL-50-0202', 1);
    const placed = CheckoutResponseSchema.parse((await dealer.call('POST', '/api/checkout', { method: 'account', purchaseOrder: 'TBW-REORDER' })).body);
    // After the order, the catalogue supersedes one of its parts.
    t.db.$client.prepare("UPDATE parts SET status = 'superseded', superseded_by = ? WHERE part_number = ?").run(GASKET, 'AWL-50-0202');
    const res = await dealer.call('POST', `/api/orders/${placed.order.number}/reorder`);
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ added: 2, notices: [`AWL-50-0202 is superseded: ${GASKET} was added instead.`] });
    const cart = await dealer.cart();
    expect(cart.lines.map((l) => [l.partNumber, l.quantity])).toEqual([[GASKET, 3]]);
    t.db.$client.prepare("UPDATE parts SET status = 'active', superseded_by = NULL WHERE part_number = ?").run('AWL-50-0202');
  });
});

describe('route-by-role matrix', () => {
  it('answers 401 signed out, 403 for the wrong role and 404 for another user’s order', async () => {
    const dealer = await asDealer();
    await dealer.add(GASKET, 1);
    const dealerOrder = CheckoutResponseSchema.parse((await dealer.call('POST', '/api/checkout', { method: 'account', purchaseOrder: 'TBW-MATRIX' })).body).order.number;
    const retail = await asCustomer();
    const warehouse = await asWarehouse();
    const guest = client();

    type Row = [method: string, path: string, body: unknown, expected: { guest: number; retail: number; warehouse: number }];
    const N = dealerOrder;
    const rows: Row[] = [
      ['GET', '/api/cart', undefined, { guest: 200, retail: 200, warehouse: 200 }],
      ['POST', '/api/cart/lines', { partNumber: GASKET, quantity: 1, allowBackorder: true }, { guest: 403, retail: 403, warehouse: 403 }],
      ['PATCH', '/api/cart/lines/999999', { quantity: 2 }, { guest: 404, retail: 404, warehouse: 404 }],
      ['DELETE', '/api/cart/lines/999999', undefined, { guest: 404, retail: 404, warehouse: 404 }],
      ['POST', '/api/cart/import', undefined, { guest: 401, retail: 400, warehouse: 400 }],
      ['POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY }, { guest: 401, retail: 409, warehouse: 403 }],
      ['GET', '/api/orders', undefined, { guest: 401, retail: 200, warehouse: 200 }],
      ['GET', `/api/orders/${N}`, undefined, { guest: 401, retail: 404, warehouse: 200 }],
      ['POST', `/api/orders/${N}/reorder`, undefined, { guest: 401, retail: 404, warehouse: 403 }],
      ['POST', '/api/dev/payments/pi_someone_else/authenticate', { outcome: 'succeed' }, { guest: 401, retail: 404, warehouse: 404 }],
      ['GET', '/api/fitments', undefined, { guest: 401, retail: 200, warehouse: 200 }],
      ['GET', '/api/admin/dealers', undefined, { guest: 401, retail: 403, warehouse: 403 }],
      ['GET', '/api/warehouse/pick-queue', undefined, { guest: 401, retail: 403, warehouse: 200 }],
      ['GET', '/api/returns', undefined, { guest: 401, retail: 200, warehouse: 200 }],
      ['GET', '/api/account/me', undefined, { guest: 200, retail: 200, warehouse: 200 }],
      ['GET', '/api/no-such-route', undefined, { guest: 404, retail: 404, warehouse: 404 }],
    ];
    const who = { guest, retail, warehouse } as const;
    const got: string[] = [];
    const want: string[] = [];
    for (const [method, path, body, expected] of rows) {
      for (const role of ['guest', 'retail', 'warehouse'] as const) {
        const r = await who[role].call(method, path, body);
        got.push(`${role} ${method} ${path} → ${r.status}`);
        want.push(`${role} ${method} ${path} → ${expected[role]}`);
      }
    }
    expect(got).toEqual(want);
  });

  it('refuses a cross-site checkout', async () => {
    const retail = await asCustomer();
    const r = await retail.call('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY }, { headers: { origin: 'http://evil.example' } });
    expect(r.status).toBe(403);
  });
});
