import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OrderChangeResultSchema, OrderChangesSchema } from '../../shared/schemas/order-changes';
import { OrderDetailSchema } from '../../shared/schemas/orders';
import { paymentsClient } from '../support/app-deps';
import { createCustomer, createDealer, createOrder, createPart, createUser, type TestUser } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * A buyer lowers quantities or cancels an order before picking starts: the order is repriced, its stock released
 * through the ledger, the card refunded (or the invoice amended) and the buyer mailed; once picking starts, 409.
 */
let t: TestApp;
let floor: TestUser;
beforeAll(async () => {
  t = await startTestApp({ fakes: true });
  floor = await createUser(t, { role: 'warehouse' });
});
afterAll(async () => {
  await t.close();
});

const sql = <T>(query: string, ...args: unknown[]) => t.db.$client.prepare(query).all(...args) as T[];
const one = <T>(query: string, ...args: unknown[]) => t.db.$client.prepare(query).get(...args) as T;
const orderRow = (number: string) =>
  one<{ id: number; status: string; payment_state: string; payment_intent_id: string | null; total_cents: number; refunded_cents: number; goods_cents: number; freight_cents: number; tax_cents: number }>(
    'SELECT * FROM orders WHERE number = ?',
    number,
  );
const heldFor = (orderId: number, partId: number) => one<{ n: number }>('SELECT COALESCE(SUM(reserved_delta), 0) AS n FROM stock_movements WHERE order_id = ? AND part_id = ?', orderId, partId).n;
const available = (partId: number) => one<{ n: number }>('SELECT available AS n FROM parts WHERE id = ?', partId).n;

/** On hand and reserved per part and bin equal the ledger's sums, and each part's available equals its bins' free stock. */
function ledgerMismatches() {
  const bins = sql<{ partId: number }>(
    `SELECT s.part_id AS partId FROM stock s
     LEFT JOIN (SELECT part_id, bin_code, SUM(on_hand_delta) AS oh, SUM(reserved_delta) AS rs FROM stock_movements GROUP BY part_id, bin_code) m
       ON m.part_id = s.part_id AND m.bin_code = s.bin_code
     WHERE s.on_hand <> COALESCE(m.oh, 0) OR s.reserved <> COALESCE(m.rs, 0)`,
  );
  const parts = sql<{ partId: number }>(
    `SELECT p.id AS partId FROM parts p LEFT JOIN (SELECT part_id, SUM(on_hand - reserved) AS free FROM stock GROUP BY part_id) s ON s.part_id = p.id
     WHERE p.available <> COALESCE(s.free, 0)`,
  );
  return [...bins, ...parts];
}

const detail = async (buyer: TestUser, number: string) => OrderDetailSchema.parse((await buyer.client.get(`/api/orders/${number}`)).body);
const changes = async (buyer: TestUser, number: string) => OrderChangesSchema.parse((await buyer.client.get(`/api/orders/${number}/changes`)).body);
const provider = () => paymentsClient(t.payments!.port);
const mailsTo = (email: string, subject: RegExp) => sql<{ subject: string; text: string }>("SELECT subject, text FROM mail_outbox JOIN mail_bodies ON outbox_id = id WHERE recipient = ? AND kind = 'order-changed'", email).filter((m) => subject.test(m.subject));

