import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { afterAll, describe, expect, it } from 'vitest';
import { openDatabase } from '../../server/db/client';
import { notices } from '../../server/db/schema';

/**
 * Write transactions of two connections on one file (as two app processes have): one waits for the other's write
 * lock by trying again every fraction of a millisecond, not by SQLite's busy handler, whose sleeps start at 1 ms and
 * grow; and the connection keeps its busy timeout for everything else.
 */
describe('waiting for another connection’s write lock', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-lock-'));
  const file = path.join(dir, 'lock.db');
  const db = openDatabase(file);
  afterAll(() => {
    db.$client.close();
    fs.rmSync(dir, { recursive: true, force: true });
  });

  /** Another connection, in a thread of its own, takes the write lock, holds it for `ms` and commits a row. */
  function holdLock(ms: number): Promise<{ worker: Worker; released: Promise<void> }> {
    const betterSqlite = path.resolve(import.meta.dirname, '../../node_modules/better-sqlite3');
    const worker = new Worker(
      `const { workerData, parentPort } = require('node:worker_threads');
       const Database = require(workerData.betterSqlite);
       const db = new Database(workerData.file);
       db.exec('BEGIN IMMEDIATE');
       db.prepare("INSERT INTO notices (user_id, kind, title, body, link) SELECT id, 'paid', 'held', 'held', '/' FROM user LIMIT 1").run();
       parentPort.postMessage('locked');
       Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, workerData.ms);
       db.exec('COMMIT');
       db.close();
       parentPort.postMessage('released');`,
      { eval: true, workerData: { file, ms, betterSqlite } },
    );
    let release: () => void;
    const released = new Promise<void>((resolve) => (release = resolve));
    return new Promise((resolve, reject) => {
      worker.on('error', reject);
      worker.on('message', (m) => {
        if (m === 'locked') resolve({ worker, released });
        if (m === 'released') release();
      });
    });
  }

  it('waits for the lock and then runs, once, after the other connection commits', async () => {
    db.$client.prepare("INSERT INTO user (id, name, email, email_verified, created_at, updated_at) VALUES ('u-lock', 'Lock Tester', 'lock@spoolyard.test', 1, 0, 0)").run();
    const { worker, released } = await holdLock(300);
    let runs = 0;
    const seen = db.transaction((tx) => {
      runs++;
      return tx.select().from(notices).all().map((n) => n.title);
    });
    // It ran after the other connection's commit: it sees that row.
    expect(seen).toEqual(['held']);
    expect(runs).toBe(1);
    await released;
    await worker.terminate();
    expect(db.$client.pragma('busy_timeout', { simple: true })).toBe(5000);
  });

  it('hands an error from the work to the caller without running it again', () => {
    let runs = 0;
    expect(() =>
      db.transaction(() => {
        runs++;
        throw Object.assign(new Error('busy inside'), { code: 'SQLITE_BUSY' });
      }),
    ).toThrow('busy inside');
    expect(runs).toBe(1);
    expect(db.$client.pragma('busy_timeout', { simple: true })).toBe(5000);
  });
});
