import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { gtinForPart, isValidGtin13 } from '../../shared/gtin';
import { formatSerial } from '../../shared/unit-serial';
import { createDealer, createPart, createUser } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let floor: Client;
let admin: Client;

beforeAll(async () => {
  t = await startTestApp({ fakes: true });
  [floor, admin] = (await Promise.all([createUser(t, { role: 'warehouse' }), createUser(t, { role: 'admin' })])).map((u) => u.client) as [Client, Client];
}, 60_000);
afterAll(async () => {
  await t.close();
});

const one = <T>(q: string, ...p: unknown[]) => t.db.$client.prepare(q).get(...p) as T;
/** The same GTIN with its last digit wrong. */
const badCheckDigit = (gtin: string) => `${gtin.slice(0, 12)}${(Number(gtin[12]) + 1) % 10}`;
const scan = (code: string, accepts = 'part,bin,return') => floor.get(`/api/warehouse/scan?${new URLSearchParams({ code, accepts }).toString()}`);

describe('GTINs on parts', () => {
  it('every part has a valid, unique GTIN made from its id (also a part written without one)', () => {
    const rows = t.db.$client.prepare('SELECT id, gtin FROM parts').all() as Array<{ id: number; gtin: string }>;
    expect(rows.length).toBeGreaterThan(100);
    for (const r of rows) expect(r.gtin, `part ${r.id}`).toBe(gtinForPart(r.id));
    expect(new Set(rows.map((r) => r.gtin)).size).toBe(rows.length);
    // A writer that leaves it out (a price import's new part) gets one from the database, the same way.
    t.db.$client.prepare("INSERT INTO parts (part_number, normalized_number, title, category, price_cents, weight_grams) VALUES ('FLG-59-9990', 'FLG599990', 'Bare row', 'gaskets-fittings', 100, 10)").run();
    const bare = one<{ id: number; gtin: string }>("SELECT id, gtin FROM parts WHERE part_number = 'FLG-59-9990'");
    expect(bare.gtin).toBe(gtinForPart(bare.id));
    expect(() => t.db.$client.prepare("UPDATE parts SET gtin = '123' WHERE id = ?").run(bare.id)).toThrow(/13 digits/);
    expect(() => t.db.$client.prepare('UPDATE parts SET gtin = ? WHERE id = ?').run(gtinForPart(1), bare.id)).toThrow(/UNIQUE/);
  });

  it('the part page, the list and the Office editor carry it', async () => {
    const part = createPart(t, { stock: 1 });
    const detail = (await floor.get(`/api/parts/${part.partNumber}`)).body as { gtin: string };
    expect(detail.gtin).toBe(gtinForPart(part.id));
    const list = (await floor.get('/api/parts?pageSize=5')).body as { items: Array<{ gtin: string }> };
    for (const item of list.items) expect(isValidGtin13(item.gtin)).toBe(true);
    const form = (await admin.get(`/api/admin/parts/${part.partNumber}`)).body as { gtin: string };
    expect(form.gtin).toBe(detail.gtin);
    const svg = await floor.get(`/api/parts/${part.partNumber}/gtin.svg`);
    expect(svg.status).toBe(200);
    expect(svg.headers.get('content-type')).toMatch(/image\/svg\+xml/);
    expect(String(svg.body)).toMatch(/^<svg/);
  });

  it('search finds a part by its GTIN, typed with spaces too, that part first', async () => {
    const part = createPart(t, { stock: 0 });
    const gtin = gtinForPart(part.id);
    for (const q of [gtin, `${gtin.slice(0, 1)} ${gtin.slice(1, 7)} ${gtin.slice(7)}`]) {
      const res = (await floor.get(`/api/parts?q=${encodeURIComponent(q)}`)).body as { items: Array<{ partNumber: string; matched: Array<{ kind: string }> }> };
      expect(res.items[0]?.partNumber, q).toBe(part.partNumber);
      expect(res.items[0]?.matched[0]?.kind).toBe('gtin');
    }
    const suggest = (await floor.get(`/api/parts/suggest?q=${gtin}`)).body as { items: Array<{ partNumber: string; exact: boolean }> };
    expect(suggest.items[0]).toMatchObject({ partNumber: part.partNumber, exact: true });
    // The order pad takes it as the part's number.
    const { client: dealer } = await createDealer(t);
    const checked = await dealer.send('POST', '/api/cart/check', { lines: [{ partNumber: gtin, quantity: '1' }] });
    expect(checked.status, JSON.stringify(checked.body)).toBe(200);
    expect((checked.body as { rows: Array<Record<string, unknown>> }).rows[0]).toMatchObject({ status: 'ok', partNumber: part.partNumber });
    // A wrong check digit names no part.
    const wrong = (await floor.get(`/api/parts?q=${badCheckDigit(gtin)}`)).body as { items: Array<{ partNumber: string }> };
    expect(wrong.items.map((i) => i.partNumber)).not.toContain(part.partNumber);
  });
});

