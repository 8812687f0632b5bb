import path from 'node:path';
import { and, count, eq, gt, ne, sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase, type Db } from '../../server/db/client';
import { carts, catalogCounts, parts, partSpecs } from '../../server/db/schema';
import { createStockService } from '../../server/services/stock';
import type { PartsListResponse, PartsQuery } from '../../shared/schemas/parts';
import { PART_SORTS } from '../../shared/schemas/parts';
import { createPart } from '../support/factories';
import { signIn } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * The catalogue's lists: cached until the catalogue or stock changes (in any process on the file), with totals and
 * facet counts read from counts the database keeps, and pages read through indexes in each order.
 */
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ accounts: true });
});
afterAll(async () => {
  await t?.close();
});

const CARTRIDGES: PartsQuery = { category: 'cartridges' };
const list = (query: PartsQuery) => t.app.catalog.listPartsJson(query);
const read = (query: PartsQuery) => JSON.parse(list(query).json) as PartsListResponse;
const firstOf = (query: PartsQuery) => read(query).items[0]!;
const partId = (db: Db, partNumber: string) => db.select({ id: parts.id }).from(parts).where(eq(parts.partNumber, partNumber)).get()!.id;
const binOf = (db: Db, id: number) => db.$client.prepare('SELECT bin_code FROM stock WHERE part_id = ? ORDER BY bin_code LIMIT 1').pluck().get(id) as string;

describe('the catalogue list cache', () => {
  it('keeps its lists through sign-ins, cart lines and account changes', async () => {
    const cached = list(CARTRIDGES);
    expect(list(CARTRIDGES)).toBe(cached);

    const buyer = await signIn(t, 'retail@spoolyard.test');
    expect(list(CARTRIDGES)).toBe(cached);

    const added = await buyer.send('POST', '/api/cart/lines', { partNumber: firstOf(CARTRIDGES).partNumber, quantity: 2 });
    expect(added.status).toBe(201);
    const line = (added.body as { lines: Array<{ id: number }> }).lines[0]!;
    expect((await buyer.send('PATCH', `/api/cart/lines/${line.id}`, { quantity: 3 })).status).toBe(200);
    expect(list(CARTRIDGES)).toBe(cached);

    // A trade account decided: users and accounts change, the catalogue does not.
    const applicant = t.db.$client.prepare("SELECT id FROM dealer_accounts WHERE status = 'pending' LIMIT 1").pluck().get() as number;
    t.app.dealers.decide(applicant, { decision: 'approve', tier: 'standard', creditLimitCents: 100_000, paymentTermsDays: 30 });
    await buyer.send('POST', '/api/auth/sign-out', {});
    expect(list(CARTRIDGES)).toBe(cached);
  });

  it('drops its lists when a price or the stock changes', () => {
    const cached = list(CARTRIDGES);
    const part = firstOf(CARTRIDGES);
    t.db.update(parts).set({ priceCents: part.priceCents + 700 }).where(eq(parts.partNumber, part.partNumber)).run();
    const repriced = list(CARTRIDGES);
    expect(repriced).not.toBe(cached);
    expect(firstOf(CARTRIDGES).priceCents).toBe(part.priceCents + 700);

    const id = partId(t.db, part.partNumber);
    t.app.stock.goodsIn(id, binOf(t.db, id), 4, 'test');
    expect(list(CARTRIDGES)).not.toBe(repriced);
    expect(firstOf(CARTRIDGES).stock.available).toBe(part.stock.available + 4);
  });

  it('drops its lists when another connection to the file changes a price or the stock', () => {
    // A second connection stands in for a second app process: it shares nothing with this one but the file.
    const other = openDatabase(path.join(t.dir, 'test.db'));
    try {
      const cached = list(CARTRIDGES);
      const part = firstOf(CARTRIDGES);
      other.update(parts).set({ priceCents: part.priceCents + 1_100 }).where(eq(parts.partNumber, part.partNumber)).run();
      const repriced = list(CARTRIDGES);
      expect(repriced).not.toBe(cached);
      expect(firstOf(CARTRIDGES).priceCents).toBe(part.priceCents + 1_100);

      const id = partId(other, part.partNumber);
      createStockService(other).adjust(id, binOf(other, id), -1, 'test');
      expect(list(CARTRIDGES)).not.toBe(repriced);
      expect(firstOf(CARTRIDGES).stock.available).toBe(part.stock.available - 1);

      // And a cart line written through the other connection leaves the list alone.
      const settled = list(CARTRIDGES);
      other.insert(carts).values({ guestToken: 'other-connection-guest' }).run();
      expect(list(CARTRIDGES)).toBe(settled);
    } finally {
      other.$client.close();
    }
  });
});

