import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';
import { BACKSTOP_PAGES, keepCheckpointing } from '../../server/db/checkpoints';
import { openDatabase } from '../../server/db/client';

/**
 * The write-ahead log is copied back into the database file by a timer in one process, not by whichever request's
 * commit crosses SQLite's default mark of 1,000 pages; SQLite's own checkpoint stays on as a backstop.
 */
describe('checkpoints', () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-ckpt-'));
  afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

  it('every app connection leaves checkpoints to the timer up to the backstop', () => {
    const db = openDatabase(path.join(dir, 'a.db'));
    try {
      expect(db.$client.pragma('wal_autocheckpoint', { simple: true })).toBe(BACKSTOP_PAGES);
      expect(BACKSTOP_PAGES).toBeGreaterThan(1_000);
    } finally {
      db.$client.close();
    }
  });

  it('the timer copies the log into the database file without a commit asking for it', async () => {
    const file = path.join(dir, 'b.db');
    const writer = new Database(file);
    writer.pragma('journal_mode = WAL');
    writer.pragma(`wal_autocheckpoint = ${BACKSTOP_PAGES}`);
    writer.exec('CREATE TABLE filler (id INTEGER PRIMARY KEY, text TEXT NOT NULL)');
    const insert = writer.prepare('INSERT INTO filler (text) VALUES (?)');
    writer.transaction(() => {
      for (let i = 0; i < 2_000; i++) insert.run('x'.repeat(200));
    })();
    // About 100 pages are in the log and not yet in the file.
    const before = fs.statSync(file).size;
    expect(fs.statSync(`${file}-wal`).size).toBeGreaterThan(100 * 4096);

    const checkpointer = new Database(file);
    const stop = keepCheckpointing(checkpointer, 20);
    try {
      const deadline = Date.now() + 5_000;
      while (fs.statSync(file).size <= before && Date.now() < deadline) await new Promise((r) => setTimeout(r, 20));
      expect(fs.statSync(file).size).toBeGreaterThan(before + 100 * 4096);
      // What was copied is what the writer committed.
      expect(new Database(file, { readonly: true }).prepare('SELECT count(*) FROM filler').pluck().get()).toBe(2_000);
    } finally {
      stop();
      checkpointer.close();
      writer.close();
    }
  });
});
