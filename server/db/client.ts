import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { PROJECT_ROOT } from '../paths';
import * as schema from './schema';

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

const migrationsFolder = path.join(PROJECT_ROOT, 'drizzle');

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
  writeTransactionsTakeTheLockFirst(db);
  return db;
}

/**
 * With several processes on one file, a transaction that reads before it writes must hold the write lock from its
 * start: a deferred one that read a snapshot while another process committed cannot upgrade and fails at once with
 * SQLITE_BUSY, never waiting (SQLite's documentation of BEGIN TRANSACTION and of SQLITE_BUSY_SNAPSHOT; BEGIN IMMEDIATE
 * takes the write lock at once, waiting through the busy timeout). So every Drizzle transaction begins IMMEDIATE unless it
 * asks otherwise (a read-only one passes `{ behavior: 'deferred' }`), and waits up to the busy timeout for its turn.
 */
function writeTransactionsTakeTheLockFirst(db: Db) {
  const begin = db.transaction.bind(db);
  db.transaction = ((transaction, config) => begin(transaction, { behavior: 'immediate', ...config })) as typeof db.transaction;
}
