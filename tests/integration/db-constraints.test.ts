import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { generateCatalogue } from '../../catalog-seed/generate';
import { loadCatalogue } from '../../catalog-seed/load';
import { openDatabase } from '../../server/db/client';
import { afterAll, describe, expect, it } from 'vitest';
import { ORDER_STATUSES, PART_STATUSES, STOCK_MOVEMENT_KINDS } from '../../shared/allowed-values';
import { parts, stock, stockMovements } from '../../server/db/schema';
import { createTestDb } from '../support/test-app';
import { databaseMigratedBefore } from '../support/old-migrations';

/**
 * The database holds the rules the code holds: allowed values (from shared/allowed-values.ts), the stock ledger's
 * invariant (on hand ≥ 0, 0 ≤ reserved ≤ on hand) and money that is never negative. Each write below breaks one.
 */
describe('database constraints', () => {
  const { db, dir } = createTestDb();
  afterAll(() => {
    db.$client.close();
    fs.rmSync(dir, { recursive: true, force: true });
  });
  const somePart = () => db.select({ id: parts.id }).from(parts).limit(1).get()!;
  const someStock = () => db.select().from(stock).limit(1).get()!;

  it('opens every connection in WAL mode with statement journals in memory', () => {
    const sqlite = db.$client;
    expect(sqlite.pragma('journal_mode', { simple: true })).toBe('wal');
    // 2 = MEMORY (SQLite's PRAGMA temp_store): no temporary file per transaction that needs a statement journal.
    expect(sqlite.pragma('temp_store', { simple: true })).toBe(2);
    expect(sqlite.pragma('synchronous', { simple: true })).toBe(1);
  });

  it('refuses a status, kind or zone outside the shared lists', () => {
    const { id } = somePart();
    expect(() => db.$client.prepare("UPDATE parts SET status = 'lost' WHERE id = ?").run(id)).toThrow(/CHECK constraint failed: parts_status_ck/);
    expect(() => db.$client.prepare("UPDATE parts SET category = 'spoons' WHERE id = ?").run(id)).toThrow(/parts_category_ck/);
    for (const status of PART_STATUSES) db.$client.prepare('UPDATE parts SET status = ? WHERE id = ?').run(status, id);
    const row = someStock();
    expect(() =>
      db.insert(stockMovements).values({ partId: row.partId, binCode: row.binCode, kind: 'borrowed' as (typeof STOCK_MOVEMENT_KINDS)[number] }).run(),
    ).toThrow(/stock_movements_kind_ck/);
    expect(ORDER_STATUSES).toContain('back_ordered');
    const checkSql = db.$client.prepare("SELECT sql FROM sqlite_master WHERE name = 'orders'").pluck().get() as string;
    for (const status of ORDER_STATUSES) expect(checkSql).toContain(`'${status}'`);
  });

  it('holds the stock invariant: nothing negative, never more reserved than on hand', () => {
    const row = someStock();
    const set = (values: { onHand?: number; reserved?: number }) => () =>
      db.$client.prepare('UPDATE stock SET on_hand = coalesce(?, on_hand), reserved = coalesce(?, reserved) WHERE part_id = ? AND bin_code = ?').run(values.onHand ?? null, values.reserved ?? null, row.partId, row.binCode);
    expect(set({ onHand: -1, reserved: 0 })).toThrow(/stock_levels_ck/);
    expect(set({ reserved: -1 })).toThrow(/stock_levels_ck/);
    expect(set({ reserved: row.onHand + 1 })).toThrow(/stock_levels_ck/);
    expect(set({ reserved: row.onHand })).not.toThrow();
    set({ reserved: row.reserved })();
  });

  it('keeps money at or above zero', () => {
    const { id } = somePart();
    expect(() => db.$client.prepare('UPDATE parts SET price_cents = -1 WHERE id = ?').run(id)).toThrow(/parts_money_ck/);
    expect(() => db.$client.prepare('UPDATE parts SET core_deposit_cents = -5 WHERE id = ?').run(id)).toThrow(/parts_money_ck/);
  });

  it('keeps the change-feed triggers (a later table rebuild would drop them silently)', () => {
    const triggers = db.$client.prepare("SELECT name FROM sqlite_master WHERE type = 'trigger' ORDER BY name").pluck().all() as string[];
    for (const table of ['parts', 'part_specs', 'part_aliases', 'frames']) {
      for (const event of ['insert', 'update', 'delete']) expect(triggers).toContain(`${table}_changed_${event}`);
    }
    expect(triggers).toContain('parts_available_changed');
    // The catalogue's kept counts and the bearing copied onto each part (drizzle/0014_list_indexes_and_counts.sql).
    for (const name of ['catalog_counts_part_insert', 'catalog_counts_part_update', 'catalog_counts_part_delete', 'parts_bearing_on_insert']) expect(triggers).toContain(name);
    for (const event of ['insert', 'update', 'delete']) expect(triggers).toContain(`part_specs_bearing_${event}`);
    // A part's GTIN filled in when written without one, and checked for 13 digits (drizzle/0019_gtin_backfill.sql).
    for (const name of ['parts_gtin_fill', 'parts_gtin_insert_ck', 'parts_gtin_update_ck']) expect(triggers).toContain(name);
  });

  it('indexes every foreign-key column (as the first column of some index or key)', () => {
    const sqlite = db.$client;
    const tables = sqlite.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name NOT LIKE '%fts%' AND name NOT LIKE '%tri%'").pluck().all() as string[];
    const missing: string[] = [];
    for (const table of tables) {
      const fks = sqlite.prepare(`SELECT "from" FROM pragma_foreign_key_list(?)`).pluck().all(table) as string[];
      if (fks.length === 0) continue;
      const leading = new Set<string>();
      for (const index of sqlite.prepare('SELECT name FROM pragma_index_list(?)').pluck().all(table) as string[]) {
        const first = sqlite.prepare('SELECT name FROM pragma_index_info(?) WHERE seqno = 0').pluck().get(index) as string | undefined;
        if (first) leading.add(first);
      }
      const pk = sqlite.prepare('SELECT name FROM pragma_table_info(?) WHERE pk = 1').pluck().get(table) as string | undefined;
      if (pk) leading.add(pk);
      for (const column of fks) if (!leading.has(column)) missing.push(`${table}.${column}`);
    }
    expect(missing).toEqual([]);
  });
});

