import { execFile } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import Database from 'better-sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDealer, createOrder, type TestDealer } from '../support/factories';
import { signIn } from '../support/session';
import { setAvailable } from '../support/stock';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * `npm run backup` while buyers are checking out, then `npm run restore` of that backup: every order committed before
 * the backup started is in it, no order in it is half-written, and the uploads come back with it.
 */
const root = path.resolve(import.meta.dirname, '../..');
const run = promisify(execFile);
const tsx = path.join(root, 'node_modules/.bin/tsx');

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ accounts: true });
}, 120_000);
afterAll(() => t?.close());

const placesEnv = (databaseFile: string, uploadsDir: string) => ({ PATH: process.env.PATH, NODE_ENV: 'test', DATABASE_FILE: databaseFile, UPLOADS_DIR: uploadsDir });

describe('backup and restore', () => {
  it('backs up during a burst of checkouts and restores with every committed order present', async () => {
    const live = { db: path.join(t.dir, 'test.db'), uploads: path.join(t.dir, '.uploads') };
    const parts = ['FLG-50-0201', 'BUR-50-0201', 'CHS-30-0201'];
    for (const p of parts) setAvailable(t, p, 5_000);
    // A part photo, so the uploads folder has something to carry.
    const admin = await signIn(t, 'admin@spoolyard.test');
    const photo = new FormData();
    photo.append('photo', new Blob([Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex')], { type: 'image/png' }), 'p.png');
    expect((await admin.upload(`/api/admin/parts/${parts[2]}/photos`, photo)).status).toBe(201);

    const buyers: TestDealer[] = await Promise.all(Array.from({ length: 6 }, () => createDealer(t)));
    // A long read on another connection (a report, say) holds checkpoints back, so the orders committed from here on
    // live only in the write-ahead log: where a plain copy of the database file would miss them.
    const report = new Database(live.db, { readonly: true });
    report.exec('BEGIN');
    report.prepare('SELECT count(*) FROM orders').get();
    const committed: Array<{ number: string; at: number }> = [];
    let stop = false;
    const burst = buyers.map(async (buyer, i) => {
      for (let n = 0; !stop && n < 400; n++) {
        const placed = await createOrder(buyer, [{ partNumber: parts[(i + n) % parts.length]!, quantity: 1 + (n % 3) }]);
        committed.push({ number: placed.order.number, at: Date.now() });
      }
    });
    while (committed.length < 30) await new Promise((r) => setTimeout(r, 20));

    const backupsDir = path.join(t.dir, 'backups');
    const startedAt = Date.now();
    const before = new Set(committed.map((c) => c.number));
    const made = await run(tsx, ['scripts/backup.ts', '--to', backupsDir], { cwd: root, env: placesEnv(live.db, live.uploads) });
    const backupMs = Date.now() - startedAt;
    const duringBackup = committed.filter((c) => c.at >= startedAt).length;
    stop = true;
    await Promise.all(burst);
    report.exec('COMMIT');
    report.close();
    expect(made.stdout).toMatch(/integrity ok/);
    const [folder] = fs.readdirSync(backupsDir);
    expect(folder).toMatch(/^\d{4}-\d\d-\d\dT\d\d-\d\d-\d\dZ$/);

    // Restored into a new place, as on a replacement machine.
    const target = { db: path.join(t.dir, 'restored', 'spoolyard.db'), uploads: path.join(t.dir, 'restored', 'uploads') };
    const restored = await run(tsx, ['scripts/restore.ts', path.join(backupsDir, folder!)], { cwd: root, env: placesEnv(target.db, target.uploads) });
    expect(restored.stdout).toMatch(/integrity ok/);

    const copy = new Database(target.db, { readonly: true });
    const numbers = new Set((copy.prepare('SELECT number FROM orders').pluck().all() as string[]));
    const missing = [...before].filter((n) => !numbers.has(n));
    expect(missing, 'orders committed before the backup started but missing from it').toEqual([]);
    expect(numbers.size).toBeGreaterThanOrEqual(before.size);
    // No half-written order: every order has its lines, and every line's reservation is in the stock ledger's totals.
    expect(copy.prepare('SELECT count(*) FROM orders o WHERE NOT EXISTS (SELECT 1 FROM order_lines l WHERE l.order_id = o.id)').pluck().get()).toBe(0);
    expect(copy.pragma('integrity_check', { simple: true })).toBe('ok');
    copy.close();
    expect(fs.readdirSync(path.join(target.uploads, 'parts'))).toHaveLength(1);
    console.log(
      `backup during checkouts: ${before.size} orders committed before it started, all present; ${numbers.size} in the backup; ` +
        `${duringBackup} more committed while it ran (${backupMs} ms, script start-up included); ${committed.length} in all`,
    );
  }, 180_000);

  it('refuses to restore over a database that is open, and a backup that was altered', async () => {
    const backupsDir = path.join(t.dir, 'backups');
    const [folder] = fs.readdirSync(backupsDir);
    const live = { db: path.join(t.dir, 'test.db'), uploads: path.join(t.dir, '.uploads') };
    const over = run(tsx, ['scripts/restore.ts', path.join(backupsDir, folder!)], { cwd: root, env: placesEnv(live.db, live.uploads) });
    await expect(over).rejects.toMatchObject({ stderr: expect.stringMatching(/looks to be running/) });

    const altered = path.join(t.dir, 'altered');
    fs.cpSync(path.join(backupsDir, folder!), altered, { recursive: true });
    fs.appendFileSync(path.join(altered, 'spoolyard.db'), Buffer.alloc(10));
    const target = path.join(t.dir, 'restored-2');
    const bad = run(tsx, ['scripts/restore.ts', altered], { cwd: root, env: placesEnv(path.join(target, 'db.db'), path.join(target, 'uploads')) });
    await expect(bad).rejects.toMatchObject({ stderr: expect.stringMatching(/checksum differs/) });
    expect(fs.existsSync(path.join(target, 'db.db'))).toBe(false);
  }, 60_000);
});
