import { and, eq, lt, or, sql } from 'drizzle-orm';
import type { Options, Store } from 'express-rate-limit';
import type { Db } from './client';
import { jobLeases, rateLimitHits } from './schema';

/**
 * State every app process on one database shares, kept in the database rather than in a process's memory
 * (docs/decisions/0005-several-processes.md): request counters for rate limits, and leases for scheduled jobs.
 */

/**
 * An express-rate-limit store on SQLite: one fixed window per key, counted by a single upsert, so two processes
 * count the same client together.
 */
export function sqliteRateLimitStore(db: Db, prefix: string): Store {
  let windowMs = 60_000;
  const key = (k: string) => `${prefix}:${k}`;
  return {
    prefix,
    localKeys: false,
    init(options: Options) {
      windowMs = options.windowMs;
    },
    increment(k: string) {
      const now = Date.now();
      const row = db
        .insert(rateLimitHits)
        .values({ key: key(k), hits: 1, windowEndsAt: now + windowMs })
        .onConflictDoUpdate({
          target: rateLimitHits.key,
          set: {
            // A window that has ended starts again at one hit.
            hits: sql`CASE WHEN ${rateLimitHits.windowEndsAt} <= ${now} THEN 1 ELSE ${rateLimitHits.hits} + 1 END`,
            windowEndsAt: sql`CASE WHEN ${rateLimitHits.windowEndsAt} <= ${now} THEN ${now + windowMs} ELSE ${rateLimitHits.windowEndsAt} END`,
          },
        })
        .returning({ hits: rateLimitHits.hits, windowEndsAt: rateLimitHits.windowEndsAt })
        .get();
      return { totalHits: row.hits, resetTime: new Date(row.windowEndsAt) };
    },
    get(k: string) {
      const row = db.select().from(rateLimitHits).where(eq(rateLimitHits.key, key(k))).get();
      return row && row.windowEndsAt > Date.now() ? { totalHits: row.hits, resetTime: new Date(row.windowEndsAt) } : undefined;
    },
    decrement(k: string) {
      db.update(rateLimitHits)
        .set({ hits: sql`max(${rateLimitHits.hits} - 1, 0)` })
        .where(eq(rateLimitHits.key, key(k)))
        .run();
    },
    resetKey(k: string) {
      db.delete(rateLimitHits).where(eq(rateLimitHits.key, key(k))).run();
    },
  };
}

/** Drops counters whose window has ended; run by the process that holds the housekeeping lease. */
export function pruneRateLimits(db: Db, now = Date.now()): number {
  return db.delete(rateLimitHits).where(lt(rateLimitHits.windowEndsAt, now)).run().changes;
}

/**
 * Runs a job only in the process that holds its lease. The lease is taken when it is free or has run out and is
 * renewed by its holder each time; a holder that stops lets it run out, and another process takes over.
 */
export async function runIfLeaseHeld(db: Db, name: string, holder: string, leaseMs: number, job: () => void | Promise<void>, now = Date.now()): Promise<boolean> {
  const held = db.transaction((tx) => {
    tx.insert(jobLeases).values({ name, holder, expiresAt: now + leaseMs }).onConflictDoNothing().run();
    const taken = tx
      .update(jobLeases)
      .set({ holder, expiresAt: now + leaseMs, lastRunAt: now })
      .where(and(eq(jobLeases.name, name), or(eq(jobLeases.holder, holder), lt(jobLeases.expiresAt, now))))
      .run();
    return taken.changes === 1;
  });
  if (held) await job();
  return held;
}
