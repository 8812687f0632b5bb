import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDealer, createPart, createUser } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';
import { catalogueLinkOf, partsOfPiece, piecesOf } from '../../shared/exploded-view';
import type { FrameDetail, FramesResponseSchema, PartsListResponse } from '../../shared/schemas/parts';
import type { z } from 'zod';

let t: TestApp;
let floor: Client;

beforeAll(async () => {
  t = await startTestApp({ fakes: true });
  floor = (await createUser(t, { role: 'warehouse' })).client;
}, 60_000);
afterAll(async () => {
  await t.close();
});

/** Every part number the catalogue lists for a query, page by page. */
async function catalogueNumbers(query: Record<string, string>): Promise<string[]> {
  const numbers: string[] = [];
  for (let page = 1; ; page++) {
    const res = await t.get(`/api/parts?${new URLSearchParams({ ...query, pageSize: '100', page: String(page) }).toString()}`);
    expect(res.status).toBe(200);
    const body = res.body as PartsListResponse;
    numbers.push(...body.items.map((p) => p.partNumber));
    if (numbers.length >= body.total) return numbers.sort();
  }
}

describe('a frame page’s pieces', () => {
  it('for every frame of the demo catalogue, each piece opens exactly what the catalogue lists for the frame and its category', async () => {
    const frames = (await t.get('/api/frames')).body as z.infer<typeof FramesResponseSchema>;
    expect(frames.items.length).toBe(10);
    for (const f of frames.items) {
      const res = await t.get(`/api/frames/${f.code}`);
      expect(res.status).toBe(200);
      const frame = res.body as FrameDetail;
      expect(frame.turbineWheelMm).toBeGreaterThan(0);
      expect(frame.turbineArOptions.length).toBeGreaterThan(0);
      for (const piece of piecesOf(frame)) {
        const opened = partsOfPiece(piece, frame.code, frame.parts).map((p) => p.partNumber).sort();
        const link = catalogueLinkOf(piece, frame.code);
        if (!link) {
          expect(opened, `${f.code} ${piece.id}`).toEqual([]);
          continue;
        }
        const listed = await catalogueNumbers(Object.fromEntries(new URL(link, 'http://x').searchParams));
        expect(opened, `${f.code} ${piece.id}`).toEqual(listed);
        expect(opened.length, `${f.code} ${piece.id}`).toBeGreaterThan(0);
      }
    }
  }, 60_000);

  it('answers 404 for a frame that does not exist', async () => {
    expect((await t.get('/api/frames/ZZZ')).status).toBe(404);
    expect((await t.get('/api/frames/not-a-code')).status).toBe(404);
  });
});

