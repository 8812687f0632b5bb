import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { paymentsClient } from '../support/app-deps';
import { createCustomer, createDealer, createPart, createUser } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
// Shared only for their roles; whoever orders in a test is made in that test.
let retail: Client;
let floor: Client;
let admin: Client;

beforeAll(async () => {
  t = await startTestApp({ fakes: true });
  [retail, floor, admin] = (await Promise.all([createCustomer(t), createUser(t, { role: 'warehouse' }), createUser(t, { role: 'admin' })])).map((u) => u.client) as [Client, Client, Client];
}, 60_000);
afterAll(async () => {
  await t.close();
});

const sql = <T>(q: string, ...p: unknown[]) => t.db.$client.prepare(q).all(...p) as T[];
const one = <T>(q: string, ...p: unknown[]) => t.db.$client.prepare(q).get(...p) as T;
const available = (partNumber: string) =>
  one<{ n: number }>('SELECT COALESCE(SUM(s.on_hand - s.reserved), 0) AS n FROM stock s JOIN parts p ON p.id = s.part_id WHERE p.part_number = ?', partNumber).n;

/** Parts of the test's own, each with `stock` units on the shelf, so no other test's orders have moved them. */
const ownParts = (stock: number, count: number): string[] => Array.from({ length: count }, () => createPart(t, { stock }).partNumber);

async function accountOrder(client: Client, lines: Array<{ partNumber: string; quantity: number; allowBackorder?: boolean }>, po = 'PO-TEST') {
  for (const l of lines) expect((await client.send('POST', '/api/cart/lines', l)).status).toBe(201);
  const res = await client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: po });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return (res.body as { order: { number: string } }).order.number;
}

async function cardOrder(client: Client, lines: Array<{ partNumber: string; quantity: number }>) {
  for (const l of lines) expect((await client.send('POST', '/api/cart/lines', l)).status).toBe(201);
  const res = await client.send('POST', '/api/checkout', {
    method: 'card',
    paymentMethod: 'pm_card_visa',
    delivery: { name: 'Robin Ashdown', line1: '1 Test Street', city: 'Quenchfold', postcode: 'QF1 1AA', zone: 'local' },
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const number = (res.body as { order: { number: string } }).order.number;
  await expect.poll(async () => ((await client.get(`/api/orders/${number}`)).body as { status: string }).status, { timeout: 5000 }).toBe('paid');
  return number;
}

type PickLine = { lineId: number; partNumber: string; toPick: number; binCode: string };
const pickList = async (number: string) => ((await floor.get(`/api/warehouse/orders/${number}/pick-list`)).body as { lines: PickLine[] }).lines;

async function pickAll(number: string) {
  for (const l of await pickList(number)) {
    if (l.toPick > 0) expect((await floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: l.lineId, scannedPartNumber: l.partNumber, quantity: l.toPick })).status).toBe(200);
  }
}
const dispatch = (number: string, tracking = 'TP-0001') =>
  floor.send('POST', `/api/warehouse/orders/${number}/dispatch`, { carrier: 'Tern Parcel', trackingNumber: tracking, cartons: 1, weightKg: 2.5 });

/** The invariant: on hand and reserved per part and bin always equal the sums of the ledger's rows. */
function ledgerMismatches() {
  return sql<{ partId: number; binCode: string }>(
    `SELECT s.part_id AS partId, s.bin_code AS binCode FROM stock s
     LEFT JOIN (SELECT part_id, bin_code, SUM(on_hand_delta) AS oh, SUM(reserved_delta) AS rs FROM stock_movements GROUP BY part_id, bin_code) m
       ON m.part_id = s.part_id AND m.bin_code = s.bin_code
     WHERE s.on_hand <> COALESCE(m.oh, 0) OR s.reserved <> COALESCE(m.rs, 0) OR s.reserved > s.on_hand OR s.reserved < 0`,
  );
}

