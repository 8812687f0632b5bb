import { eq, gt, lte, max, min, sql } from 'drizzle-orm';
import type { Db } from './client';
import { changeVersions, partChanges } from './schema';

/**
 * What changed in the database, whichever process wrote it. Triggers (drizzle/0007_shared_state.sql) log every change
 * to a part's catalogue data in `part_changes` and count stock and frame changes in `change_versions`; caches key on
 * these versions, and the search index reloads the parts logged since it last looked.
 *
 * Reading the versions costs two small queries, so they are read only when the database may have changed:
 * `PRAGMA data_version` moves when another connection commits, `total_changes()` when this one writes
 * (SQLite: "PRAGMA data_version", "total_changes()"). Both are reads Drizzle's builder cannot express
 * (docs/decisions/0003-where-raw-sql-remains.md).
 */
export interface ChangeVersions {
  /** The latest logged part change: moves with any change to a part's catalogue data. */
  parts: number;
  /** Moves with every change to a part's available quantity. */
  stock: number;
  /** Moves with any change to a frame. */
  frames: number;
  /** Moves when the search index's tables are rewritten (after the parts they index changed). */
  search: number;
  /** Moves when a session ends or changes, or a user, trade account or membership changes (drizzle/0010). */
  accounts: number;
}

export interface ChangeFeed {
  /** The versions now; the same object until something may have changed. */
  current(): ChangeVersions;
  /** The parts changed after a logged change, and the latest change; `null` ids when too many to list. */
  partsChangedSince(after: number, limit?: number): { ids: number[] | null; latest: number };
}

const feeds = new WeakMap<Db, ChangeFeed>();

/** One feed per database connection: every service of a process shares it. */
export function changeFeedFor(db: Db): ChangeFeed {
  let feed = feeds.get(db);
  if (!feed) {
    feed = createChangeFeed(db);
    feeds.set(db, feed);
  }
  return feed;
}

function createChangeFeed(db: Db): ChangeFeed {
  // The two raw reads (see the comment on ChangeVersions): a pragma and a FROM-less select. They run on every cached
  // list request, so they are prepared once: measured here, the pair costs about 8 µs prepared and about 55 µs when
  // built per call (better-sqlite3's pragma() and Drizzle's db.get(sql) both prepare each time).
  const dataVersionStatement = db.$client.prepare('PRAGMA data_version').pluck();
  const ownWritesStatement = db.$client.prepare('SELECT total_changes()').pluck();
  const dataVersion = () => dataVersionStatement.get();
  const ownWrites = () => ownWritesStatement.get();
  const latestPartChange = db.select({ id: max(partChanges.id) }).from(partChanges).prepare();
  const topicVersions = db.select().from(changeVersions).prepare();
  let seenData = -1;
  let seenOwn = -1;
  let versions: ChangeVersions = { parts: 0, stock: 0, frames: 0, search: 0, accounts: 0 };

  function current(): ChangeVersions {
    const data = Number(dataVersion());
    const own = Number(ownWrites());
    if (data !== seenData || own !== seenOwn) {
      seenData = data;
      seenOwn = own;
      const next: ChangeVersions = { parts: latestPartChange.get()?.id ?? 0, stock: 0, frames: 0, search: 0, accounts: 0 };
      for (const row of topicVersions.all()) next[row.topic] = row.version;
      if ((Object.keys(next) as Array<keyof ChangeVersions>).some((k) => next[k] !== versions[k])) versions = next;
    }
    return versions;
  }

  function partsChangedSince(after: number, limit = 2000) {
    // One read transaction, so the latest change and the list agree even while another process writes.
    return db.transaction((tx) => {
      const span = tx.select({ first: min(partChanges.id), latest: max(partChanges.id) }).from(partChanges).get();
      const latest = span?.latest ?? 0;
      // Older changes are pruned (pruneChangeLog): a reader that fell behind the oldest kept one reloads everything.
      if (span?.first != null && span.first > after + 1) return { ids: null, latest };
      const rows = tx.selectDistinct({ partId: partChanges.partId }).from(partChanges).where(gt(partChanges.id, after)).limit(limit + 1).all();
      return { ids: rows.length > limit ? null : rows.map((r) => r.partId), latest };
    }, { behavior: 'deferred' });
  }

  return { current, partsChangedSince };
}

/** Keeps the latest part changes, enough for any process that is following; run under the housekeeping lease. */
export function pruneChangeLog(db: Db, keep = 50_000): number {
  const latest = db.select({ id: max(partChanges.id) }).from(partChanges).get()?.id ?? 0;
  return latest > keep ? db.delete(partChanges).where(lte(partChanges.id, latest - keep)).run().changes : 0;
}

/** Moves the search counter: called in the transaction that rewrites the search index's tables. */
export function searchIndexRewritten(db: Db): void {
  db.update(changeVersions).set({ version: sql`${changeVersions.version} + 1` }).where(eq(changeVersions.topic, 'search')).run();
}