/**
 * A database made before the constraints keeps every row when it is migrated: the table rebuilds run with foreign
 * keys off (server/db/client.ts), so dropping the old `parts` does not cascade into specs, aliases or stock.
 */
describe('migrating a database that has data', () => {
  it('keeps every part, spec, alias and stock row through the rebuilds', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-migrate-'));
    try {
      const { sqlite, file } = databaseMigratedBefore(dir, (tag) => tag >= '0006');
      // Today's loader writes today's columns, so the catalogue is loaded into a current database and its rows copied
      // into the old one, column by column as far as the old tables have them.
      const current = openDatabase(path.join(dir, 'current.db'));
      loadCatalogue(current, generateCatalogue());
      // Rebuild kits are a category added after these migrations (its CHECK came with it): an old database never held one.
      const kits = "(SELECT id FROM parts WHERE category = 'rebuild-kits')";
      for (const [table, column] of [['stock_movements', 'part_id'], ['stock', 'part_id'], ['part_links', 'part_id'], ['part_links', 'related_part_id'], ['part_aliases', 'part_id'], ['part_specs', 'part_id'], ['parts', 'id']]) {
        current.$client.exec(`DELETE FROM ${table} WHERE ${column} IN ${kits}`);
      }
      current.$client.close();
      sqlite.prepare('ATTACH ? AS current').run(path.join(dir, 'current.db'));
      sqlite.pragma('foreign_keys = OFF');
      for (const table of ['frames', 'bins', 'parts', 'part_specs', 'part_aliases', 'part_links', 'stock', 'stock_movements']) {
        const columns = (sqlite.pragma(`main.table_info(${table})`) as Array<{ name: string }>).map((c) => `"${c.name}"`).join(', ');
        sqlite.exec(`INSERT INTO main.${table} (${columns}) SELECT ${columns} FROM current.${table}`);
      }
      sqlite.pragma('foreign_keys = ON');
      sqlite.exec('DETACH current');
      const count = (table: string) => sqlite.prepare(`SELECT count(*) FROM ${table}`).pluck().get() as number;
      const tables = ['parts', 'part_specs', 'part_aliases', 'part_links', 'stock'];
      const counts = Object.fromEntries(tables.map((t) => [t, count(t)]));
      sqlite.close();
      expect(counts.parts).toBeGreaterThan(100);

      const db = openDatabase(file);
      try {
        for (const t of tables) expect(db.$client.prepare(`SELECT count(*) FROM ${t}`).pluck().get(), t).toBe(counts[t]);
        expect(db.$client.pragma('foreign_keys', { simple: true })).toBe(1);
      } finally {
        db.$client.close();
      }
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
});
