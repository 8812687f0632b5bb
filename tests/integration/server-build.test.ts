import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildServer } from '../../scripts/build-server';
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
});
