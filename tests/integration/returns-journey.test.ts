import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createDealer, createPart, createUser, type TestDealer } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let floor: Client;

beforeAll(async () => {
  t = await startTestApp({ fakes: true });
  floor = (await createUser(t, { role: 'warehouse' })).client;
}, 60_000);
afterAll(async () => {
  await t.close();
});

type Line = { id: number; partNumber: string; quantityDispatched: number; quantityReturnable: number };
type Detail = { status: string; lines: Line[]; shipments: Array<{ carrier: string; trackingNumber: string; trackingUrl: string | null; units: number }>; returns: Array<{ reference: string }> };
type View = { id: number; reference: string; status: string; maxRefundCents: number; coreDepositCents: number; refundCents: number; decisionReason: string | null; photos: string[] };
type Page = { items: View[]; total: number; page: number; pageSize: number };

async function accountOrder(dealer: TestDealer, lines: Array<{ partNumber: string; quantity: number; allowBackorder?: boolean }>) {
  for (const l of lines) expect((await dealer.client.send('POST', '/api/cart/lines', l)).status).toBe(201);
  const res = await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-RET' });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return (res.body as { order: { number: string } }).order.number;
}

/** Picks what is on the shelf and dispatches it; anything short stays on back-order. */
async function pickAndDispatch(number: string, tracking = 'TP-0001') {
  const list = (await floor.get(`/api/warehouse/orders/${number}/pick-list`)).body as { lines: Array<{ lineId: number; partNumber: string; toPick: number }> };
  for (const l of list.lines) {
    if (l.toPick > 0) expect((await floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: l.lineId, scannedPartNumber: l.partNumber, quantity: l.toPick })).status).toBe(200);
  }
  const sent = await floor.send('POST', `/api/warehouse/orders/${number}/dispatch`, { carrier: 'Tern Parcel', trackingNumber: tracking, cartons: 1, weightKg: 3 });
  expect(sent.status, JSON.stringify(sent.body)).toBe(200);
}

const requestReturn = (client: Client, fields: Record<string, string | number>) => {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, String(v));
  return client.upload('/api/returns', form);
};
const receive = (id: number, decision: Record<string, unknown>) => floor.send('POST', `/api/warehouse/returns/${id}/receive`, decision);

