import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startServerProcess, type ServerProcess } from '../support/server-process';
import { signIn } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';
import { envBesideTestApp } from '../support/process-env';

/**
 * Two app processes on one SQLite file (docs/decisions/0005-several-processes.md), started as `npm start` starts
 * one: what one writes, the other shows on its next read; a rate limit counts both together; and the housekeeping
 * job (unpaid-order expiry) runs in one of them only.
 */
const root = path.resolve(import.meta.dirname, '../..');

type Proc = ServerProcess;
const startProcess = (env: Record<string, string>) => startServerProcess(root, env, 60_000);
const stop = async (p: Proc | undefined) => {
  await p?.stop();
};

let t: TestApp;
let a: Proc;
let b: Proc;
beforeAll(async () => {
  // The test app makes the database (catalogue, demo accounts) and runs the payment and mail fakes both processes use.
  t = await startTestApp({ fakes: true, accounts: true });
  const env = envBesideTestApp(t, { SIGNIN_LIMIT_PER_MINUTE: '6', HOUSEKEEPING_SECONDS: '1' });
  [a, b] = await Promise.all([startProcess(env), startProcess(env)]);
}, 120_000);
afterAll(async () => {
  await Promise.all([stop(a), stop(b)]);
  await t?.close();
});

const as = (p: Proc) => ({ url: p.url }) as TestApp;
const priceOnList = async (p: Proc, q: string, partNumber: string) => {
  const res = await fetch(`${p.url}/api/parts?q=${encodeURIComponent(q)}`);
  const body = (await res.json()) as { items: Array<{ partNumber: string; priceCents: number; stock: { available: number } }> };
  return body.items.find((i) => i.partNumber === partNumber);
};

describe('two app processes on one database', () => {
  it('a catalogue change made through one is on the other’s next read, cached list and search included', async () => {
    const part = 'FUL-20-0203';
    const before = await priceOnList(b, part, part);
    expect(before).toBeDefined();
    // Read twice on B, so its list cache holds the answer.
    expect(await priceOnList(b, part, part)).toEqual(before);

    const admin = await signIn(as(a), 'admin@spoolyard.test');
    const form = (await admin.get(`/api/admin/parts/${part}`)).body as { priceCents: number; title: string };
    const changed = await admin.send('PUT', `/api/admin/parts/${part}`, { ...form, priceCents: form.priceCents + 1234, title: `${form.title} quillfeather` });
    expect(changed.status).toBe(200);

    expect((await priceOnList(b, part, part))?.priceCents).toBe(before!.priceCents + 1234);
    // B's search documents follow A's change: the new title word finds the part on B.
    expect(await priceOnList(b, 'quillfeather', part)).toBeDefined();
  });

  it('a stock change made through one is on the other’s next list', async () => {
    const part = 'BUR-50-0201';
    const before = (await priceOnList(b, part, part))!.stock.available;
    const buyer = await signIn(as(a), 'dealer@spoolyard.test');
    await buyer.send('POST', '/api/cart/lines', { partNumber: part, quantity: 1 });
    const placed = await buyer.send('POST', '/api/checkout', { method: 'account', purchaseOrder: 'PO-TWO-PROCESSES' });
    expect(placed.status, JSON.stringify(placed.body)).toBe(201);
    expect((await priceOnList(b, part, part))!.stock.available).toBe(before - 1);
  });

  it('runs the unpaid-order expiry in one process: the order is cancelled once', async () => {
    const buyer = await signIn(as(b), 'retail@spoolyard.test');
    const part = 'CHS-50-0201';
    const before = t.db.$client.prepare('SELECT available FROM parts WHERE part_number = ?').pluck().get(part) as number;
    await buyer.send('POST', '/api/cart/lines', { partNumber: part, quantity: 2 });
    const res = await buyer.send('POST', '/api/checkout', {
      method: 'card',
      paymentMethod: 'pm_card_authenticationRequired',
      delivery: { name: 'Robin Ashdown', line1: '1 Test Street', city: 'Quenchfold', postcode: 'QF1 1AA', zone: 'local' },
    });
    expect(res.status).toBe(201);
    const number = (res.body as { order: { number: string } }).order.number;
    // Make it an hour old; both processes sweep every second.
    t.db.$client.prepare("UPDATE orders SET created_at = strftime('%Y-%m-%dT%H:%M:%fZ', 'now', '-60 minutes') WHERE number = ?").run(number);
    const status = () => t.db.$client.prepare('SELECT status FROM orders WHERE number = ?').pluck().get(number);
    for (let i = 0; i < 100 && status() !== 'cancelled'; i++) await new Promise((r) => setTimeout(r, 100));
    expect(status()).toBe('cancelled');
    await new Promise((r) => setTimeout(r, 2500)); // two more sweeps on each process
    const cancellations = t.db.$client
      .prepare("SELECT count(*) FROM order_events e JOIN orders o ON o.id = e.order_id WHERE o.number = ? AND e.status = 'cancelled'")
      .pluck()
      .get(number);
    expect(cancellations).toBe(1);
    expect(t.db.$client.prepare('SELECT available FROM parts WHERE part_number = ?').pluck().get(part)).toBe(before);
    const expiredBy = [a, b].filter((p) => /housekeeping: 1 unpaid order expired/.test(p.output()));
    expect(expiredBy).toHaveLength(1);
    expect(t.db.$client.prepare("SELECT count(*) FROM job_leases WHERE name = 'housekeeping'").pluck().get()).toBe(1);
  });
  it('takes writes from both processes at once without "database is locked"', async () => {
    // Cart writes read before they write; in two processes they must queue for the lock, not fail (server/db/client.ts).
    const buyers = await Promise.all([signIn(as(a), 'dealer2@spoolyard.test'), signIn(as(b), 'warehouse@spoolyard.test')]);
    const parts = ['FLG-50-0201', 'FUL-20-0203', 'BUR-50-0201', 'CHS-50-0201'];
    const statuses = await Promise.all(
      Array.from({ length: 24 }, (_, i) => buyers[i % 2]!.send('POST', '/api/cart/lines', { partNumber: parts[i % parts.length], quantity: 1 }).then((r) => r.status)),
    );
    expect(statuses.every((s) => s === 201)).toBe(true);
  });

  it('counts sign-in attempts across both processes together', async () => {
    // One client (its address as the loopback proxy reports it; a documentation address) trying a wrong password on
    // each process in turn. The limit is 6 a minute: each process alone sees 4 attempts, under it.
    const attempt = (p: Proc) =>
      fetch(`${p.url}/api/auth/sign-in/email`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', origin: p.url, 'x-forwarded-for': '203.0.113.7' },
        body: JSON.stringify({ email: 'warehouse@spoolyard.test', password: 'not-the-password' }),
      }).then((r) => r.status);
    const statuses: number[] = [];
    for (const p of [a, b, a, b, a, b, a, b]) statuses.push(await attempt(p));
    expect(statuses.slice(0, 6).every((s) => s !== 429)).toBe(true);
    expect(statuses.slice(6)).toEqual([429, 429]);
  });
});

describe('APP_PROCESSES', () => {
  it('runs that many processes on one port, and a signal stops them all', async () => {
    const p = await startProcess(envBesideTestApp(t, { APP_PROCESSES: '2' }));
    try {
      expect(p.output()).toMatch(/2 app processes share port \d+/);
      const answers = await Promise.all(Array.from({ length: 8 }, () => fetch(`${p.url}/api/health`).then((r) => r.status)));
      expect(answers.every((s) => s === 200)).toBe(true);
    } finally {
      expect(await p.stop()).toBe(0);
    }
  }, 90_000);
});
