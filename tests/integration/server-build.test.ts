import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Worker } from 'node:worker_threads';
import { buildServer } from '../../scripts/build-server';
import { SearchIndex, type Snapshot } from '../../server/services/search-index';
import { createTestDb } from '../support/test-app';
import { freePort } from '../support/server-process';

/**
 * `npm start` runs the server compiled ahead of time (scripts/build-server.ts). The bundles must find the migrations
 * and everything else beside the sources, and the start bundle must run the app bundle beside it.
 */
const root = path.resolve(import.meta.dirname, '../..');
const work = path.join(root, '.tmp', `server-build-${process.pid}`);
let outdir = '';
beforeAll(async () => {
  fs.rmSync(work, { recursive: true, force: true });
  outdir = (await buildServer(path.join(work, 'server'))).outdir;
}, 60_000);
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

async function runUntilListening(bundle: string, env: Record<string, string>) {
  const port = await freePort();
  const child = spawn(process.execPath, [path.join(outdir, bundle)], { cwd: root, env: { PATH: process.env.PATH, HOST: '127.0.0.1', PORT: String(port), ...env } });
  let output = '';
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`not listening within 60 s:\n${output}`)), 60_000);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('is running at')) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout.on('data', onData);
    child.stderr.on('data', onData);
    child.once('exit', (code) => reject(new Error(`exited (${code}):\n${output}`)));
  });
  const stop = () => new Promise<void>((resolve) => (child.exitCode !== null ? resolve() : (child.once('exit', () => resolve()), child.kill('SIGTERM'))));
  return { url: `http://127.0.0.1:${port}`, output: () => output, stop };
}

describe('the server compiled ahead of time', () => {
  it('start bundle: fakes and demo data, then the app bundle, which migrates and serves the catalogue', async () => {
    const [payments, smtp, inbox] = [await freePort(), await freePort(), await freePort()];
    const app = await runUntilListening('start.mjs', {
      NODE_ENV: 'development',
      DATABASE_FILE: path.join(work, 'shop.db'),
      UPLOADS_DIR: path.join(work, 'uploads'),
      PAYMENTS_API_PORT: String(payments),
      MAIL_PORT: String(smtp),
      MAIL_INBOX_URL: `http://127.0.0.1:${inbox}`,
    });
    try {
      expect(app.output()).toMatch(/Seeded the demo catalogue: \d+ parts/);
      expect((await fetch(`${app.url}/api/health`)).status).toBe(200);
      const list = (await (await fetch(`${app.url}/api/parts?category=turbochargers`)).json()) as { total: number };
      expect(list.total).toBeGreaterThan(0);

      // The bundled packages at work: sign-in (the auth library), an order on account and one by card (the payment
      // SDK against the bundled fake), and the confirmations through the outbox and the mail library to the catcher.
      const asUser = async (email: string) => {
        const signIn = await fetch(`${app.url}/api/auth/sign-in/email`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', origin: app.url },
          body: JSON.stringify({ email, password: 'spoolyard-demo-1' }),
        });
        expect(signIn.status, email).toBe(200);
        const cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
        return (method: string, p: string, body?: unknown) =>
          fetch(`${app.url}${p}`, { method, headers: { 'content-type': 'application/json', origin: app.url, cookie }, body: body === undefined ? undefined : JSON.stringify(body) });
      };
      const dealer = await asUser('dealer@spoolyard.test');
      expect((await dealer('POST', '/api/cart/lines', { partNumber: 'FLG-50-0201', quantity: 1 })).status).toBe(201);
      expect((await dealer('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-BUNDLE-1' })).status).toBe(201);
      const retail = await asUser('retail@spoolyard.test');
      expect((await retail('POST', '/api/cart/lines', { partNumber: 'FLG-50-0201', quantity: 1 })).status).toBe(201);
      const card = await retail('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: { name: 'Robin Ashdown', line1: '1 Test Street', city: 'Quenchfold', postcode: 'QF1 1AA' } });
      expect(card.status, await card.clone().text()).toBe(201);
      const confirmed = async (to: string) => {
        for (let i = 0; i < 100; i++) {
          const caught = (await (await fetch(`http://127.0.0.1:${inbox}/messages?to=${encodeURIComponent(to)}`)).json()) as { messages: Array<{ subject: string }> };
          if (caught.messages.some((m) => /confirmed/.test(m.subject))) return true;
          await new Promise((resolve) => setTimeout(resolve, 200));
        }
        return false;
      };
      expect(await confirmed('dealer@spoolyard.test')).toBe(true);
      expect(await confirmed('retail@spoolyard.test')).toBe(true);
    } finally {
      await app.stop();
    }
    // The app bundle alone, on the database the first run made, as each cluster worker runs it.
    const again = await runUntilListening('index.mjs', { NODE_ENV: 'test', DATABASE_FILE: path.join(work, 'shop.db'), UPLOADS_DIR: path.join(work, 'uploads'), SEED_DEMO: 'false' });
    try {
      expect((await fetch(`${again.url}/api/parts/FLG-50-0201`)).status).toBe(200);
    } finally {
      await again.stop();
    }
  }, 120_000);

  it('search worker bundle: the app starts it beside itself, and it reads the catalogue into an index snapshot', async () => {
    // The app bundle finds the worker beside itself (search.ts: new URL('./search-worker.mjs', import.meta.url)).
    expect(fs.readFileSync(path.join(outdir, 'index.mjs'), 'utf8')).toContain('./search-worker.mjs');
    const { db, dir } = createTestDb();
    try {
      const snapshot = await new Promise<Snapshot>((resolve, reject) => {
        const worker = new Worker(path.join(outdir, 'search-worker.mjs'), { workerData: { file: db.$client.name } });
        worker.once('message', resolve);
        worker.once('error', reject);
      });
      const parts = Number(db.$client.prepare('SELECT count(*) FROM parts').pluck().get());
      expect(snapshot.rows).toHaveLength(parts);
      expect(new SearchIndex(snapshot).numbersAt('flat', 'FUL200203')[0]?.shown).toBe('FUL-20-0203');
    } finally {
      db.$client.close();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});