describe('one scan resolver for the Floor', () => {
  it('reads a part number, a GTIN, a cross-reference, a bin and a return number', async () => {
    const part = createPart(t, { stock: 2, binCode: 'B-03-2' });
    const gtin = gtinForPart(part.id);
    expect((await scan(part.partNumber.toLowerCase().replace(/-/g, ''))).body).toMatchObject({ kind: 'part', via: 'part-number', part: { partNumber: part.partNumber, gtin } });
    expect((await scan(` ${gtin} `)).body).toMatchObject({ kind: 'part', via: 'gtin', part: { partNumber: part.partNumber } });
    const alias = one<{ alias: string; partNumber: string }>(
      "SELECT a.alias, p.part_number AS partNumber FROM part_aliases a JOIN parts p ON p.id = a.part_id WHERE a.kind = 'cross-reference' AND (SELECT count(*) FROM part_aliases b WHERE b.normalized_alias = a.normalized_alias) = 1 LIMIT 1",
    );
    expect((await scan(alias.alias)).body).toMatchObject({ kind: 'part', via: 'cross-reference', part: { partNumber: alias.partNumber } });
    expect((await scan('b032')).body).toMatchObject({ kind: 'bin', bin: { code: 'B-03-2' } });

    const dealer = await createDealer(t);
    for (const l of [{ partNumber: part.partNumber, quantity: 1 }]) expect((await dealer.client.send('POST', '/api/cart/lines', l)).status).toBe(201);
    const number = ((await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-SCAN' })).body as { order: { number: string } }).order.number;
    const [line] = ((await floor.get(`/api/warehouse/orders/${number}/pick-list`)).body as { lines: Array<{ lineId: number }> }).lines;
    expect((await floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: line!.lineId, scannedPartNumber: gtin, quantity: 1 })).status).toBe(200);
    expect((await floor.send('POST', `/api/warehouse/orders/${number}/dispatch`, { carrier: 'Tern Parcel', trackingNumber: 'TP-SCAN', cartons: 1, weightKg: 1 })).status).toBe(200);
    const order = (await dealer.client.get(`/api/orders/${number}`)).body as { lines: Array<{ id: number }> };
    const form = new FormData();
    for (const [k, v] of Object.entries({ orderNumber: number, lineId: order.lines[0]!.id, kind: 'wrong-part', quantity: 1, reason: 'Ordered the wrong flange' })) form.set(k, String(v));
    const ret = (await dealer.client.upload('/api/returns', form)).body as { reference: string };
    expect((await scan(ret.reference.toLowerCase().replace('-', ' '), 'return')).body).toMatchObject({ kind: 'return', return: { reference: ret.reference } });
  });

  it('refuses a wrong check digit, a label of another kind and a code that names nothing, in plain words', async () => {
    const part = createPart(t, { stock: 1 });
    const bad = await scan(badCheckDigit(gtinForPart(part.id)));
    expect(bad.status).toBe(400);
    expect((bad.body as { error: { message: string } }).error.message).toMatch(/not a valid GTIN: its check digit is \d, it should be \d/);
    const wrongKind = await scan(part.partNumber, 'return');
    expect(wrongKind.status).toBe(400);
    expect((wrongKind.body as { error: { message: string } }).error.message).toMatch(new RegExp(`That is ${part.partNumber}'s part label, not a return label`));
    const nothing = await scan('ZZZ-00-0001', 'part');
    expect(nothing.status).toBe(404);
    expect((await scan('x', 'workshop')).status).toBe(400);
    // The Bench's codes (a service request's label, a unit's serial plate) are named too when a Floor field gets one.
    const unit = t.db.$client
      .prepare("INSERT INTO units (serial, part_id, frame_code, bearing, origin) SELECT ?, id, frame_code, 'journal', 'booked-in' FROM parts WHERE category = 'turbochargers' LIMIT 1 RETURNING serial")
      .get(formatSerial(2026, 999_042)) as { serial: string };
    const plate = await scan(unit.serial.replace(/-/g, ''), 'part,bin');
    expect(plate.status).toBe(400);
    expect((plate.body as { error: { message: string } }).error.message).toBe(`That is unit ${unit.serial}'s serial plate, not a part label: scan a part number such as FUL-20-0203 or a 13-digit GTIN or a bin code such as A-01-2`);
  });

  it('pick refuses a GTIN with a wrong check digit and records nothing; another part’s GTIN is the wrong part', async () => {
    const dealer = await createDealer(t);
    const a = createPart(t, { stock: 2 });
    const b = createPart(t, { stock: 2 });
    expect((await dealer.client.send('POST', '/api/cart/lines', { partNumber: a.partNumber, quantity: 1 })).status).toBe(201);
    const number = ((await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-GTIN' })).body as { order: { number: string } }).order.number;
    const [line] = ((await floor.get(`/api/warehouse/orders/${number}/pick-list`)).body as { lines: Array<{ lineId: number }> }).lines;
    const pick = (code: string) => floor.send('POST', `/api/warehouse/orders/${number}/picks`, { lineId: line!.lineId, scannedPartNumber: code, quantity: 1 });
    const bad = await pick(badCheckDigit(gtinForPart(a.id)));
    expect(bad.status).toBe(400);
    expect((bad.body as { error: { message: string } }).error.message).toMatch(/check digit/);
    const other = await pick(gtinForPart(b.id));
    expect(other.status).toBe(409);
    expect((other.body as { error: { message: string } }).error.message).toContain(`(${b.partNumber}) but this line is ${a.partNumber}`);
    expect(one<{ n: number }>('SELECT quantity_picked AS n FROM order_lines WHERE id = ?', line!.lineId).n).toBe(0);
    expect((await pick(gtinForPart(a.id))).status).toBe(200);
  });

  it('goods-in takes a GTIN and gives a receipt whose labels print', async () => {
    const part = createPart(t, { stock: 0 });
    const res = await floor.send('POST', '/api/warehouse/goods-in', { partNumber: gtinForPart(part.id), binCode: 'C-02-1', quantity: 3 });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const reply = res.body as { partNumber: string; receipt: string };
    expect(reply.partNumber).toBe(part.partNumber);
    expect(reply.receipt).toMatch(/^GI-\d+$/);
    const sheet = (await floor.get(`/api/warehouse/labels?receipts=${reply.receipt}`)).body as { parts: Array<{ partNumber: string; binCode: string; copies: number; gtin: string; barcodeSvg: string }>; total: number };
    expect(sheet.parts).toEqual([expect.objectContaining({ partNumber: part.partNumber, binCode: 'C-02-1', copies: 3, gtin: gtinForPart(part.id) })]);
    expect(sheet.parts[0]!.barcodeSvg).toMatch(/^<svg/);
    expect(sheet.total).toBe(3);
  });
});

describe('label sheets', () => {
  it('draws part labels (EAN-13) and bin labels (Code 128) with copies, and names what it could not find', async () => {
    const part = createPart(t, { stock: 1, binCode: 'A-02-1' });
    const res = await floor.get(`/api/warehouse/labels?parts=${part.partNumber}*2,NOPE-00-0000&binFrom=A-01-1&binTo=A-01-4&copies=1`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const sheet = res.body as { parts: Array<{ partNumber: string; copies: number; binCode: string; shortName: string }>; bins: Array<{ code: string; barcodeSvg: string }>; total: number; problems: string[] };
    expect(sheet.parts).toEqual([expect.objectContaining({ partNumber: part.partNumber, copies: 2, binCode: 'A-02-1' })]);
    expect(sheet.bins.map((b) => b.code)).toEqual(['A-01-1', 'A-01-2', 'A-01-3', 'A-01-4']);
    expect(sheet.bins[0]!.barcodeSvg).toMatch(/^<svg/);
    expect(sheet.total).toBe(6);
    expect(sheet.problems).toEqual([expect.stringMatching(/^NOPE-00-0000: /)]);
  });

  it('refuses too many labels, an unknown bin, an empty choice, and buyers', async () => {
    expect((await floor.get('/api/warehouse/labels?binFrom=A-01-1&binTo=F-12-4&copies=2')).status).toBe(400);
    expect((await floor.get('/api/warehouse/labels?binFrom=Q-01-1')).status).toBe(400);
    expect((await floor.get('/api/warehouse/labels')).status).toBe(400);
    const { client: buyer } = await createDealer(t);
    expect((await buyer.get('/api/warehouse/labels?binFrom=A-01-1')).status).toBe(403);
    expect((await buyer.get('/api/warehouse/scan?code=A-01-1')).status).toBe(403);
  });
});