describe('changing a card order before picking', () => {
  it('lowers one quantity and takes a line off: stock goes back through the ledger, the difference is refunded, the buyer is mailed', async () => {
    const buyer = await createCustomer(t);
    const a = createPart(t, { priceCents: 4_000, stock: 10, weightGrams: 400 });
    const b = createPart(t, { priceCents: 2_500, stock: 10, weightGrams: 200 });
    const placed = await createOrder(buyer, [
      { partNumber: a.partNumber, quantity: 3 },
      { partNumber: b.partNumber, quantity: 2 },
    ]);
    const number = placed.order.number;
    await t.payments!.waitForWebhooks();
    const before = orderRow(number);
    expect(before).toMatchObject({ status: 'paid', payment_state: 'paid' });
    expect([available(a.id), available(b.id)]).toEqual([7, 8]);
    expect((await changes(buyer, number)).changeability).toEqual({ canChange: true, canCancel: true, reason: null });

    const lines = (await detail(buyer, number)).lines;
    const lineA = lines.find((l) => l.partNumber === a.partNumber)!;
    const lineB = lines.find((l) => l.partNumber === b.partNumber)!;
    const res = await buyer.client.send('POST', `/api/orders/${number}/changes`, {
      lines: [
        { lineId: lineA.id, quantity: 1 },
        { lineId: lineB.id, quantity: 0 },
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const result = OrderChangeResultSchema.parse(res.body);

    // Repriced by hand: 1 × $40.00 = $40.00 goods, 400 g → local zone (QF postcode) first band $6.95, tax 8 % of $46.95 = $3.76.
    const after = orderRow(number);
    expect(after).toMatchObject({ goods_cents: 4_000, freight_cents: 695, tax_cents: 376, total_cents: 5_071, status: 'paid', payment_state: 'paid', refunded_cents: 0 });
    expect(result.change).toMatchObject({ kind: 'change', beforeTotalCents: before.total_cents, afterTotalCents: 5_071, adjustmentCents: before.total_cents - 5_071, settlement: 'card-refund', refundState: 'refunded' });
    expect(result.message).toMatch(/refunded to your card/);

    // Stock: 2 of A and both of B back on the shelf; what the order holds matches its lines; the ledger reconciles.
    expect([available(a.id), available(b.id)]).toEqual([9, 10]);
    expect([heldFor(after.id, a.id), heldFor(after.id, b.id)]).toEqual([1, 0]);
    expect(ledgerMismatches()).toEqual([]);
    expect((await detail(buyer, number)).lines.map((l) => [l.partNumber, l.quantity])).toEqual([[a.partNumber, 1]]);

    // The provider refunded exactly the difference, once; the charge's refund webhook leaves the order fully paid at its new total.
    const refunds = await provider().refunds.list({ payment_intent: after.payment_intent_id! });
    expect(refunds.data.map((r) => r.amount)).toEqual([before.total_cents - 5_071]);
    await t.payments!.waitForWebhooks();
    expect(orderRow(number)).toMatchObject({ payment_state: 'paid', refunded_cents: 0 });

    const mails = mailsTo(buyer.email, new RegExp(`Order ${number} is changed`));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.text).toContain(`refunding $${((before.total_cents - 5_071) / 100).toFixed(2)} to the card`);
    expect(mails[0]!.text).toContain('TAKEN OFF: was 2');
  });

  it('cancels a paid card order in full: all stock released, the whole payment refunded, no stray-payment alert, a second cancel refused', async () => {
    const buyer = await createCustomer(t);
    const a = createPart(t, { stock: 4 });
    const placed = await createOrder(buyer, [{ partNumber: a.partNumber, quantity: 4 }]);
    await t.payments!.waitForWebhooks();
    const res = await buyer.client.send('POST', `/api/orders/${placed.order.number}/cancel`);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(OrderChangeResultSchema.parse(res.body).change).toMatchObject({ kind: 'cancel', adjustmentCents: placed.order.totalCents, refundState: 'refunded' });
    const row = orderRow(placed.order.number);
    expect(row).toMatchObject({ status: 'cancelled', payment_state: 'refunded', refunded_cents: placed.order.totalCents });
    expect(available(a.id)).toBe(4);
    expect(heldFor(row.id, a.id)).toBe(0);
    expect(ledgerMismatches()).toEqual([]);
    const intent = await provider().paymentIntents.retrieve(row.payment_intent_id!, { expand: ['latest_charge'] });
    expect((intent.latest_charge as { amount_refunded: number }).amount_refunded).toBe(placed.order.totalCents);
    // The housekeeping pass does not take the cancelled, refunded order for a stray payment.
    const figures = await t.app.orders.reconcilePayments({ settleAfterMs: 0 });
    expect(figures.refunded).toBe(0);
    expect(sql('SELECT 1 FROM payment_alerts WHERE order_id = ?', row.id)).toHaveLength(0);
    expect(mailsTo(buyer.email, /is cancelled/)).toHaveLength(1);
    const again = await buyer.client.send('POST', `/api/orders/${placed.order.number}/cancel`);
    expect(again.status).toBe(409);
  });

  it('keeps the change when the provider refuses the refund, and the housekeeping pass refunds it later, once', async () => {
    const buyer = await createCustomer(t);
    const a = createPart(t, { stock: 5 });
    const placed = await createOrder(buyer, [{ partNumber: a.partNumber, quantity: 2 }]);
    await t.payments!.waitForWebhooks();
    const [line] = (await detail(buyer, placed.order.number)).lines;
    await fetch(`${t.payments!.url}/_test/faults`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ method: 'POST', path: '^/v1/refunds$', action: 'error', status: 500 }) });
    const res = await buyer.client.send('POST', `/api/orders/${placed.order.number}/changes`, { lines: [{ lineId: line!.id, quantity: 1 }] });
    await fetch(`${t.payments!.url}/_test/faults`, { method: 'DELETE' });
    expect(res.status).toBe(201);
    const result = OrderChangeResultSchema.parse(res.body);
    expect(result.change.refundState).toBe('failed');
    expect(result.message).toMatch(/will be refunded/);
    const orderId = orderRow(placed.order.number).id;
    expect(sql("SELECT note FROM order_events WHERE order_id = ? AND status = 'payment_alert'", orderId)).toHaveLength(1);
    expect(available(a.id)).toBe(4);
    expect(await t.app.orders.retryChangeRefunds({ settleAfterMs: 0 })).toBe(1);
    expect((await changes(buyer, placed.order.number)).changes[0]).toMatchObject({ refundState: 'refunded' });
    expect(await t.app.orders.retryChangeRefunds({ settleAfterMs: 0 })).toBe(0);
    const refunds = await provider().refunds.list({ payment_intent: orderRow(placed.order.number).payment_intent_id! });
    expect(refunds.data).toHaveLength(1);
  });
});