/** The total and facets of a list counted the long way: every part, its specs joined, grouped in SQL. */
function countedByScan(db: Db, query: PartsQuery): Pick<PartsListResponse, 'total'> & Record<'category' | 'frame' | 'bearing' | 'stock', Record<string, number>> {
  const where = (skip: string | null) =>
    and(
      ne(parts.status, 'superseded'),
      query.category && skip !== 'category' ? eq(parts.category, query.category) : undefined,
      query.frame && skip !== 'frame' ? eq(parts.frameCode, query.frame) : undefined,
      query.bearing && skip !== 'bearing' ? eq(partSpecs.bearing, query.bearing) : undefined,
      query.inStock && skip !== 'stock' ? gt(parts.available, 0) : undefined,
    );
  const grouped = (skip: string, value: ReturnType<typeof sql<string | null>>) =>
    Object.fromEntries(
      db
        .select({ value, n: count() })
        .from(parts)
        .leftJoin(partSpecs, eq(partSpecs.partId, parts.id))
        .where(where(skip))
        .groupBy(value)
        .all()
        .filter((r) => r.value !== null)
        .map((r) => [r.value, r.n]),
    );
  return {
    total: db.select({ n: count() }).from(parts).leftJoin(partSpecs, eq(partSpecs.partId, parts.id)).where(where(null)).get()!.n,
    category: grouped('category', sql`${parts.category}`),
    frame: grouped('frame', sql`${parts.frameCode}`),
    bearing: grouped('bearing', sql`${partSpecs.bearing}`),
    stock: grouped('stock', sql`CASE WHEN ${parts.available} > 0 THEN 'true' ELSE 'false' END`),
  };
}

const asCounts = (facet: PartsListResponse['facets'][keyof PartsListResponse['facets']]) => Object.fromEntries(facet.map((f) => [f.value, f.count]));

function expectCountsTrue() {
  const queries: PartsQuery[] = [
    {},
    { category: 'turbochargers' },
    { category: 'cartridges', bearing: 'ball' },
    { bearing: 'journal', inStock: true },
    { frame: 'EDG', category: 'turbochargers', inStock: true },
    { category: 'gaskets-fittings', inStock: true },
  ];
  for (const query of queries) {
    const listed = t.app.catalog.listParts(query);
    const scanned = countedByScan(t.db, query);
    expect({ query, total: listed.total }).toEqual({ query, total: scanned.total });
    for (const f of ['category', 'frame', 'bearing', 'stock'] as const) expect({ query, f, counts: asCounts(listed.facets[f]) }).toEqual({ query, f, counts: scanned[f] });
  }
  // The kept counts themselves, group by group (zero groups aside).
  const kept = t.db
    .select({ category: catalogCounts.category, frame: catalogCounts.frameCode, bearing: catalogCounts.bearing, status: catalogCounts.status, inStock: catalogCounts.inStock, n: catalogCounts.partCount })
    .from(catalogCounts)
    .where(gt(catalogCounts.partCount, 0))
    .orderBy(catalogCounts.category, catalogCounts.frameCode, catalogCounts.bearing, catalogCounts.status, catalogCounts.inStock)
    .all();
  const frame = sql<string>`COALESCE(${parts.frameCode}, '')`;
  const bearing = sql<string>`COALESCE(${partSpecs.bearing}, '')`;
  const inStock = sql<boolean>`${parts.available} > 0`.mapWith((v) => v === 1);
  const scanned = t.db
    .select({ category: parts.category, frame, bearing, status: parts.status, inStock, n: count() })
    .from(parts)
    .leftJoin(partSpecs, eq(partSpecs.partId, parts.id))
    .groupBy(parts.category, frame, bearing, parts.status, inStock)
    .orderBy(parts.category, frame, bearing, parts.status, inStock)
    .all();
  expect(kept).toEqual(scanned);
}

