import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import Database from 'better-sqlite3';
import { afterAll, describe, expect, it } from 'vitest';

const root = path.resolve(import.meta.dirname, '../..');
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-prod-'));
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

const productionEnv = {
  NODE_ENV: 'production',
  HOST: '127.0.0.1',
  PORT: '0',
  DATABASE_FILE: path.join(dir, 'shop.db'),
  UPLOADS_DIR: path.join(dir, 'uploads'),
  PUBLIC_URL: 'https://shop.spoolyard.test',
  AUTH_SECRET: 'a-production-secret-of-forty-characters-x',
  PAYMENTS_MODE: 'live',
  PAYMENTS_SECRET_KEY: 'sk_live_not_a_real_key',
  PAYMENTS_PUBLISHABLE_KEY: 'pk_live_not_a_real_key',
  PAYMENTS_API_HOST: 'payments.spoolyard.test',
  PAYMENTS_API_PROTOCOL: 'https',
};

/** Starts the server as production does and resolves with what it printed once it listens (nothing is contacted). */
function startProduction(extra: Record<string, string> = {}): Promise<{ code: number | null; output: string }> {
  return new Promise((resolve) => {
    const child = spawn(path.join(root, 'node_modules/.bin/tsx'), ['server/index.ts'], {
      cwd: root,
      env: { PATH: process.env.PATH, ...productionEnv, ...extra },
    });
    let output = '';
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('is running at')) child.kill('SIGTERM');
    };
    child.stdout.on('data', onData);
    child.stderr.on('data', onData);
    child.on('exit', (code) => resolve({ code, output }));
  });
}

describe('a production start', () => {
  it('creates no account and no demo data', async () => {
    const { output } = await startProduction();
    expect(output).toContain('Spoolyard is running at https://shop.spoolyard.test/');
    expect(output).not.toMatch(/Seeded|demo/i);
    const db = new Database(productionEnv.DATABASE_FILE, { readonly: true });
    try {
      expect(db.prepare('SELECT count(*) FROM user').pluck().get()).toBe(0);
      expect(db.prepare('SELECT count(*) FROM parts').pluck().get()).toBe(0);
    } finally {
      db.close();
    }
  }, 60_000);

  it('refuses SEED_DEMO, naming it', async () => {
    const { code, output } = await startProduction({ SEED_DEMO: 'true' });
    expect(code).toBe(1);
    expect(output).toMatch(/SEED_DEMO: demo accounts and data are a development tool/);
  }, 60_000);
});
