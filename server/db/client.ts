import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import * as schema from './schema';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

const migrationsFolder = path.resolve(import.meta.dirname, '../../drizzle');

/** Opens (and creates) the SQLite file with WAL and foreign keys on, and applies pending migrations. */
export function openDatabase(file: string): Db {
  if (file !== ':memory:') fs.mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma('busy_timeout = 5000');
  sqlite.pragma('synchronous = NORMAL');
  const db = drizzle(sqlite, { schema }) as Db;
  // A migration that adds a constraint rebuilds its table (create, copy, drop, rename). With foreign keys on, the drop
  // would cascade into the rows that point at the table, and the switch cannot be made inside the migration's own
  // transaction: so migrations run with it off, and every reference is checked before it goes back on (SQLite's
  // documented procedure for altering a table, "Making Other Kinds Of Table Schema Changes").
  sqlite.pragma('foreign_keys = OFF');
  migrate(db, { migrationsFolder });
  const broken = sqlite.pragma('foreign_key_check') as unknown[];
  if (broken.length > 0) throw new Error(`the database has ${broken.length} broken references after migrating: ${JSON.stringify(broken.slice(0, 3))}`);
  sqlite.pragma('foreign_keys = ON');
  return db;
}