describe('picking', () => {
  it('refuses a wrongly scanned part and records nothing', async () => {
    const { client: dealer } = await createDealer(t);
    const [a, b] = ownParts(3, 2);
    const number = await accountOrder(dealer, [{ partNumber: a!, quantity: 1 }]);
    const [line] = await pickList(number);
    const movementsBefore = one<{ n: number }>('SELECT count(*) AS n FROM stock_movements').n;
    const res = await floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: line!.lineId, scannedPartNumber: b, quantity: 1 });
    expect(res.status).toBe(409);
    expect((res.body as { error: { message: string } }).error.message).toMatch(/nothing was recorded/);
    expect(one<{ n: number }>('SELECT count(*) AS n FROM stock_movements').n).toBe(movementsBefore);
    expect((await pickList(number))[0]!.toPick).toBe(1);
    // The right part typed the way people type it is accepted.
    const ok = await floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: line!.lineId, scannedPartNumber: a!.toLowerCase().replace(/-/g, ''), quantity: 1 });
    expect(ok.status).toBe(200);
  });

  it('dispatches once: stock leaves on hand exactly once and a second dispatch is refused', async () => {
    const { client: dealer, email } = await createDealer(t);
    const [a] = ownParts(4, 1);
    const onHand = () => one<{ n: number }>('SELECT SUM(on_hand) AS n FROM stock s JOIN parts p ON p.id = s.part_id WHERE p.part_number = ?', a).n;
    const before = onHand();
    const number = await accountOrder(dealer, [{ partNumber: a!, quantity: 2 }]);
    expect(onHand()).toBe(before);
    expect((await dispatch(number)).status).toBe(409); // nothing picked yet
    await pickAll(number);
    const first = await dispatch(number, 'TP-12345');
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ status: 'dispatched', shipment: { trackingNumber: 'TP-12345', units: 2 } });
    expect(onHand()).toBe(before - 2);
    const again = await dispatch(number, 'TP-12345');
    expect(again.status).toBe(409);
    expect(onHand()).toBe(before - 2);
    await t.mailSettled();
    const mail = await t.mail!.waitForMessage((m) => m.subject.includes(number) && /on its way/.test(m.subject));
    expect(mail.text).toContain('TP-12345');
    expect(mail.to).toContain(email);
  });

  it('turns a short pick into a back-order that goods-in releases into the pick queue', async () => {
    const { client: dealer } = await createDealer(t);
    const [a] = ownParts(3, 1);
    const number = await accountOrder(dealer, [{ partNumber: a!, quantity: 3 }]);
    const [line] = await pickList(number);
    const res = await floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: line!.lineId, scannedPartNumber: a, quantity: 1, short: true });
    expect(res.status).toBe(200);
    expect((res.body as { message: string }).message).toMatch(/back-ordered/);
    const after = (await pickList(number))[0]!;
    expect(after).toMatchObject({ toPick: 0, backordered: 2, picked: 1 });
    await t.mailSettled();
    await t.mail!.waitForMessage((m) => m.subject.includes(number) && /back-order/i.test(m.subject));

    // Ship what was found; the order then waits as a back-order.
    expect((await dispatch(number)).body).toMatchObject({ status: 'back_ordered' });
    const queue = async () => ((await floor.get(`/api/warehouse/pick-queue?q=${number}`)).body as { items: Array<{ number: string; unitsToPick: number; releasedBackorder: boolean }> }).items;
    expect((await queue()).find((o) => o.number === number)).toBeUndefined();

    const arrived = await floor.send('POST', '/api/warehouse/goods-in', { partNumber: a, binCode: line!.binCode, quantity: 5 });
    expect(arrived.status).toBe(201);
    expect((arrived.body as { released: Array<{ orderNumber: string; quantity: number }> }).released).toContainEqual({ orderNumber: number, quantity: 2 });
    expect((await queue()).find((o) => o.number === number)).toMatchObject({ unitsToPick: 2, releasedBackorder: true });
    await pickAll(number);
    expect((await dispatch(number, 'TP-2')).body).toMatchObject({ status: 'dispatched' });
    expect(ledgerMismatches()).toEqual([]);
  });

  it('keeps every stock figure equal to its ledger after a random run of orders, picks, dispatches, adjustments and goods-in', async () => {
    const { client: dealer } = await createDealer(t);
    const parts = ownParts(6, 4);
    const bins = new Map(parts.map((p) => [p, one<{ bin: string }>('SELECT s.bin_code AS bin FROM stock s JOIN parts p ON p.id = s.part_id WHERE p.part_number = ? LIMIT 1', p).bin]));
    const step = fc.oneof(
      fc.record({ kind: fc.constant('order' as const), part: fc.constantFrom(...parts), qty: fc.integer({ min: 1, max: 3 }) }),
      fc.record({ kind: fc.constant('goods-in' as const), part: fc.constantFrom(...parts), qty: fc.integer({ min: 1, max: 4 }) }),
      fc.record({ kind: fc.constant('adjust' as const), part: fc.constantFrom(...parts), qty: fc.integer({ min: -2, max: 2 }) }),
      fc.record({ kind: fc.constant('ship' as const), short: fc.boolean() }),
    );
    await fc.assert(
      fc.asyncProperty(fc.array(step, { minLength: 4, maxLength: 10 }), async (steps) => {
        const open: string[] = [];
        for (const s of steps) {
          if (s.kind === 'order') {
            if (available(s.part) < s.qty) continue;
            open.push(await accountOrder(dealer, [{ partNumber: s.part, quantity: s.qty }]));
          } else if (s.kind === 'goods-in') {
            await floor.send('POST', '/api/warehouse/goods-in', { partNumber: s.part, binCode: bins.get(s.part), quantity: s.qty });
          } else if (s.kind === 'adjust') {
            if (s.qty !== 0) await floor.send('POST', '/api/warehouse/adjustments', { partNumber: s.part, binCode: bins.get(s.part), delta: s.qty, reason: 'cycle count' });
          } else if (open.length > 0) {
            const number = open.shift()!;
            const [line] = await pickList(number);
            if (line && line.toPick > 0) {
              await floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: line.lineId, scannedPartNumber: line.partNumber, quantity: s.short ? line.toPick - 1 : line.toPick, short: s.short || undefined });
            }
            await dispatch(number);
          }
          expect(ledgerMismatches()).toEqual([]);
        }
      }),
      { numRuns: 4 },
    );
  }, 120_000);
});