describe('returns that fit the buyer and the kind', () => {
  it('returns dispatched units of a partly shipped order, no more, and shows the carrier’s tracking page', async () => {
    const dealer = await createDealer(t);
    const part = createPart(t, { stock: 29 }).partNumber;
    const number = await accountOrder(dealer, [{ partNumber: part, quantity: 30, allowBackorder: true }]);
    await pickAndDispatch(number, 'TP-29-OF-30');

    const order = (await dealer.client.get(`/api/orders/${number}`)).body as Detail;
    expect(order.status).toBe('back_ordered');
    expect(order.lines[0]).toMatchObject({ quantityDispatched: 29, quantityReturnable: 29 });
    expect(order.shipments).toEqual([expect.objectContaining({ carrier: 'Tern Parcel', trackingNumber: 'TP-29-OF-30', units: 29, trackingUrl: 'https://www.ternparcel.example/track?parcel=TP-29-OF-30' })]);
    const listed = (await dealer.client.get('/api/orders')).body as { items: Array<{ number: string; unitsDispatched: number }> };
    expect(listed.items.find((o) => o.number === number)?.unitsDispatched).toBe(29);

    const lineId = order.lines[0]!.id;
    const one = await requestReturn(dealer.client, { orderNumber: number, lineId, kind: 'wrong-part', quantity: 1, reason: 'One too many ordered' });
    expect(one.status, JSON.stringify(one.body)).toBe(201);
    expect((await requestReturn(dealer.client, { orderNumber: number, lineId, kind: 'wrong-part', quantity: 29, reason: 'All of them' })).status).toBe(409);
    const after = (await dealer.client.get(`/api/orders/${number}`)).body as Detail;
    expect(after.lines[0]!.quantityReturnable).toBe(28);
    expect(after.returns.map((r) => r.reference)).toEqual([(one.body as View).reference]);
  });

  it('refuses a decision that does not fit the kind: a core settles only its deposit', async () => {
    const dealer = await createDealer(t);
    const unit = createPart(t, { condition: 'exchange', stock: 2 }).partNumber;
    const number = await accountOrder(dealer, [{ partNumber: unit, quantity: 2 }]);
    await pickAndDispatch(number);
    const lineId = ((await dealer.client.get(`/api/orders/${number}`)).body as Detail).lines[0]!.id;
    const core = (await requestReturn(dealer.client, { orderNumber: number, lineId, kind: 'core', quantity: 1, reason: 'Old unit for the deposit' })).body as View;
    expect(core.maxRefundCents).toBe(core.coreDepositCents);

    const refunds = () => t.db.$client.prepare('SELECT count(*) AS n FROM credit_notes WHERE return_id = ?').get(core.id) as { n: number };
    const unitRefund = await receive(core.id, { decision: 'full-refund', conditionGrade: 'rebuildable' });
    expect(unitRefund.status).toBe(400);
    expect((unitRefund.body as { error: { message: string } }).error.message).toMatch(/exchange core.*never a refund of the unit/);
    expect((await receive(core.id, { decision: 'partial-refund', conditionGrade: 'damaged', amountCents: core.coreDepositCents + 1, reason: 'Cracked housing' })).status).toBe(400);
    expect((await receive(core.id, { decision: 'partial-refund', conditionGrade: 'as-new', amountCents: 100, reason: 'Worn', restock: true })).status).toBe(400);
    expect((await receive(core.id, { decision: 'partial-refund', conditionGrade: 'damaged', amountCents: 100 })).status).toBe(400); // no reason
    expect(refunds().n).toBe(0);

    const partial = await receive(core.id, { decision: 'partial-refund', conditionGrade: 'damaged', amountCents: 9_000, reason: 'Cracked turbine housing' });
    expect(partial.status, JSON.stringify(partial.body)).toBe(200);
    expect(partial.body).toMatchObject({ status: 'credited', refundCents: 9_000, decisionReason: 'Cracked turbine housing' });
    // The customer is told, by e-mail and on the site, that it was part of the deposit, and why.
    await t.mailSettled();
    const mail = await t.mail!.waitForMessage((m) => m.to.includes(dealer.email) && m.subject.includes(core.reference));
    expect(mail.subject).toMatch(/partial core deposit refund of \$90\.00/);
    expect(mail.text).toContain('Why: Cracked turbine housing');
    const notice = ((await dealer.client.get('/api/notices')).body as { items: Array<{ kind: string; body: string }> }).items[0]!;
    expect(notice).toMatchObject({ kind: 'return-decided', body: expect.stringContaining('Part of the core deposit: $90.00') });
    expect(notice.body).toContain('Why less: Cracked turbine housing');

    // The other unit comes back as a wrong part: it is refunded as a part, never as a deposit alone.
    const wrong = (await requestReturn(dealer.client, { orderNumber: number, lineId, kind: 'wrong-part', quantity: 1, reason: 'Wrong flange' })).body as View;
    expect(wrong.maxRefundCents).toBeGreaterThan(wrong.coreDepositCents);
    expect((await receive(wrong.id, { decision: 'core-refund', conditionGrade: 'as-new' })).status).toBe(400);
    expect((await receive(wrong.id, { decision: 'full-refund', conditionGrade: 'as-new', restock: true })).status).toBe(200);
  });

  it('prints a label for an open return whose code the Floor finds as a scanner types it', async () => {
    const [dealer, other] = await Promise.all([createDealer(t), createDealer(t)]);
    const part = createPart(t, { stock: 1 }).partNumber;
    const number = await accountOrder(dealer, [{ partNumber: part, quantity: 1 }]);
    await pickAndDispatch(number);
    const lineId = ((await dealer.client.get(`/api/orders/${number}`)).body as Detail).lines[0]!.id;
    const ret = (await requestReturn(dealer.client, { orderNumber: number, lineId, kind: 'faulty', quantity: 1, reason: 'Leaks oil at the seal' })).body as View;

    const label = await dealer.client.get(`/api/returns/${ret.reference}/label`);
    expect(label.status).toBe(200);
    expect(label.body).toMatchObject({ reference: ret.reference, orderNumber: number, partNumber: part, quantity: 1 });
    const svg = (label.body as { barcodeSvg: string }).barcodeSvg;
    expect(svg).toMatch(/^<svg [^>]*viewBox/);
    // Bars are drawn as stroked lines: Code 128 of a 7-character reference has dozens of them.
    expect((svg.match(/M\d+ \d+L/g) ?? []).length).toBeGreaterThan(20);
    expect((await other.client.get(`/api/returns/${ret.reference}/label`)).status).toBe(404);

    for (const typed of [ret.reference, ret.reference.toLowerCase(), ret.reference.replace('-', ''), ` ${ret.reference} `]) {
      const found = await floor.get(`/api/warehouse/returns/by-code/${encodeURIComponent(typed)}`);
      expect(found.status, typed).toBe(200);
      expect((found.body as View).id).toBe(ret.id);
    }
    expect((await floor.get('/api/warehouse/returns/by-code/SY-100001')).status).toBe(400);
    expect((await floor.get('/api/warehouse/returns/by-code/RT-99999999')).status).toBe(404);
    expect((await dealer.client.get(`/api/warehouse/returns/by-code/${ret.reference}`)).status).toBe(403);

    expect((await receive(ret.id, { decision: 'reject', conditionGrade: 'damaged', rejectReason: 'Fitted without priming the oil feed' })).status).toBe(200);
    expect((await dealer.client.get(`/api/returns/${ret.reference}/label`)).status).toBe(409);
  });

  it('lists returns a page at a time, with every page’s photos in one query', async () => {
    const dealer = await createDealer(t);
    const part = createPart(t, { stock: 25 }).partNumber;
    const number = await accountOrder(dealer, [{ partNumber: part, quantity: 25 }]);
    await pickAndDispatch(number);
    const lineId = ((await dealer.client.get(`/api/orders/${number}`)).body as Detail).lines[0]!.id;
    const png = new Blob([Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex')], { type: 'image/png' });
    for (let i = 0; i < 23; i++) {
      const form = new FormData();
      for (const [k, v] of Object.entries({ orderNumber: number, lineId: String(lineId), kind: 'wrong-part', quantity: '1', reason: `Spare ${i}` })) form.set(k, v);
      form.append('photos', png, 'p.png');
      expect((await dealer.client.upload('/api/returns', form)).status).toBe(201);
    }
    const first = (await dealer.client.get('/api/returns')).body as Page;
    expect(first).toMatchObject({ total: 23, page: 1, pageSize: 20 });
    expect(first.items).toHaveLength(20);
    expect(first.items.every((r) => r.photos.length === 1)).toBe(true);
    const second = (await dealer.client.get('/api/returns?page=2')).body as Page;
    expect(second.items).toHaveLength(3);
    expect(new Set([...first.items, ...second.items].map((r) => r.id)).size).toBe(23);
    expect(((await dealer.client.get('/api/returns?page=99')).body as Page).page).toBe(2);

    // Every query Drizzle runs passes its session's prepareQuery (the statement itself may be a kept one, server/db/client.ts).
    const session = (t.db as unknown as { session: { prepareQuery: (query: { sql: string }, ...rest: unknown[]) => unknown } }).session;
    const prepare = vi.spyOn(session, 'prepareQuery');
    try {
      const staff = (await floor.get('/api/warehouse/returns?status=all')).body as Page;
      expect(staff.items).toHaveLength(20);
      const photoQueries = prepare.mock.calls.filter(([query]) => /from "return_photos"/i.test(query.sql));
      expect(photoQueries).toHaveLength(1);
    } finally {
      prepare.mockRestore();
    }
  });
});

describe('on-site notices', () => {
  it('records paid or placed, picking, back-ordered, dispatched and return decided for the buyer, who marks them read', async () => {
    const [dealer, other] = await Promise.all([createDealer(t), createDealer(t)]);
    const part = createPart(t, { stock: 2 }).partNumber;
    const number = await accountOrder(dealer, [{ partNumber: part, quantity: 3, allowBackorder: true }]);
    await pickAndDispatch(number, 'TP-NOTICE-1');
    const lineId = ((await dealer.client.get(`/api/orders/${number}`)).body as Detail).lines[0]!.id;
    const ret = (await requestReturn(dealer.client, { orderNumber: number, lineId, kind: 'faulty', quantity: 1, reason: 'Noisy bearing' })).body as View;
    expect((await receive(ret.id, { decision: 'full-refund', conditionGrade: 'damaged' })).status).toBe(200);

    type Notices = { items: Array<{ id: number; kind: string; title: string; body: string; link: string; read: boolean }>; unread: number; total: number };
    const mine = (await dealer.client.get('/api/notices')).body as Notices;
    expect(mine.items.map((n) => n.kind)).toEqual(['return-decided', 'dispatched', 'picking', 'back-ordered', 'on-account']);
    expect(mine.unread).toBe(5);
    const dispatched = mine.items.find((n) => n.kind === 'dispatched')!;
    expect(dispatched.body).toContain('TP-NOTICE-1');
    expect(dispatched.body).toContain(`1 × ${part}`);
    expect(dispatched.link).toBe(`/orders/${number}`);
    expect(mine.items[0]!.title).toContain(ret.reference);

    expect(((await other.client.get('/api/notices')).body as Notices).total).toBe(0);
    expect((await other.client.send('POST', `/api/notices/${dispatched.id}/read`)).status).toBe(404);
    expect((await dealer.client.send('POST', `/api/notices/${dispatched.id}/read`)).body).toEqual({ unread: 4 });
    expect((await dealer.client.get('/api/notices/unread')).body).toEqual({ unread: 4 });
    expect((await dealer.client.send('POST', '/api/notices/read-all')).body).toEqual({ unread: 0 });
    expect(((await dealer.client.get('/api/notices')).body as Notices).items.every((n) => n.read)).toBe(true);
    expect((await t.get('/api/notices')).status).toBe(401);
  });
});
