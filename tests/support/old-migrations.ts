import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import * as schema from '../../server/db/schema';

/**
 * A database file in `dir` migrated only as far as the migrations before the first one `stopAt` names (by its tag, e.g.
 * `0006_…`), as a database made by an older release would be; opening it with `openDatabase` then applies the rest.
 */
export function databaseMigratedBefore(dir: string, stopAt: (tag: string) => boolean): { sqlite: Database.Database; file: string } {
  const folder = path.join(dir, 'migrations');
  fs.mkdirSync(path.join(folder, 'meta'), { recursive: true });
  const source = path.resolve(import.meta.dirname, '../../drizzle');
  const journal = JSON.parse(fs.readFileSync(path.join(source, 'meta/_journal.json'), 'utf8')) as { entries: Array<{ tag: string }> };
  const stop = journal.entries.findIndex((e) => stopAt(e.tag));
  if (stop < 0) throw new Error('no migration matches');
  const before = journal.entries.slice(0, stop);
  for (const e of before) fs.copyFileSync(path.join(source, `${e.tag}.sql`), path.join(folder, `${e.tag}.sql`));
  fs.writeFileSync(path.join(folder, 'meta/_journal.json'), JSON.stringify({ ...journal, entries: before }));
  const file = path.join(dir, 'old.db');
  const sqlite = new Database(file);
  sqlite.pragma('foreign_keys = ON');
  migrate(drizzle(sqlite, { schema }), { migrationsFolder: folder });
  return { sqlite, file };
}