describe('returns and refunds', () => {
  const png = () => new Blob([Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex')], { type: 'image/png' });

  async function dispatchedOrder(client: Client, partNumber: string, card: boolean) {
    const number = card ? await cardOrder(client, [{ partNumber, quantity: 1 }]) : await accountOrder(client, [{ partNumber, quantity: 1 }]);
    await pickAll(number);
    expect((await dispatch(number)).status).toBe(200);
    const line = ((await client.get(`/api/orders/${number}`)).body as { lines: Array<{ id: number }> }).lines[0]!;
    return { number, lineId: line.id };
  }

  const requestReturn = (client: Client, fields: Record<string, string>, files: Blob[] = [png()]) => {
    const form = new FormData();
    for (const [k, v] of Object.entries(fields)) form.set(k, v);
    for (const f of files) form.append('photos', f, 'photo.png');
    return client.upload('/api/returns', form);
  };

  it('refunds a card order through the payment service, once, and never more than was paid', async () => {
    const [{ client: buyer }, { client: otherBuyer }] = await Promise.all([createCustomer(t), createDealer(t)]);
    const [part] = ownParts(2, 1);
    const { number, lineId } = await dispatchedOrder(buyer, part!, true);
    const order = (await buyer.get(`/api/orders/${number}`)).body as { totalCents: number };
    const created = await requestReturn(buyer, { orderNumber: number, lineId: String(lineId), kind: 'faulty', quantity: '1', reason: 'Bearing noise on first start' });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const ret = created.body as { id: number; maxRefundCents: number; photos: string[] };
    expect(ret.maxRefundCents).toBeLessThanOrEqual(order.totalCents);
    expect(ret.photos).toHaveLength(1);
    // The warehouse and the buyer see the photo; another buyer does not.
    expect((await floor.get(`/api/returns/photos/${ret.photos[0]}`)).status).toBe(200);
    expect((await buyer.get(`/api/returns/photos/${ret.photos[0]}`)).status).toBe(200);
    expect((await otherBuyer.get(`/api/returns/photos/${ret.photos[0]}`)).status).toBe(404);

    const tooMuch = await floor.send('POST', `/api/warehouse/returns/${ret.id}/receive`, { decision: 'partial-refund', conditionGrade: 'damaged', amountCents: ret.maxRefundCents + 1 });
    expect(tooMuch.status).toBe(400);

    const decide = () => floor.send('POST', `/api/warehouse/returns/${ret.id}/receive`, { decision: 'full-refund', conditionGrade: 'damaged' });
    const [a, b] = await Promise.all([decide(), decide()]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const intent = one<{ id: string }>('SELECT payment_intent_id AS id FROM orders WHERE number = ?', number).id;
    const refunds = await paymentsClient(t.payments!.port).refunds.list({ payment_intent: intent });
    expect(refunds.data).toHaveLength(1);
    expect(refunds.data[0]!.amount).toBe(ret.maxRefundCents);
    expect(one<{ r: number }>('SELECT refunded_cents AS r FROM orders WHERE number = ?', number).r).toBe(ret.maxRefundCents);
    expect((await decide()).status).toBe(409);
  });

  it('refunds an exchange core deposit as a credit note on an account order', async () => {
    const { client: dealer, email } = await createDealer(t);
    const core = createPart(t, { condition: 'exchange', stock: 1 }).partNumber;
    const { number, lineId } = await dispatchedOrder(dealer, core, false);
    const created = await requestReturn(dealer, { orderNumber: number, lineId: String(lineId), kind: 'core', quantity: '1', reason: 'Old unit back for the deposit' });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const ret = created.body as { id: number; coreDepositCents: number };
    expect(ret.coreDepositCents).toBeGreaterThan(0);
    const decided = await floor.send('POST', `/api/warehouse/returns/${ret.id}/receive`, { decision: 'core-refund', conditionGrade: 'rebuildable' });
    expect(decided.status).toBe(200);
    expect(decided.body).toMatchObject({ status: 'credited', refundCents: ret.coreDepositCents, creditNoteNumber: expect.stringMatching(/^CN-/) });
    const mine = (await dealer.get('/api/returns')).body as { items: Array<{ id: number; status: string }> };
    expect(mine.items.find((r) => r.id === ret.id)?.status).toBe('credited');
    await t.mailSettled();
    await t.mail!.waitForMessage((m) => m.to.includes(email) && /return/i.test(m.subject));
    // A core return is only for exchange units.
    const [plain] = ownParts(2, 1);
    const other = await dispatchedOrder(dealer, plain!, false);
    expect((await requestReturn(dealer, { orderNumber: other.number, lineId: String(other.lineId), kind: 'core', quantity: '1', reason: 'not a core' })).status).toBe(409);
  });

  it('refuses uploads that are not images (415) or too large (413), and other users’ lines (404)', async () => {
    const { client: dealer } = await createDealer(t);
    const [part] = ownParts(2, 1);
    const { number, lineId } = await dispatchedOrder(dealer, part!, false);
    const fields = { orderNumber: number, lineId: String(lineId), kind: 'wrong-part', quantity: '1', reason: 'Ordered the wrong A/R' };
    const fake = new Blob(['<script>alert(1)</script>'], { type: 'image/png' });
    expect((await requestReturn(dealer, fields, [fake])).status).toBe(415);
    expect((await requestReturn(dealer, fields, [new Blob(['plain text'], { type: 'text/plain' })])).status).toBe(415);
    const big = new Blob([Buffer.concat([Buffer.from('89504e470d0a1a0a', 'hex'), Buffer.alloc(2_100_000)])], { type: 'image/png' });
    expect((await requestReturn(dealer, fields, [big])).status).toBe(413);
    expect((await requestReturn(retail, fields)).status).toBe(404);
    expect(one<{ n: number }>('SELECT count(*) AS n FROM returns WHERE order_id = (SELECT id FROM orders WHERE number = ?)', number).n).toBe(0);
  });
});

describe('price imports', () => {
  const upload = (csv: string, name = 'prices.csv') => {
    const form = new FormData();
    form.set('file', new Blob([csv], { type: 'text/csv' }), name);
    return admin.upload('/api/admin/price-imports', form);
  };
  const price = (n: string) => one<{ p: number }>('SELECT price_cents AS p FROM parts WHERE part_number = ?', n).p;

  it('previews a diff, applies nothing while a row is in error, then applies all in one go', async () => {
    const before = price('FLG-50-0201');
    const csv = ['part_number,price', 'FLG-50-0201,19.95', 'AWL-50-0201,abc', `BUR-50-0201,${(price('BUR-50-0201') / 100).toFixed(2)}`].join('\n');
    const res = await upload(csv);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const imp = res.body as { id: number; counts: Record<string, number>; rows: Array<{ row: number; status: string; oldPriceCents: number | null; newPriceCents: number | null; message: string | null }> };
    expect(imp.counts).toEqual({ new: 0, changed: 1, unchanged: 1, error: 1 });
    expect(imp.rows.find((r) => r.status === 'changed')).toMatchObject({ oldPriceCents: before, newPriceCents: 1995 });
    const bad = imp.rows.find((r) => r.status === 'error')!;
    expect(bad.message).toMatch(/abc/);

    const refused = await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`);
    expect(refused.status).toBe(409);
    expect(price('FLG-50-0201')).toBe(before);

    const fixed = await admin.send('PUT', `/api/admin/price-imports/${imp.id}/rows/${bad.row}`, { input: { part_number: 'AWL-50-0201', price: '12.50' } });
    expect((fixed.body as { counts: Record<string, number> }).counts.error).toBe(0);
    // These moves are over the default ±30 %: looked at and acknowledged (flags are covered in price-import-safety).
    expect((await admin.send('POST', `/api/admin/price-imports/${imp.id}/acknowledge`, { allFlagged: true, acknowledged: true })).status).toBe(200);
    const applied = await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`);
    expect(applied.status).toBe(200);
    expect(price('FLG-50-0201')).toBe(1995);
    expect(price('AWL-50-0201')).toBe(1250);
    const listed = (await t.get('/api/parts?q=FLG-50-0201')).body as { items: Array<{ partNumber: string; priceCents: number }> };
    expect(listed.items[0]).toMatchObject({ partNumber: 'FLG-50-0201', priceCents: 1995 });
    expect((await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`)).status).toBe(409);
  });

  it('adds a new part from a row that describes it, and refuses non-CSV uploads and other roles', async () => {
    const res = await upload('part_number,price,title,category,weight_kg,frame\nCHS-50-0990,24.00,CHS test flange gasket,gaskets-fittings,0.08,CHS\n');
    const imp = res.body as { id: number; counts: Record<string, number> };
    expect(imp.counts.new).toBe(1);
    expect((await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`)).status).toBe(200);
    expect((await t.get('/api/parts/CHS-50-0990')).status).toBe(200);
    expect((await upload('not,a,price,list', 'prices.exe')).status).toBe(415);
    const form = new FormData();
    form.set('file', new Blob(['part_number,price\nFLG-50-0201,1.00'], { type: 'text/csv' }), 'p.csv');
    expect((await (await createDealer(t)).client.upload('/api/admin/price-imports', form)).status).toBe(403);
  });
});

describe('roles on the warehouse and back-office routes', () => {
  const routes: Array<[method: string, path: string, body?: unknown]> = [
    ['GET', '/api/warehouse/pick-queue'],
    ['GET', '/api/warehouse/orders/SY-100001/pick-list'],
    ['GET', '/api/warehouse/pick-list?orders=SY-100001'],
    ['POST', '/api/warehouse/orders/SY-100001/picks', { lineId: 1, scannedPartNumber: 'FLG-50-0201', quantity: 1 }],
    ['POST', '/api/warehouse/orders/SY-100001/pack', { cartons: 1, weightKg: 1 }],
    ['POST', '/api/warehouse/orders/SY-100001/dispatch', { carrier: 'Tern Parcel', trackingNumber: 'TP-1' }],
    ['POST', '/api/warehouse/goods-in', { partNumber: 'FLG-50-0201', binCode: 'A-01-1', quantity: 1 }],
    ['POST', '/api/warehouse/adjustments', { partNumber: 'FLG-50-0201', binCode: 'A-01-1', delta: 1, reason: 'count' }],
    ['GET', '/api/warehouse/low-stock'],
    ['GET', '/api/warehouse/stock/FLG-50-0201'],
    ['GET', '/api/warehouse/bins'],
    ['GET', '/api/warehouse/returns'],
    ['POST', '/api/warehouse/returns/1/receive', { decision: 'reject', conditionGrade: 'scrap', rejectReason: 'no' }],
    ['GET', '/api/admin/parts/FLG-50-0201'],
    ['POST', '/api/admin/parts/FLG-50-0201/supersede', { replacedBy: 'AWL-50-0201' }],
    ['PUT', '/api/admin/parts/FLG-50-0201/links', { partNumbers: [] }],
    ['GET', '/api/admin/price-imports/1'],
    ['POST', '/api/admin/price-imports/1/apply'],
    ['GET', '/api/admin/dealers'],
    ['GET', '/api/admin/dealers/1/invoices'],
  ];

  it.each(routes)('%s %s: 401 signed out, 403 for a buyer, never reached by the wrong role', async (method, path, body) => {
    const anonymous = await t.send(method, path, body, { origin: t.url });
    expect(anonymous.status).toBe(401);
    const asBuyer = await retail.send(method, path, body);
    expect(asBuyer.status).toBe(403);
    if (path.startsWith('/api/admin')) expect((await floor.send(method, path, body)).status).toBe(403);
  });

  it('keeps buyers’ returns and photos to themselves', async () => {
    expect((await t.get('/api/returns')).status).toBe(401);
    expect((await floor.upload('/api/returns', new FormData())).status).toBe(403);
    expect((await retail.get('/api/returns/photos/00000000000000000000000000000000.png')).status).toBe(404);
  });
});

describe('part photos', () => {
  it('are uploaded by the office, listed on the part and served as images; other files are refused', async () => {
    const png = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d4944415478da63f8ffff3f0005fe02fea7d6a4530000000049454e44ae426082', 'hex');
    const form = new FormData();
    form.append('photo', new Blob([png], { type: 'image/png' }), 'housing.png');
    const res = await admin.upload('/api/admin/parts/CHS-30-0201/photos', form);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const [name] = (res.body as { images: string[] }).images;
    expect(name).toMatch(/^[a-f0-9]{32}\.png$/);
    const part = (await t.get('/api/parts/CHS-30-0201')).body as { images: string[] };
    expect(part.images).toContain(name);
    const image = await fetch(`${t.url}/api/parts/photos/${name}`);
    expect(image.status).toBe(200);
    expect(image.headers.get('content-type')).toBe('image/png');
    expect(Buffer.from(await image.arrayBuffer()).equals(png)).toBe(true);
    expect((await t.get('/api/parts/photos/..%2F..%2Fpackage.json')).status).toBe(404);
    const bad = new FormData();
    bad.append('photo', new Blob(['GIF89a'], { type: 'image/gif' }), 'x.gif');
    expect((await admin.upload('/api/admin/parts/CHS-30-0201/photos', bad)).status).toBe(415);
  });
});