describe('cancelling a card order whose payment is not taken yet', () => {
  it('cancels the payment with the provider first, then the order: stock back, no money taken, the buyer told so', async () => {
    const buyer = await createCustomer(t);
    const a = createPart(t, { stock: 3 });
    const placed = await createOrder(buyer, [{ partNumber: a.partNumber, quantity: 2 }], {
      method: 'card',
      paymentMethod: 'pm_card_authenticationRequired',
      delivery: { name: 'Factory Buyer', line1: '1 Test Street', city: 'Quenchfold', postcode: 'QF1 1AA' },
    });
    // The bank asks for authentication: the checkout answers with the step, and the order waits for payment.
    expect(placed.outcome).toBe('authenticate');
    const number = placed.order.number;
    expect(orderRow(number)).toMatchObject({ status: 'pending_payment', payment_state: 'requires_action' });
    expect(available(a.id)).toBe(1);
    expect((await changes(buyer, number)).changeability).toMatchObject({ canChange: false, canCancel: true });
    const refused = await buyer.client.send('POST', `/api/orders/${number}/changes`, { lines: [{ lineId: (await detail(buyer, number)).lines[0]!.id, quantity: 1 }] });
    expect(refused.status).toBe(409);

    const res = await buyer.client.send('POST', `/api/orders/${number}/cancel`);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(OrderChangeResultSchema.parse(res.body).change).toMatchObject({ kind: 'cancel', settlement: 'payment-cancelled', adjustmentCents: 0, refundState: null });
    const row = orderRow(number);
    expect(row).toMatchObject({ status: 'cancelled', payment_state: 'failed' });
    expect((await provider().paymentIntents.retrieve(row.payment_intent_id!)).status).toBe('canceled');
    expect(available(a.id)).toBe(3);
    expect(ledgerMismatches()).toEqual([]);
    // Nothing goes back into the cart: the buyer chose to cancel.
    expect(((await buyer.client.get('/api/cart')).body as { lines: unknown[] }).lines).toHaveLength(0);
    expect(mailsTo(buyer.email, /is cancelled/)[0]!.text).toMatch(/cancelled before it was taken/);
    await t.app.orders.reconcilePayments({ settleAfterMs: 0 });
    expect(orderRow(number)).toMatchObject({ status: 'cancelled', payment_state: 'failed' });
  });
});

