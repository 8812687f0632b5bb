import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { PROJECT_ROOT } from '../../server/paths';

/*
 * The rebuild-kits category changed the CHECK on parts, so drizzle-kit rebuilt the table (create, copy, drop, rename),
 * which drops every trigger on it. The migration puts them back by hand; this compares the database before and after.
 */
const folder = path.join(PROJECT_ROOT, 'drizzle');
const journal = JSON.parse(fs.readFileSync(path.join(folder, 'meta', '_journal.json'), 'utf8')) as { entries: Array<{ tag: string }> };
const rebuildAt = journal.entries.findIndex((e) => fs.readFileSync(path.join(folder, `${e.tag}.sql`), 'utf8').includes("'rebuild-kits'"));

const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'parts-rebuild-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

/** A copy of the migrations folder that stops before the rebuild (its journal cut there). */
function migrationsBefore(): string {
  const copy = path.join(dir, 'drizzle-before');
  fs.cpSync(folder, copy, { recursive: true });
  fs.writeFileSync(path.join(copy, 'meta', '_journal.json'), JSON.stringify({ ...journal, entries: journal.entries.slice(0, rebuildAt) }));
  return copy;
}

function open(file: string) {
  const sqlite = new Database(file);
  sqlite.pragma('foreign_keys = OFF');
  return { sqlite, db: drizzle(sqlite) };
}

type MasterRow = { type: string; name: string; sql: string | null };
const onParts = (sqlite: Database.Database) =>
  sqlite
    .prepare("SELECT type, name, sql FROM sqlite_master WHERE (tbl_name = 'parts' AND type IN ('index', 'trigger')) OR (type = 'trigger' AND sql LIKE '%`parts`%') ORDER BY type, name")
    .all() as MasterRow[];
/** The category order expression gains the new category; every other index and trigger is to be the same text. */
const sameText = (s: string | null) => (s ?? '').replace(/\(CASE category .*? END\)/g, '(CASE category …)').replace(/\s+/g, ' ');

describe('the parts table rebuild for rebuild kits', () => {
  it('is a migration of its own, after the triggers it has to restore', () => {
    expect(rebuildAt).toBeGreaterThan(journal.entries.findIndex((e) => e.tag.startsWith('0014_')));
  });

  it('leaves parts with every index and trigger it had before, with the same definitions', () => {
    const file = path.join(dir, 'db.sqlite');
    const { sqlite, db } = open(file);
    migrate(db, { migrationsFolder: migrationsBefore() });
    const before = onParts(sqlite);
    expect(before.filter((r) => r.type === 'trigger').map((r) => r.name)).toEqual(
      expect.arrayContaining(['catalog_counts_part_insert', 'catalog_counts_part_update', 'catalog_counts_part_delete', 'parts_bearing_on_insert', 'part_specs_bearing_insert', 'parts_changed_insert', 'parts_available_changed']),
    );
    migrate(db, { migrationsFolder: folder });
    const after = onParts(sqlite);
    expect(after.map((r) => `${r.type} ${r.name}`)).toEqual(before.map((r) => `${r.type} ${r.name}`));
    for (const [i, row] of before.entries()) expect(sameText(after[i]!.sql), row.name).toBe(sameText(row.sql));
    // The account-change triggers the earlier rebuild of `user` dropped are back too.
    const userTriggers = sqlite.prepare("SELECT name FROM sqlite_master WHERE type = 'trigger' AND tbl_name = 'user' ORDER BY name").pluck().all();
    expect(userTriggers).toEqual(['user_changed_delete', 'user_changed_update']);
    // The expression indexes are on the expression (not on a column named like it) and list the new category.
    expect(after.find((r) => r.name === 'parts_browse_order_idx')?.sql).toMatch(/ON `parts` \(\(CASE category .*WHEN 'rebuild-kits' THEN 6 ELSE 7 END\)/);
    sqlite.close();
  });

  it('keeps catalog_counts following inserts, updates and deletes of parts after the rebuild', () => {
    const file = path.join(dir, 'counts.sqlite');
    const { sqlite, db } = open(file);
    migrate(db, { migrationsFolder: migrationsBefore() });
    sqlite.prepare("INSERT INTO frames (code, name, inducer_mm, exducer_mm, turbine_wheel_mm, power_min_hp, power_max_hp, max_flow_lb_min, max_pressure_ratio, max_shaft_rpm, weight_kg, flange_pattern, bearing_options, compressor_map) VALUES ('TST', 'Test', 30, 41, 37, 100, 200, 20, 3, 200000, 4, 'x', '[]', '{}')").run();
    const insert = sqlite.prepare("INSERT INTO parts (part_number, normalized_number, title, category, frame_code, price_cents, weight_grams, available) VALUES (?, ?, 'x', ?, 'TST', 100, 10, ?)");
    insert.run('TST-20-0201', 'TST200201', 'cartridges', 3);
    migrate(db, { migrationsFolder: folder });
    const count = (category: string, inStock: number) =>
      (sqlite.prepare("SELECT part_count AS n FROM catalog_counts WHERE category = ? AND frame_code = 'TST' AND in_stock = ?").get(category, inStock) as { n: number } | undefined)?.n ?? 0;
    expect(count('cartridges', 1)).toBe(1);

    insert.run('TST-70-0201', 'TST700201', 'rebuild-kits', 0);
    expect(count('rebuild-kits', 0)).toBe(1);
    sqlite.prepare("UPDATE parts SET available = 5 WHERE part_number = 'TST-70-0201'").run();
    expect(count('rebuild-kits', 0)).toBe(0);
    expect(count('rebuild-kits', 1)).toBe(1);
    // The bearing copy and the change log follow too.
    const id = (sqlite.prepare("SELECT id FROM parts WHERE part_number = 'TST-70-0201'").get() as { id: number }).id;
    sqlite.prepare("INSERT INTO part_specs (part_id, bearing) VALUES (?, 'journal')").run(id);
    expect((sqlite.prepare('SELECT bearing FROM parts WHERE id = ?').get(id) as { bearing: string }).bearing).toBe('journal');
    expect(sqlite.prepare("SELECT part_count AS n FROM catalog_counts WHERE category = 'rebuild-kits' AND bearing = 'journal'").get()).toEqual({ n: 1 });
    expect((sqlite.prepare('SELECT count(*) AS n FROM part_changes WHERE part_id = ?').get(id) as { n: number }).n).toBeGreaterThan(0);
    sqlite.prepare("DELETE FROM parts WHERE part_number = 'TST-20-0201'").run();
    expect(count('cartridges', 1)).toBe(0);
    // Recounted from scratch, the kept counts agree.
    const kept = sqlite.prepare('SELECT category, frame_code, bearing, status, in_stock, part_count FROM catalog_counts WHERE part_count > 0 ORDER BY 1, 2, 3, 4, 5').all();
    const fresh = sqlite
      .prepare("SELECT category, COALESCE(frame_code, '') AS frame_code, COALESCE(bearing, '') AS bearing, status, available > 0 AS in_stock, count(*) AS part_count FROM parts GROUP BY 1, 2, 3, 4, 5 ORDER BY 1, 2, 3, 4, 5")
      .all();
    expect(kept).toEqual(fresh);
    sqlite.close();
  });
});
