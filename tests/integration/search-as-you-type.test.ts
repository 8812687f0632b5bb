import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ImportPreviewSchema } from '../../shared/schemas/orders';
import { PartSuggestionsSchema } from '../../shared/schemas/parts';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const suggest = async (q: string) => {
  const res = await t.get(`/api/parts/suggest?q=${encodeURIComponent(q)}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return PartSuggestionsSchema.parse(res.body);
};
const crossReference = () =>
  t.db.$client
    .prepare("SELECT p.part_number AS partNumber, a.alias FROM parts p JOIN part_aliases a ON a.part_id = p.id WHERE a.kind = 'cross-reference' AND p.status = 'active' LIMIT 1 OFFSET 5")
    .get() as { partNumber: string; alias: string };

describe('GET /api/parts/suggest', () => {
  it('offers a few parts for a number typed so far, in number order, with the true number of matches', async () => {
    const r = await suggest('ful-20-02');
    expect(r.items.length).toBeGreaterThan(1);
    expect(r.items.length).toBeLessThanOrEqual(8);
    for (const item of r.items) expect(item.partNumber.startsWith('FUL-20-02')).toBe(true);
    expect(r.items.map((i) => i.partNumber)).toEqual([...r.items.map((i) => i.partNumber)].sort());
    expect(r.total).toBeGreaterThanOrEqual(r.items.length);
  });

  it('names the part a cross-reference stands for, as an exact match', async () => {
    const ref = crossReference();
    const r = await suggest(ref.alias);
    expect(r.items[0]).toMatchObject({ partNumber: ref.partNumber, exact: true, reason: `Cross-reference ${ref.alias}` });
  });

  it('offers the new unit before its exchange unit for a mistyped number', async () => {
    const r = await suggest('FUL-10-0230');
    const numbers = r.items.map((i) => i.partNumber);
    expect(numbers[0]).toBe('FUL-10-0203');
    expect(numbers.indexOf('FUL-10-0203-XCH')).not.toBe(0);
    expect(r.items[0]!.exact).toBe(false);
    // The exchange unit first only when its suffix was typed.
    expect((await suggest('FUL-10-0230-XCH')).items[0]!.partNumber).toBe('FUL-10-0203-XCH');
    // The order pad's suggestions for the unknown number likewise.
    const res = await t.send('POST', '/api/cart/check', { lines: [{ partNumber: 'FUL-10-0230', quantity: '1' }] });
    expect(ImportPreviewSchema.parse(res.body).rows[0]!.suggestions[0]?.partNumber).toBe('FUL-10-0203');
  });

  it('finds words as they are typed, the last one perhaps unfinished', async () => {
    const r = await suggest('ball bearing cartr');
    expect(r.items.length).toBeGreaterThan(0);
    for (const item of r.items) expect(item.title.toLowerCase()).toContain('cartridge');
  });

  it('refuses an empty or overlong query with the error shape', async () => {
    expect((await t.get('/api/parts/suggest?q=')).status).toBe(400);
    expect((await t.get(`/api/parts/suggest?q=${'x'.repeat(101)}`)).status).toBe(400);
  });
});

describe('POST /api/cart/check', () => {
  it('accepts a cross-reference that search resolves exactly, and says which part it is', async () => {
    const ref = crossReference();
    const res = await t.send('POST', '/api/cart/check', { lines: [{ partNumber: ref.alias, quantity: '1' }] });
    expect(res.status).toBe(200);
    const row = ImportPreviewSchema.parse(res.body).rows[0]!;
    expect(row).toMatchObject({ status: 'ok', partNumber: ref.partNumber, quantity: 1 });
    expect(row.message).toContain(`${ref.alias} is ${ref.partNumber}`);
  });

  it('takes the quantity as typed text or as a number', async () => {
    const res = await t.send('POST', '/api/cart/check', { lines: [{ partNumber: 'FUL-20-0203', quantity: 2 }, { partNumber: 'FUL-20-0203', quantity: '2' }] });
    expect(res.status).toBe(200);
    const rows = ImportPreviewSchema.parse(res.body).rows;
    expect(rows.map((r) => [r.status, r.quantity])).toEqual([
      ['ok', 2],
      ['ok', 2],
    ]);
  });
});