describe('catalogue counts kept by the database', () => {
  it('equal a count of every part after parts and specs are added, changed and deleted', () => {
    expectCountsTrue();

    // Added through the catalogue service (part, then its specs) and straight into the tables (specs before the part).
    const made = [createPart(t, { category: 'turbochargers', frameCode: 'EDG', stock: 3 }), createPart(t, { category: 'cartridges', frameCode: null, stock: 0 })];
    t.db.update(partSpecs).set({ bearing: 'ball' }).where(eq(partSpecs.partId, made[0]!.id)).run();
    t.db.update(partSpecs).set({ bearing: 'journal' }).where(eq(partSpecs.partId, made[1]!.id)).run();
    t.db.transaction((tx) => {
      tx.run(sql`PRAGMA defer_foreign_keys = ON`);
      tx.insert(partSpecs).values({ partId: 900_001, bearing: 'ball' }).run();
      tx.insert(parts).values({ id: 900_001, partNumber: 'EDG-19-0001', normalizedNumber: 'EDG190001', title: 'Counted cartridge', category: 'cartridges', frameCode: 'EDG', priceCents: 40_000, weightGrams: 2_000 }).run();
    });
    expectCountsTrue();

    // Changed: category, frame, status, bearing, stock in and out.
    const turbo = t.db.select({ id: parts.id }).from(parts).where(eq(parts.category, 'turbochargers')).limit(3).all();
    t.db.update(parts).set({ category: 'cartridges' }).where(eq(parts.id, turbo[0]!.id)).run();
    t.db.update(parts).set({ frameCode: 'FUL', status: 'discontinued' }).where(eq(parts.id, turbo[1]!.id)).run();
    t.db.update(partSpecs).set({ bearing: null }).where(eq(partSpecs.partId, turbo[2]!.id)).run();
    t.db.update(partSpecs).set({ bearing: 'journal' }).where(eq(partSpecs.partId, 900_001)).run();
    t.app.stock.adjust(made[0]!.id, made[0]!.binCode, -3, 'test');
    t.app.stock.goodsIn(made[1]!.id, made[1]!.binCode, 5, 'test');
    const admin = t.db.$client.prepare("SELECT id FROM user WHERE role = 'admin' LIMIT 1").pluck().get() as string;
    t.app.catalogAdmin.supersede(admin, made[1]!.partNumber, 'EDG-19-0001');
    expectCountsTrue();

    // Deleted: a part with its specs (the delete cascades to them), and specs without their part.
    t.db.delete(partSpecs).where(eq(partSpecs.partId, turbo[0]!.id)).run();
    t.db.delete(parts).where(eq(parts.id, 900_001)).run();
    expect(t.db.select({ n: count() }).from(partSpecs).where(eq(partSpecs.partId, 900_001)).get()!.n).toBe(0);
    expectCountsTrue();
  });

  it('keep the bearing on each part equal to its specs', () => {
    const differing = t.db
      .select({ n: count() })
      .from(parts)
      .leftJoin(partSpecs, eq(partSpecs.partId, parts.id))
      .where(sql`${parts.bearing} IS NOT ${partSpecs.bearing}`)
      .get()!.n;
    expect(differing).toBe(0);
  });
});

describe('catalogue pages', () => {
  it('hold every part of a list exactly once, in every order and with filters', () => {
    const lists: PartsQuery[] = [
      ...PART_SORTS.map((sort) => ({ sort })),
      ...PART_SORTS.map((sort) => ({ category: 'turbochargers' as const, sort })),
      { bearing: 'ball', sort: 'price-desc' },
      { frame: 'EDG', bearing: 'journal', sort: 'title' },
      { minHp: 300, maxHp: 600, inStock: true },
    ];
    for (const query of lists) {
      const first = t.app.catalog.listParts({ ...query, pageSize: 100 });
      const seen: string[] = first.items.map((i) => i.partNumber);
      for (let page = 2; (page - 1) * 100 < first.total; page++) seen.push(...t.app.catalog.listParts({ ...query, pageSize: 100, page }).items.map((i) => i.partNumber));
      expect({ query, listed: seen.length }).toEqual({ query, listed: first.total });
      expect(new Set(seen).size).toBe(seen.length);
      // Past the last page: nothing, and the same total.
      const beyond = t.app.catalog.listParts({ ...query, pageSize: 100, page: Math.ceil(first.total / 100) + 1 });
      expect(beyond.items).toEqual([]);
      expect(beyond.total).toBe(first.total);
    }
  });
});
