import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import type { Db } from '../../server/db/client';
import { BACKGROUND_REBUILD_ABOVE } from '../../server/services/search';
import { PartsQuerySchema } from '../../shared/schemas/parts';
import { offlineDeps } from '../support/app-deps';
import { createTestDb } from '../support/test-app';

// A catalogue of 3,000 parts: common words match far more parts than one page, or than any old cut-off.
let db: Db;
let dir: string;
let app: ReturnType<typeof createApp>;
beforeAll(() => {
  ({ db, dir } = createTestDb({ parts: 3000 }));
  app = createApp(offlineDeps(db));
});
afterAll(() => {
  db.$client.close();
  fs.rmSync(dir, { recursive: true, force: true });
});

const list = (q: string, extra: Record<string, string> = {}) => app.catalog.listParts(PartsQuerySchema.parse({ q, ...extra }));

/**
 * The parts whose words (as the index reads them: title, description, frame name, condition and spec text) hold
 * the whole word, counted in SQL: the word between characters that are not letters, digits or a dot.
 */
function sqlCount(word: string): number {
  const text = `' ' || lower(p.title || ' ' || p.description || ' ' || coalesce(f.name, '') || ' ' || p.condition || ' ' ||
    coalesce(s.flange_pattern, '') || ' ' || coalesce(s.material, '') || ' ' || coalesce(s.gauge_type, '') || ' ' ||
    coalesce(s.range_text, '') || ' ' || coalesce(s.mounting, '') || ' ' || coalesce(s.connection, '') || ' ' ||
    coalesce(s.wastegate, '') || ' ' || coalesce(s.cooling, '') || ' ' || coalesce(s.bearing, '')) || ' '`;
  return Number(
    db.$client
      .prepare(
        `SELECT count(*) FROM parts p LEFT JOIN frames f ON f.code = p.frame_code LEFT JOIN part_specs s ON s.part_id = p.id
         WHERE ${text} GLOB '*[^a-z0-9.]${word}[^a-z0-9.]*' OR ${text} GLOB '*[^a-z0-9.]${word}.[^a-z0-9]*'`,
      )
      .pluck()
      .get(),
  );
}

describe('search over every match', () => {
  it('counts every part holding a common word: the total equals a SQL count and the facets add up to it', () => {
    // The house brand is in almost every title.
    const r = list('vanecraft', { pageSize: '10' });
    const counted = sqlCount('vanecraft');
    expect(counted).toBeGreaterThan(1000);
    expect(r.total).toBe(counted);
    for (const facet of ['category', 'frame', 'stock'] as const) expect(r.facets[facet].reduce((s, f) => s + f.count, 0), facet).toBe(r.total);
    // A filter narrows the total to what its facet counted.
    const cartridges = r.facets.category.find((f) => f.value === 'cartridges')!;
    expect(list('vanecraft', { category: 'cartridges' }).total).toBe(cartridges.count);
    expect(sqlCount('cartridge')).toBe(list('cartridge').total);
  });

  it('pages through all of them, best first, each part once', () => {
    const total = list('cartridge').total;
    const seen = new Set<string>();
    let page = 1;
    for (;;) {
      const r = list('cartridge', { pageSize: '100', page: String(page) });
      for (const p of r.items) seen.add(p.partNumber);
      if (r.items.length < 100) break;
      page++;
    }
    expect(seen.size).toBe(total);
    // Cartridges (the word in the title) before parts that only mention it.
    expect(list('cartridge').items[0]!.category).toBe('cartridges');
  });

  it('finds a part added or edited afterwards at once, for a common word', () => {
    const before = list('cartridge').total;
    const template = db.$client.prepare("SELECT * FROM parts WHERE category = 'cartridges' AND status = 'active' LIMIT 1").get() as Record<string, unknown>;
    // Written straight to the database, as another process would: the change log tells this one.
    const { lastInsertRowid } = db.$client
      .prepare(
        "INSERT INTO parts (part_number, normalized_number, title, category, frame_code, price_cents, weight_grams, description) VALUES ('FUL-29-9901', 'FUL299901', 'Vanecraft cartridge, numbat seal', 'cartridges', ?, 41000, 2100, '')",
      )
      .run(template.frame_code);
    const added = list('cartridge', { pageSize: '100', sort: 'number' });
    expect(added.total).toBe(before + 1);
    expect(list('numbat cartridge').items.map((p) => p.partNumber)).toEqual(['FUL-29-9901']);
    // Edited: a new word is found, and the word it lost no longer finds it.
    db.$client.prepare("UPDATE parts SET title = 'Vanecraft cartridge, quoll seal' WHERE id = ?").run(lastInsertRowid);
    expect(list('quoll').items.map((p) => p.partNumber)).toEqual(['FUL-29-9901']);
    expect(list('numbat').items.map((p) => p.partNumber)).not.toContain('FUL-29-9901');
    expect(list('cartridge').total).toBe(before + 1);
    // Found by its number too, exactly and mistyped.
    expect(list('FUL-29-9901').items[0]!.partNumber).toBe('FUL-29-9901');
    expect(list('FUL-29-9910').items[0]!.partNumber).toBe('FUL-29-9901');
  });

  it('indexes a large change again in a worker thread, the old index answering until the new one is swapped in', async () => {
    const ids = db.$client.prepare(`SELECT id FROM parts WHERE category = 'gaskets-fittings' LIMIT ${BACKGROUND_REBUILD_ABOVE + 50}`).pluck().all() as number[];
    expect(ids.length).toBe(BACKGROUND_REBUILD_ABOVE + 50);
    db.$client.prepare(`UPDATE parts SET title = title || ' wombatfoil' WHERE id IN (${ids.join(',')})`).run();
    const generation = app.search.generation();
    // The change is too large to apply here: the next search starts a rebuild and is answered by the current index.
    expect(list('wombatfoil').total).toBe(0);
    expect(list('vanecraft').total).toBeGreaterThan(1000);
    expect(app.search.generation()).toBe(generation);
    await app.search.settled();
    expect(app.search.generation()).toBeGreaterThan(generation);
    expect(list('wombatfoil').total).toBe(ids.length);
  });
});
