import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PartDetailSchema, PartsListResponseSchema, FramesResponseSchema, type PartsListResponse } from '../../shared/schemas/parts';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

const list = async (qs: string) => {
  const res = await t.get(`/api/parts${qs}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return PartsListResponseSchema.parse(res.body);
};

const sql = <T>(query: string, ...params: unknown[]) => t.db.$client.prepare(query).all(...params) as T[];

describe('GET /api/health', () => {
  it('answers ok, with the usual security headers', async () => {
    const res = await t.get('/api/health');
    expect(res).toMatchObject({ status: 200, body: { ok: true } });
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    const csp = res.headers.get('content-security-policy') ?? '';
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers.get('x-powered-by')).toBeNull();
  });
});

describe('GET /api/frames', () => {
  it('lists every frame with its compressor ratings', async () => {
    const res = await t.get('/api/frames');
    expect(res.status).toBe(200);
    const { items } = FramesResponseSchema.parse(res.body);
    expect(items).toHaveLength(10);
    const first = items[0]!;
    expect(first).toMatchObject({ code: 'AWL', name: 'Awl', powerBandHp: [80, 150], maxFlowLbMin: 14.9, inducerMm: 30, exducerMm: 41 });
    expect(first.maxShaftRpm).toBeGreaterThan(200_000);
    expect(first.maxPressureRatio).toBeGreaterThan(2);
    expect(items.at(-1)!.powerBandHp[1]).toBeGreaterThanOrEqual(2000);
  });
});

describe('GET /api/parts', () => {
  it('pages through the catalogue with totals and facets', async () => {
    const page1 = await list('?pageSize=10');
    expect(page1.items).toHaveLength(10);
    expect(page1.total).toBeGreaterThanOrEqual(400);
    expect(page1.page).toBe(1);
    const page2 = await list('?pageSize=10&page=2');
    expect(page2.items[0]!.partNumber).not.toBe(page1.items[0]!.partNumber);
    const categoryTotal = page1.facets.category.reduce((s, f) => s + f.count, 0);
    expect(categoryTotal).toBe(page1.total);
    expect(page1.facets.category.map((f) => f.value)).toEqual([
      'turbochargers',
      'cartridges',
      'compressor-housings',
      'turbine-housings',
      'gaskets-fittings',
      'gauges-sensors',
      'rebuild-kits',
    ]);
  });

  it('filters by category, frame and bearing together', async () => {
    const r = await list('?category=cartridges&frame=FUL&bearing=ball');
    expect(r.total).toBeGreaterThan(0);
    for (const p of r.items) {
      expect(p.category).toBe('cartridges');
      expect(p.frameCode).toBe('FUL');
      expect(p.specs.bearing).toBe('ball');
    }
    // The category facet ignores its own filter, so the other categories of this frame still show.
    expect(r.facets.category.length).toBeGreaterThan(1);
  });

  it('filters by the frame power band and by stock', async () => {
    const r = await list('?minHp=1800&category=turbochargers&pageSize=100');
    expect(r.total).toBeGreaterThan(0);
    expect(new Set(r.items.map((p) => p.frameCode))).toEqual(new Set(['KRF']));
    const inStock = await list('?inStock=true&pageSize=100');
    for (const p of inStock.items) expect(p.stock.available).toBeGreaterThan(0);
    const all = await list('');
    expect(inStock.total).toBeLessThan(all.total);
  });

  it('sorts by price', async () => {
    const asc = await list('?category=gaskets-fittings&sort=price-asc&pageSize=50');
    const prices = asc.items.map((p) => p.priceCents);
    expect(prices).toEqual([...prices].sort((a, b) => a - b));
    const desc = await list('?category=gaskets-fittings&sort=price-desc&pageSize=5');
    expect(desc.items[0]!.priceCents).toBeGreaterThanOrEqual(prices.at(-1)!);
  });

  it('reports available stock as on hand less reserved, following every stock movement', async () => {
    const [row] = sql<{ id: number; partNumber: string; onHand: number; bin: string }>(
      'SELECT p.id, p.part_number AS partNumber, SUM(s.on_hand) AS onHand, min(s.bin_code) AS bin FROM parts p JOIN stock s ON s.part_id = p.id GROUP BY p.id HAVING SUM(s.on_hand) > 3 LIMIT 1',
    );
    t.app.stock.adjust(row!.id, row!.bin, -1, 'cycle count');
    const r = await list(`?q=${encodeURIComponent(row!.partNumber)}`);
    expect(r.items[0]!.stock.available).toBe(row!.onHand - 1);
    // The part's kept total agrees with the bins for every part in the catalogue.
    const drift = sql<{ n: number }>(
      'SELECT count(*) AS n FROM parts p WHERE p.available <> COALESCE((SELECT SUM(s.on_hand - s.reserved) FROM stock s WHERE s.part_id = p.id), 0)',
    );
    expect(drift[0]!.n).toBe(0);
    t.app.stock.adjust(row!.id, row!.bin, 1, 'cycle count');
  });

  it.each([
    ['?page=0', 'page'],
    ['?page=abc', 'page'],
    ['?pageSize=1000', 'pageSize'],
    ['?category=wheels', 'category'],
    ['?bearing=roller', 'bearing'],
    ['?sort=random', 'sort'],
    ['?inStock=yes', 'inStock'],
    ['?minHp=500&maxHp=100', 'minHp'],
    ['?frame=%27%3B%20DROP%20TABLE%20parts', 'frame'],
    [`?q=${'x'.repeat(101)}`, 'q'],
    ['?category=turbochargers&category=cartridges', 'category'],
  ])('refuses %s with 400 and a field error', async (qs, field) => {
    const res = await t.get(`/api/parts${qs}`);
    expect(res.status).toBe(400);
    const body = res.body as { error: { message: string; fieldErrors: Record<string, string[]> } };
    expect(body.error.message).toBeTruthy();
    expect(body.error.fieldErrors[field]?.[0]).toBeTruthy();
    expect(sql<{ n: number }>('SELECT count(*) AS n FROM parts')[0]!.n).toBeGreaterThan(400);
  });
});

describe('GET /api/parts/:partNumber', () => {
  it('answers a part with specs, stock, cross-references and the parts that go with it', async () => {
    const [withRef] = sql<{ partNumber: string; alias: string }>(
      "SELECT p.part_number AS partNumber, a.alias FROM parts p JOIN part_aliases a ON a.part_id = p.id WHERE a.kind = 'cross-reference' AND p.category = 'turbochargers' LIMIT 1",
    );
    const res = await t.get(`/api/parts/${withRef!.partNumber}`);
    expect(res.status).toBe(200);
    const part = PartDetailSchema.parse(res.body);
    expect(part.partNumber).toBe(withRef!.partNumber);
    expect(part.specs.turbineAr).toBeGreaterThan(0);
    expect(part.crossReferences.map((x) => x.number)).toContain(withRef!.alias);
    expect(part.goesWith.length).toBeGreaterThan(0);
    expect(part.goesWith.some((g) => g.category === 'gaskets-fittings')).toBe(true);
    expect(part.frame?.code).toBe(part.frameCode);
    expect(part.supersededBy).toBeNull();
  });

  it('finds a part by its number typed without dashes and in lower case', async () => {
    const res = await t.get('/api/parts/chs100201');
    expect(res.status).toBe(200);
    expect(PartDetailSchema.parse(res.body).partNumber).toBe('CHS-10-0201');
  });

  it('answers a superseded number with the part and what replaces it', async () => {
    const [old] = sql<{ partNumber: string; supersededBy: string }>(
      "SELECT part_number AS partNumber, superseded_by AS supersededBy FROM parts WHERE status = 'superseded' LIMIT 1",
    );
    const res = await t.get(`/api/parts/${old!.partNumber}`);
    expect(res.status).toBe(200);
    const part = PartDetailSchema.parse(res.body);
    expect(part.status).toBe('superseded');
    expect(part.supersededBy).toBe(old!.supersededBy);
    expect(part.replacement?.partNumber).toBe(old!.supersededBy);
    const replacement = PartDetailSchema.parse((await t.get(`/api/parts/${old!.supersededBy}`)).body);
    expect(replacement.earlierNumbers).toContain(old!.partNumber);
  });

  it('answers 404 with the error shape for an unknown part', async () => {
    const res = await t.get('/api/parts/QQQ-90-0000');
    expect(res.status).toBe(404);
    expect((res.body as { error: { message: string } }).error.message).toMatch(/QQQ-90-0000/);
  });

  it('answers unknown API routes with 404 JSON', async () => {
    const res = await t.get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body).toMatchObject({ error: { message: expect.any(String) } });
  });

  it('answers malformed JSON bodies with 400, never 500', async () => {
    const res = await fetch(`${t.url}/api/parts`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"broken' });
    expect(res.status).toBe(400);
  });
});

describe('search', () => {
  const first = (r: PartsListResponse) => r.items[0]!;

  it('ranks the exact part number first, however it is typed', async () => {
    for (const typed of ['FUL-20-0203', 'ful200203', 'ful 20 0203', 'FUL-20-0203 ']) {
      const r = await list(`?q=${encodeURIComponent(typed)}`);
      expect(first(r).partNumber, typed).toBe('FUL-20-0203');
      expect(first(r).matched?.[0]?.kind).toBe('part-number');
    }
  });

  it('finds a number with a digit swapped or dropped and says it is close', async () => {
    // DRF-20-0203 with two digits swapped, and with one digit dropped.
    for (const typed of ['DRF-20-0230', 'DRF20203', 'drf-02-0203']) {
      const r = await list(`?q=${typed}`);
      const numbers = r.items.slice(0, 5).map((p) => p.partNumber);
      expect(numbers, typed).toContain('DRF-20-0203');
    }
    const r = await list('?q=DRF-20-0230');
    const hit = r.items.find((p) => p.partNumber === 'DRF-20-0203');
    expect(hit?.matched?.map((m) => m.kind)).toContain('near-number');
  });

  it('finds the replacement from an old superseded number', async () => {
    const [old] = sql<{ partNumber: string; supersededBy: string }>(
      "SELECT part_number AS partNumber, superseded_by AS supersededBy FROM parts WHERE status = 'superseded' AND category = 'cartridges' LIMIT 1",
    );
    const r = await list(`?q=${old!.partNumber.toLowerCase().replace(/-/g, '')}`);
    expect(first(r).partNumber).toBe(old!.partNumber);
    const replacement = r.items.find((p) => p.partNumber === old!.supersededBy);
    expect(replacement?.matched?.some((m) => m.kind === 'superseded' && m.text.includes(old!.partNumber))).toBe(true);
    expect(r.items.indexOf(replacement!)).toBe(1);
  });

  it('finds a part from a cross-reference number', async () => {
    const [ref] = sql<{ partNumber: string; alias: string }>(
      "SELECT p.part_number AS partNumber, a.alias FROM parts p JOIN part_aliases a ON a.part_id = p.id WHERE a.kind = 'cross-reference' LIMIT 1 OFFSET 3",
    );
    const r = await list(`?q=${encodeURIComponent(ref!.alias.replace(/[\s-]/g, ''))}`);
    expect(first(r).partNumber).toBe(ref!.partNumber);
    expect(first(r).matched?.[0]).toMatchObject({ kind: 'cross-reference' });
  });

  it('finds parts by words, with numbers among them', async () => {
    const r = await list(`?q=${encodeURIComponent('ball bearing cartridge ful')}`);
    expect(r.total).toBeGreaterThan(0);
    const top = first(r);
    expect(top.category).toBe('cartridges');
    expect(top.specs.bearing).toBe('ball');
    expect(top.frameCode).toBe('FUL');
    expect(top.matched?.[0]?.kind).toBe('words');
  });

  it('forgives a typo in words and says what it read', async () => {
    const r = await list(`?q=${encodeURIComponent('exhuast gas temperture gauge')}`);
    expect(r.total).toBeGreaterThan(0);
    expect(first(r).specs.gaugeType).toBe('egt');
    expect(first(r).matched?.[0]?.text).toMatch(/did you mean/);
  });

  it('combines a search with filters and answers nothing found as an empty list', async () => {
    const r = await list(`?q=turbocharger&frame=BUR&bearing=journal`);
    expect(r.total).toBeGreaterThan(0);
    for (const p of r.items) expect([p.frameCode, p.specs.bearing]).toEqual(['BUR', 'journal']);
    const none = await list('?q=qqqqzzzz');
    expect(none).toMatchObject({ total: 0, items: [] });
  });

  it('follows catalogue changes at once, whoever wrote them', async () => {
    const [row] = sql<{ id: number }>("SELECT id FROM parts WHERE part_number = 'FLG-50-0201'");
    // A write outside the app (another process) is logged by the triggers, and the next search reads it.
    t.db.$client.prepare("UPDATE parts SET title = 'Flange gasket quokkafoil' WHERE id = ?").run(row!.id);
    expect(first(await list('?q=quokkafoil')).partNumber).toBe('FLG-50-0201');
    t.app.search.refresh([row!.id]);
    expect(first(await list('?q=quokkafoil')).partNumber).toBe('FLG-50-0201');
  });
});
