import type Database from 'better-sqlite3';

/**
 * Copying the write-ahead log back into the database file (a checkpoint) is left to SQLite after every 1,000 pages
 * appended by default ("wal_autocheckpoint"), in the connection whose commit crossed the mark: that request waits
 * for the copy and its two fsyncs. The busy pages of a shop (stock, orders, the outbox, their indexes) are written
 * again and again, so a checkpoint now and then copies each once rather than at every thousandth frame.
 *
 * So the app's connections leave checkpoints to `keepCheckpointing`, run every `everyMs` by the process that does not
 * serve requests when there are several (the cluster's primary), or between requests in the only one. SQLite's own
 * checkpoint stays as a backstop at `BACKSTOP_PAGES`, should the timer be late, so the log cannot grow without bound.
 * PASSIVE: it copies what no reader still needs and never waits for, or holds up, readers and writers
 * (SQLite: "PRAGMA wal_checkpoint", "Write-Ahead Logging" §Checkpointing).
 */
export const BACKSTOP_PAGES = 20_000;
export const CHECKPOINT_EVERY_MS = 1_000;

/** What a connection does when its own commits cross the backstop: set on every app connection. */
export function checkpointOnlyAsBackstop(sqlite: Database.Database) {
  sqlite.pragma(`wal_autocheckpoint = ${BACKSTOP_PAGES}`);
}

/** Checkpoints on a timer (unref'd: it never keeps the process alive); returns the function that stops it. */
export function keepCheckpointing(sqlite: Database.Database, everyMs = CHECKPOINT_EVERY_MS): () => void {
  const checkpoint = sqlite.prepare('PRAGMA wal_checkpoint(PASSIVE)');
  const timer = setInterval(() => {
    try {
      checkpoint.get();
    } catch (error) {
      // A checkpoint that cannot run now (the database busy or closing) is tried again at the next tick.
      console.warn('checkpoint failed:', (error as Error).message);
    }
  }, everyMs);
  timer.unref();
  return () => clearInterval(timer);
}