describe('changing an order on account', () => {
  it('amends the invoice: the open balance falls by the difference, and a cancelled order owes nothing', async () => {
    const dealer = await createDealer(t, { tier: 'standard' });
    const a = createPart(t, { priceCents: 10_000, stock: 10 });
    const placed = await createOrder(dealer, [{ partNumber: a.partNumber, quantity: 4, allowBackorder: true }]);
    const balance = () => t.app.dealers.openBalance(dealer.dealerAccountId);
    expect(balance()).toBe(placed.order.totalCents);
    const [line] = (await detail(dealer, placed.order.number)).lines;
    const res = await dealer.client.send('POST', `/api/orders/${placed.order.number}/changes`, { lines: [{ lineId: line!.id, quantity: 1 }] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const change = OrderChangeResultSchema.parse(res.body).change;
    expect(change).toMatchObject({ settlement: 'amended-invoice', refundState: null });
    expect(orderRow(placed.order.number).total_cents).toBe(change.afterTotalCents);
    expect(balance()).toBe(change.afterTotalCents);
    expect(placed.order.totalCents - change.afterTotalCents).toBe(change.adjustmentCents);
    expect(available(a.id)).toBe(9);
    expect(mailsTo(dealer.email, /is changed/)[0]!.text).toMatch(/invoice for this order \(your purchase order PO-\d+\) is amended/);

    const cancel = await dealer.client.send('POST', `/api/orders/${placed.order.number}/cancel`);
    expect(cancel.status).toBe(201);
    expect(balance()).toBe(0);
    expect(available(a.id)).toBe(10);
    expect(ledgerMismatches()).toEqual([]);
  });

  it('lowers a back-ordered line by the units still waiting first; what is held on the shelf stays held', async () => {
    const dealer = await createDealer(t);
    const a = createPart(t, { stock: 2 });
    const placed = await createOrder(dealer, [{ partNumber: a.partNumber, quantity: 5, allowBackorder: true }]);
    const [line] = (await detail(dealer, placed.order.number)).lines;
    expect(line).toMatchObject({ quantity: 5, quantityBackordered: 3 });
    const res = await dealer.client.send('POST', `/api/orders/${placed.order.number}/changes`, { lines: [{ lineId: line!.id, quantity: 2 }] });
    expect(res.status).toBe(201);
    const [after] = (await detail(dealer, placed.order.number)).lines;
    expect(after).toMatchObject({ quantity: 2, quantityBackordered: 0 });
    expect(heldFor(orderRow(placed.order.number).id, a.id)).toBe(2);
    expect(available(a.id)).toBe(0);
    expect(ledgerMismatches()).toEqual([]);
  });
});

describe('refusals', () => {
  it('refuses a change or cancel once picking has started (409 with the reason) and changes nothing', async () => {
    const dealer = await createDealer(t);
    const a = createPart(t, { stock: 5 });
    const b = createPart(t, { stock: 5 });
    const placed = await createOrder(dealer, [
      { partNumber: a.partNumber, quantity: 2 },
      { partNumber: b.partNumber, quantity: 2 },
    ]);
    const number = placed.order.number;
    const pickList = (await floor.client.get(`/api/warehouse/orders/${number}/pick-list`)).body as { lines: Array<{ lineId: number; partNumber: string }> };
    const first = pickList.lines[0]!;
    expect((await floor.client.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: first.lineId, scannedPartNumber: first.partNumber, quantity: 1 })).status).toBe(200);
    const before = orderRow(number);
    const movements = one<{ n: number }>('SELECT count(*) AS n FROM stock_movements').n;

    const lines = (await detail(dealer, number)).lines;
    const change = await dealer.client.send('POST', `/api/orders/${number}/changes`, { lines: [{ lineId: lines[1]!.id, quantity: 1 }] });
    expect(change.status).toBe(409);
    expect((change.body as { error: { message: string } }).error.message).toMatch(/started picking order .* can no longer be changed or cancelled/);
    const cancel = await dealer.client.send('POST', `/api/orders/${number}/cancel`);
    expect(cancel.status).toBe(409);
    expect(orderRow(number)).toEqual(before);
    expect(one<{ n: number }>('SELECT count(*) AS n FROM stock_movements').n).toBe(movements);
    expect((await changes(dealer, number)).changeability).toMatchObject({ canChange: false, canCancel: false, reason: expect.stringMatching(/started picking/) });
  });

  it('refuses raising a quantity, a line of another order, and anyone else’s order', async () => {
    const dealer = await createDealer(t);
    const other = await createDealer(t);
    const a = createPart(t, { stock: 5 });
    const placed = await createOrder(dealer, [{ partNumber: a.partNumber, quantity: 2 }]);
    const [line] = (await detail(dealer, placed.order.number)).lines;
    const more = await dealer.client.send('POST', `/api/orders/${placed.order.number}/changes`, { lines: [{ lineId: line!.id, quantity: 3 }] });
    expect(more.status).toBe(400);
    expect((more.body as { error: { message: string } }).error.message).toMatch(/place a new order/);
    const same = await dealer.client.send('POST', `/api/orders/${placed.order.number}/changes`, { lines: [{ lineId: line!.id, quantity: 2 }] });
    expect(same.status).toBe(400);
    expect((await dealer.client.send('POST', `/api/orders/${placed.order.number}/changes`, { lines: [{ lineId: line!.id + 100_000, quantity: 0 }] })).status).toBe(400);
    expect((await other.client.send('POST', `/api/orders/${placed.order.number}/cancel`)).status).toBe(404);
    expect((await other.client.get(`/api/orders/${placed.order.number}/changes`)).status).toBe(404);
    expect(orderRow(placed.order.number).status).toBe('on_account');
  });
});