describe('orientation travels with the order', () => {
  const unit = () => createPart(t, { title: 'Test complete turbocharger', category: 'turbochargers', frameCode: 'CHS', stock: 10, weightGrams: 8000 });

  it('keeps one cart line per orientation, carries it to the order line, the pick list, the slip and the confirmation mail', async () => {
    const dealer = await createDealer(t);
    const { partNumber } = unit();
    const add = (body: object) => dealer.client.send('POST', '/api/cart/lines', { partNumber, quantity: 1, ...body });
    expect((await add({ orientation: { compressorOutlet: '3:00', turbineInlet: '8:00' } })).status).toBe(201);
    expect((await add({ orientation: { compressorOutlet: '3:00', turbineInlet: '8:00' } })).status).toBe(201);
    const cart = (await add({})).body as { lines: Array<{ partNumber: string; quantity: number; orientation: unknown }> };
    // The same part in two orientations is two lines; no orientation asked means the standard one.
    expect(cart.lines.map((l) => [l.quantity, l.orientation])).toEqual([
      [2, { compressorOutlet: '3:00', turbineInlet: '8:00' }],
      [1, { compressorOutlet: '12:00', turbineInlet: '6:00' }],
    ]);

    const placed = await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-CLOCK' });
    expect(placed.status, JSON.stringify(placed.body)).toBe(201);
    const number = (placed.body as { order: { number: string } }).order.number;

    const order = (await dealer.client.get(`/api/orders/${number}`)).body as { lines: Array<{ quantity: number; orientation: unknown }> };
    expect(order.lines.map((l) => [l.quantity, l.orientation])).toEqual([
      [2, { compressorOutlet: '3:00', turbineInlet: '8:00' }],
      [1, { compressorOutlet: '12:00', turbineInlet: '6:00' }],
    ]);
    // The floor's pick list is also what the packing slip prints.
    const pick = (await floor.get(`/api/warehouse/orders/${number}/pick-list`)).body as { lines: Array<{ quantity: number; orientation: unknown }> };
    expect(pick.lines.map((l) => [l.quantity, l.orientation])).toEqual([
      [2, { compressorOutlet: '3:00', turbineInlet: '8:00' }],
      [1, { compressorOutlet: '12:00', turbineInlet: '6:00' }],
    ]);
    const batch = (await floor.get(`/api/warehouse/pick-list?orders=${number}`)).body as { lines: Array<{ orientation: unknown }> };
    expect(batch.lines.map((l) => l.orientation)).toContainEqual({ compressorOutlet: '3:00', turbineInlet: '8:00' });

    await t.mailSettled();
    const mail = (await t.mail!.messages()).find((m) => m.to.includes(dealer.email) && m.subject.includes(`Order ${number} confirmed`));
    expect(mail?.text).toContain("Built with: Compressor outlet 3 o'clock, turbine inlet 8 o'clock (viewed from the compressor inlet)");
    expect(mail?.text).toContain('standard position');
  });

  it('carries the orientation again on reorder', async () => {
    const dealer = await createDealer(t);
    const { partNumber } = unit();
    expect((await dealer.client.send('POST', '/api/cart/lines', { partNumber, quantity: 1, orientation: { compressorOutlet: '10:30', turbineInlet: '2:00' } })).status).toBe(201);
    const placed = await dealer.client.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-AGAIN' });
    const number = (placed.body as { order: { number: string } }).order.number;
    expect((await dealer.client.send('POST', `/api/orders/${number}/reorder`)).status).toBe(201);
    const cart = (await dealer.client.get('/api/cart')).body as { lines: Array<{ partNumber: string; orientation: unknown }> };
    expect(cart.lines).toEqual([expect.objectContaining({ partNumber, orientation: { compressorOutlet: '10:30', turbineInlet: '2:00' } })]);
  });

  it('refuses a position the frame does not offer, and any orientation on a part that is not a complete unit', async () => {
    const dealer = await createDealer(t);
    const { partNumber } = unit();
    const gasket = createPart(t, { stock: 5 });
    const wrong = await dealer.client.send('POST', '/api/cart/lines', { partNumber, quantity: 1, orientation: { compressorOutlet: '2:00', turbineInlet: '6:00' } });
    expect(wrong.status).toBe(400);
    expect(JSON.stringify(wrong.body)).toMatch(/compressor outlet/);
    const unknown = await dealer.client.send('POST', '/api/cart/lines', { partNumber, quantity: 1, orientation: { compressorOutlet: '5:15', turbineInlet: '6:00' } });
    expect(unknown.status).toBe(400);
    const notUnit = await dealer.client.send('POST', '/api/cart/lines', { partNumber: gasket.partNumber, quantity: 1, orientation: { compressorOutlet: '12:00', turbineInlet: '6:00' } });
    expect(notUnit.status).toBe(400);
    expect(JSON.stringify(notUnit.body)).toMatch(/not a complete turbocharger/);
    const cart = (await dealer.client.get('/api/cart')).body as { lines: unknown[] };
    expect(cart.lines).toEqual([]);
    // A part that is not a complete unit goes in without one.
    const plain = (await dealer.client.send('POST', '/api/cart/lines', { partNumber: gasket.partNumber, quantity: 1 })).body as { lines: Array<{ orientation: unknown }> };
    expect(plain.lines[0]!.orientation).toBeNull();
  });

  it('the database refuses half an orientation or a position we do not name', () => {
    const sqlite = t.db.$client;
    const line = sqlite.prepare('SELECT id FROM order_lines LIMIT 1').pluck().get() as number;
    expect(() => sqlite.prepare("UPDATE order_lines SET compressor_outlet_clock = '3:00', turbine_inlet_clock = NULL WHERE id = ?").run(line)).toThrow(/CHECK/);
    expect(() => sqlite.prepare("UPDATE order_lines SET compressor_outlet_clock = '5:15', turbine_inlet_clock = '6:00' WHERE id = ?").run(line)).toThrow(/CHECK/);
  });
});
