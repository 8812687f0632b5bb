import fs from 'node:fs';
import path from 'node:path';
import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { PROJECT_ROOT } from '../paths';
import { checkpointOnlyAsBackstop } from './checkpoints';
import * as schema from './schema';

/** How long a statement waits for another connection's lock before it fails. */
const BUSY_TIMEOUT_MS = 5000;

export type Db = BetterSQLite3Database<typeof schema> & { $client: Database.Database };

const migrationsFolder = path.join(PROJECT_ROOT, 'drizzle');

/** Opens (and creates) the SQLite file with WAL and foreign keys on, and applies pending migrations. */
export function openDatabase(file: string): Db {
  if (file !== ':memory:') fs.mkdirSync(path.dirname(path.resolve(file)), { recursive: true });
  const sqlite = new Database(file);
  sqlite.pragma('journal_mode = WAL');
  sqlite.pragma(`busy_timeout = ${BUSY_TIMEOUT_MS}`);
  sqlite.pragma('synchronous = NORMAL');
  // A transaction's statement journal (a statement with triggers, or one that may stop halfway) is kept in memory
  // rather than in a temporary file: no file created, written and deleted in /var/tmp for each order. (Reading the
  // file through a memory map, tried too, halved the read calls but cost 10 % more CPU per card order with two
  // processes: 3 interleaved runs each.)
  sqlite.pragma('temp_store = MEMORY');
  // Checkpoints run on a timer in one process (./checkpoints.ts); SQLite's own stays only as a backstop.
  checkpointOnlyAsBackstop(sqlite);
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
  reuseStatements(db, sqlite);
  return db;
}

/** Statements kept per connection; the least recently used goes first. Far more than the app's distinct queries. */
const STATEMENTS_KEPT = 500;

/** The part of Drizzle's better-sqlite3 session this module reaches into (drizzle-orm/better-sqlite3/session.js). */
interface DrizzleSession {
  client: Database.Database;
  prepareQuery: (query: unknown, fields: unknown, executeMethod: unknown, arrayMode: unknown, mapper: unknown, ...rest: unknown[]) => unknown;
}

/**
 * Drizzle prepares a statement for every query it runs (its session calls `client.prepare(sql)` each time); SQLite then
 * parses and plans the same text again. Here each distinct query text is prepared once per connection and reused
 * (better-sqlite3 statements are meant to be: "prepare once, run many"). Two details keep a shared statement safe:
 * Drizzle switches a statement to array rows (`raw()`) for selects it maps itself, so statements are kept apart by
 * that mode and handed out in object mode otherwise; and nothing here iterates a statement, which would hold it busy.
 * Queries written on `$client` directly are not touched.
 */
function reuseStatements(db: Db, sqlite: Database.Database) {
  // Drizzle's session is not part of its typed surface; its shape is pinned by the exact version in package.json.
  const session = (db as unknown as { session: DrizzleSession }).session;
  const kept = new Map<string, Database.Statement>();
  let arrayRows = false;
  const prepare = (text: string) => {
    const key = `${arrayRows ? 'a' : 'o'}:${text}`;
    let statement = kept.get(key);
    if (statement) {
      kept.delete(key);
    } else {
      statement = sqlite.prepare(text);
      if (kept.size >= STATEMENTS_KEPT) kept.delete(kept.keys().next().value!);
    }
    kept.set(key, statement);
    if (!arrayRows && statement.reader) statement.raw(false);
    return statement;
  };
  session.client = new Proxy(sqlite, {
    get(target, property) {
      if (property === 'prepare') return prepare;
      const value: unknown = Reflect.get(target, property, target);
      return typeof value === 'function' ? value.bind(target) : value;
    },
  });
  const prepareQuery = session.prepareQuery.bind(session);
  session.prepareQuery = (query, fields, executeMethod, arrayMode, mapper, ...rest) => {
    arrayRows = Boolean(fields) || Boolean(mapper);
    try {
      return prepareQuery(query, fields, executeMethod, arrayMode, mapper, ...rest);
    } finally {
      arrayRows = false;
    }
  };
}

/** The first wait for another process's write lock, and the longest; the wait grows by half each time in between. */
const LOCK_POLL_FIRST_MS = 0.05;
const LOCK_POLL_MAX_MS = 1;

/**
 * With several processes on one file, a transaction that reads before it writes must hold the write lock from its
 * start: a deferred one that read a snapshot while another process committed cannot upgrade and fails at once with
 * SQLITE_BUSY, never waiting (SQLite's documentation of BEGIN TRANSACTION and of SQLITE_BUSY_SNAPSHOT; BEGIN IMMEDIATE
 * takes the write lock at once). So every Drizzle transaction begins IMMEDIATE unless it asks otherwise (a read-only
 * one passes `{ behavior: 'deferred' }`).
 *
 * While another process holds the lock, SQLite's own busy handler sleeps 1, 2, 5, 10 … ms between tries (sqlite3.c,
 * sqliteDefaultBusyCallback), and the whole process sleeps with it; the other process's transactions take a fraction
 * of a millisecond. So the BEGIN is tried without the busy handler (busy_timeout 0 until the transaction ends; once
 * the lock is held nothing inside waits for another connection) and tried again after 0.05 ms, growing to 1 ms, until
 * the busy timeout has passed; the connection's timeout is set back when the transaction ends. Only a BEGIN that
 * failed is tried again: an error from the work inside goes to the caller as it is.
 */
function writeTransactionsTakeTheLockFirst(db: Db) {
  const begin = db.transaction.bind(db);
  const sqlite = db.$client;
  const noWait = sqlite.prepare('PRAGMA busy_timeout = 0');
  const wait = sqlite.prepare(`PRAGMA busy_timeout = ${BUSY_TIMEOUT_MS}`);
  const nap = new Int32Array(new SharedArrayBuffer(4));
  db.transaction = ((transaction, config) => {
    const behavior = config?.behavior ?? 'immediate';
    // A nested call is a savepoint in the lock already held; a deferred transaction takes no lock at its start.
    if (sqlite.inTransaction || behavior === 'deferred') return begin(transaction, { ...config, behavior });
    let began = false;
    const work: typeof transaction = (tx) => {
      began = true;
      return transaction(tx);
    };
    const deadline = performance.now() + BUSY_TIMEOUT_MS;
    let pause = LOCK_POLL_FIRST_MS;
    noWait.get();
    try {
      for (;;) {
        try {
          return begin(work, { ...config, behavior });
        } catch (error) {
          if (began || (error as { code?: unknown }).code !== 'SQLITE_BUSY' || performance.now() > deadline) throw error;
        }
        // A short sleep of this thread, not a spin: the core goes to the process that holds the lock.
        Atomics.wait(nap, 0, 0, pause);
        pause = Math.min(pause * 1.5, LOCK_POLL_MAX_MS);
      }
    } finally {
      wait.get();
    }
  }) as typeof db.transaction;
}
