import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuditPage, PriceImport, PriceImportHistory } from '../../shared/schemas/admin-catalog';
import { createDealer, createUser } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let admin: Client;
let adminName: string;
let dealer: Client;
beforeAll(async () => {
  t = await startTestApp();
  const [office, trade] = await Promise.all([createUser(t, { role: 'admin', name: 'Wren Tallow' }), createDealer(t)]);
  [admin, dealer, adminName] = [office.client, trade.client, 'Wren Tallow'];
});
afterAll(async () => {
  await t.close();
});

const one = <T>(q: string, ...p: unknown[]) => t.db.$client.prepare(q).get(...p) as T;
const price = (n: string) => one<{ p: number }>('SELECT price_cents AS p FROM parts WHERE part_number = ?', n).p;
const dollars = (cents: number) => (cents / 100).toFixed(2);
const upload = (csv: string, name: string) => {
  const form = new FormData();
  form.set('file', new Blob([csv], { type: 'text/csv' }), name);
  return admin.upload('/api/admin/price-imports', form);
};
const view = async (id: number) => (await admin.get(`/api/admin/price-imports/${id}`)).body as PriceImport;

describe('safe price imports', () => {
  it('flags absurd prices, refuses to apply them until acknowledged, then records the import, its diff and an audit entry per part', async () => {
    const exchange = one<{ n: string; p: number; c: number }>(
      "SELECT part_number AS n, price_cents AS p, core_deposit_cents AS c FROM parts WHERE condition = 'exchange' AND status = 'active' ORDER BY id LIMIT 1",
    );
    const plain = ['FLG-50-0201', 'AWL-50-0201', 'BUR-50-0201', 'CHS-50-0201'].map((n) => ({ n, p: price(n) }));
    const [hundredfold, penny, gentle, tenPct] = plain as [{ n: string; p: number }, { n: string; p: number }, { n: string; p: number }, { n: string; p: number }];
    const csv = [
      'part_number,price,core_deposit',
      `${hundredfold.n},${dollars(hundredfold.p * 100)},`,
      `${penny.n},0.01,`,
      `${exchange.n},${dollars(exchange.p)},${dollars(exchange.p + 10_000)}`,
      `${gentle.n},${dollars(Math.round(gentle.p * 1.05))},`,
      `${tenPct.n},${dollars(Math.round(tenPct.p * 1.1))},`,
    ].join('\n');
    const res = await upload(csv, 'autumn-prices.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const imp = res.body as PriceImport;
    expect(imp.maxChangePct).toBe(30);
    expect(imp.counts.changed).toBe(5);
    expect(imp.flagged).toBe(3);
    expect(imp.unacknowledged).toBe(3);
    const row = (r: PriceImport, n: string) => r.rows.find((x) => x.partNumber === n)!;
    expect(row(imp, hundredfold.n).flags).toEqual(['large-change']);
    expect(row(imp, hundredfold.n).flagNotes?.[0]).toBe('price +9,900 % (more than ±30 %)');
    expect(row(imp, penny.n).flags).toEqual(['large-change', 'near-zero']);
    expect(row(imp, exchange.n).flags).toEqual(['core-over-price']);
    expect(row(imp, gentle.n).flags).toEqual([]);
    // Flagged rows come right after errors, so they are never hidden past the first page.
    expect(imp.rows.slice(0, 3).every((r) => (r.flags?.length ?? 0) > 0)).toBe(true);

    // Nothing applies while a flagged row waits.
    const refused = await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`, {});
    expect(refused.status).toBe(409);
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/3 flagged rows are not acknowledged/);
    expect(price(hundredfold.n)).toBe(hundredfold.p);
    expect(price(penny.n)).toBe(penny.p);

    // One row acknowledged is not enough; a row that is not flagged cannot be acknowledged.
    let after = (await admin.send('POST', `/api/admin/price-imports/${imp.id}/acknowledge`, { rows: [row(imp, hundredfold.n).row], acknowledged: true })).body as PriceImport;
    expect(after.unacknowledged).toBe(2);
    expect(row(after, hundredfold.n).acknowledged).toBe(true);
    expect((await admin.send('POST', `/api/admin/price-imports/${imp.id}/acknowledge`, { rows: [row(imp, gentle.n).row], acknowledged: true })).status).toBe(400);
    expect((await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`, {})).status).toBe(409);

    // A tighter threshold flags the 10 % row too; the acknowledgement given stands for the flag it covered.
    expect((await admin.send('PUT', `/api/admin/price-imports/${imp.id}/settings`, { maxChangePct: 0 })).status).toBe(400);
    after = (await admin.send('PUT', `/api/admin/price-imports/${imp.id}/settings`, { maxChangePct: 8 })).body as PriceImport;
    expect(after.maxChangePct).toBe(8);
    expect(after.flagged).toBe(4);
    expect(row(after, tenPct.n).flags).toEqual(['large-change']);
    expect(row(after, hundredfold.n).acknowledged).toBe(true);
    after = (await admin.send('PUT', `/api/admin/price-imports/${imp.id}/settings`, { maxChangePct: 30 })).body as PriceImport;
    expect(after.flagged).toBe(3);
    expect(after.unacknowledged).toBe(2);

    // Every flagged row at once, explicitly; taking it back makes them wait again.
    after = (await admin.send('POST', `/api/admin/price-imports/${imp.id}/acknowledge`, { allFlagged: true, acknowledged: false })).body as PriceImport;
    expect(after.unacknowledged).toBe(3);
    after = (await admin.send('POST', `/api/admin/price-imports/${imp.id}/acknowledge`, { allFlagged: true, acknowledged: true })).body as PriceImport;
    expect(after.unacknowledged).toBe(0);

    // Applying says what the person confirmed; another count applies nothing.
    expect((await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`, { expectChanges: 4 })).status).toBe(409);
    expect(price(gentle.n)).toBe(gentle.p);
    const applied = await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`, { expectChanges: 5 });
    expect(applied.status, JSON.stringify(applied.body)).toBe(200);
    expect(price(hundredfold.n)).toBe(hundredfold.p * 100);
    expect(price(penny.n)).toBe(1);
    expect(one<{ c: number }>('SELECT core_deposit_cents AS c FROM parts WHERE part_number = ?', exchange.n).c).toBe(exchange.p + 10_000);

    // The history says who, when, which file and how many rows changed; the diff stays viewable.
    const history = (await admin.get('/api/admin/price-imports')).body as PriceImportHistory;
    const listed = history.items.find((i) => i.id === imp.id)!;
    expect(listed).toMatchObject({ fileName: 'autumn-prices.csv', status: 'applied', createdBy: adminName, appliedBy: adminName, changedCount: 5, newCount: 0, flaggedCount: 3, totalRows: 5 });
    expect(listed.appliedAt).toBeTruthy();
    const diff = await view(imp.id);
    expect(diff.appliedBy).toBe(adminName);
    expect(row(diff, hundredfold.n)).toMatchObject({ oldPriceCents: hundredfold.p, newPriceCents: hundredfold.p * 100, acknowledged: true });
    expect(row(diff, exchange.n)).toMatchObject({ oldCoreCents: exchange.c, newCoreCents: exchange.p + 10_000 });

    // One audit entry per part changed, naming the import.
    const audit = (await admin.get(`/api/admin/audit?part=${hundredfold.n}`)).body as AuditPage;
    expect(audit.items).toHaveLength(1);
    expect(audit.items[0]).toMatchObject({ action: 'price-imported', user: adminName, partNumber: hundredfold.n, priceImportId: imp.id, priceImportFile: 'autumn-prices.csv' });
    expect(audit.items[0]!.changes).toEqual({ priceCents: { from: hundredfold.p, to: hundredfold.p * 100 } });
    const byImport = (await admin.get(`/api/admin/audit?import=${imp.id}`)).body as AuditPage;
    expect(byImport.total).toBe(5);
    expect(new Set(byImport.items.map((i) => i.partNumber))).toEqual(new Set([hundredfold.n, penny.n, exchange.n, gentle.n, tenPct.n]));
    expect((await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`, {})).status).toBe(409);
  });

  it('records an edit by hand with the fields that changed, and filters the log by part, user and date, a page at a time', async () => {
    const form = (await admin.get('/api/admin/parts/FLG-50-0202')).body as Record<string, unknown> & { priceCents: number; specs: Record<string, unknown> };
    const { images: _i, supersededBy: _s, goesWith: _g, ...body } = form;
    const saved = await admin.send('PUT', '/api/admin/parts/FLG-50-0202', { ...body, priceCents: form.priceCents + 100, minStock: 7 });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    const edits = (await admin.get('/api/admin/audit?part=flg-50-0202')).body as AuditPage;
    expect(edits.items[0]).toMatchObject({ action: 'part-edited', user: adminName, priceImportId: null });
    expect(edits.items[0]!.changes).toEqual({ priceCents: { from: form.priceCents, to: form.priceCents + 100 }, minStock: { from: form.minStock, to: 7 } });
    // Saving the same form again changes nothing, so it writes nothing.
    await admin.send('PUT', '/api/admin/parts/FLG-50-0202', { ...body, priceCents: form.priceCents + 100, minStock: 7 });
    expect(((await admin.get('/api/admin/audit?part=FLG-50-0202')).body as AuditPage).total).toBe(1);

    // Sixty gentle changes in one import: the log pages them, 50 to a page.
    const numbers = t.db.$client.prepare("SELECT part_number AS n, price_cents AS p FROM parts WHERE category = 'gaskets-fittings' AND price_cents >= 500 AND part_number NOT LIKE 'FLG-50-020%' ORDER BY id LIMIT 60").all() as Array<{ n: string; p: number }>;
    const imp = (await upload(['part_number,price', ...numbers.map((x) => `${x.n},${dollars(x.p + 1)}`)].join('\n'), 'gaskets.csv')).body as PriceImport;
    expect(imp.flagged).toBe(0);
    expect((await admin.send('POST', `/api/admin/price-imports/${imp.id}/apply`, { expectChanges: 60 })).status).toBe(200);
    const today = new Date().toISOString().slice(0, 10);
    const first = (await admin.get(`/api/admin/audit?user=tallow&from=${today}&to=${today}`)).body as AuditPage;
    expect(first.total).toBeGreaterThanOrEqual(66);
    expect(first.items).toHaveLength(50);
    const last = Math.ceil(first.total / 50);
    const lastPage = (await admin.get(`/api/admin/audit?user=tallow&from=${today}&page=${last}`)).body as AuditPage;
    expect(lastPage.items.length).toBe(first.total - (last - 1) * 50);
    expect(new Set([...first.items, ...lastPage.items].map((i) => i.id)).size).toBe(first.items.length + lastPage.items.length);
    expect(((await admin.get('/api/admin/audit?to=2000-01-01')).body as AuditPage).total).toBe(0);
    expect(((await admin.get('/api/admin/audit?user=nobody-of-that-name')).body as AuditPage).total).toBe(0);
    expect((await admin.get('/api/admin/audit?from=yesterday')).status).toBe(400);
    expect((await dealer.get('/api/admin/audit')).status).toBe(403);
    expect((await dealer.get('/api/admin/price-imports')).status).toBe(403);
  });
});
