import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';
import { gtinForPart, GTIN_MAX_ITEM_REFERENCE } from '../../shared/gtin';

// Found by name, whatever number the migration carries.
const DRIZZLE = path.resolve(import.meta.dirname, '../../drizzle');
const MIGRATION = path.join(DRIZZLE, fs.readdirSync(DRIZZLE).find((f) => f.endsWith('_gtin_backfill.sql')) ?? 'missing_gtin_backfill.sql');

describe('the GTIN backfill migration', () => {
  it('gives existing rows and rows written later the GTIN shared/gtin.ts makes from their id', () => {
    const db = new Database(':memory:');
    db.exec('CREATE TABLE parts (id INTEGER PRIMARY KEY AUTOINCREMENT, title TEXT, gtin TEXT)');
    const insert = db.prepare('INSERT INTO parts (title) VALUES (?)');
    for (let i = 0; i < 2500; i++) insert.run('before');
    for (const statement of fs.readFileSync(MIGRATION, 'utf8').split('--> statement-breakpoint')) db.prepare(statement).run();
    for (let i = 0; i < 500; i++) insert.run('after');
    db.prepare('INSERT INTO parts (id, title) VALUES (?, ?)').run(GTIN_MAX_ITEM_REFERENCE, 'last');
    const rows = db.prepare('SELECT id, gtin FROM parts').all() as Array<{ id: number; gtin: string }>;
    expect(rows).toHaveLength(3001);
    for (const r of rows) if (r.gtin !== gtinForPart(r.id)) expect.fail(`part ${r.id}: ${r.gtin} ≠ ${gtinForPart(r.id)}`);
    expect(() => db.prepare("UPDATE parts SET gtin = '24731' WHERE id = 1").run()).toThrow(/13 digits/);
    expect(() => db.prepare("INSERT INTO parts (title, gtin) VALUES ('x', '12345678901a3')").run()).toThrow(/13 digits/);
    db.close();
  });
});
