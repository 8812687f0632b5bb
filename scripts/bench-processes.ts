import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { startMailFake } from '../fakes/mail/mail-fake';
import { openDatabase } from '../server/db/client';
import { createStockService } from '../server/services/stock';
import { startServerProcess } from '../tests/support/server-process';
import { setAvailable } from '../tests/support/stock';
import { startPaymentsFake } from '../fakes/payments/payments-fake';
import type { BenchEnv } from './bench-catalogues';
import { section, summarize } from './bench-harness';
import { signIn, type Client } from '../tests/support/session';
import type { TestApp } from '../tests/support/test-app';

type Autocannon = (options: { url: string; connections: number; duration: number; timeout?: number }) => Promise<{
  requests: { average: number };
  errors: number;
  timeouts: number;
  non2xx: number;
}>;
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

const BUYERS = 16;
const WEBHOOK_SECRET = 'whsec_spoolyard_bench';
const DELIVERY = { name: 'Bench Buyer', line1: '1 Load Street', city: 'Quenchfold', postcode: 'QF1 1AA', zone: 'local' };

/**
 * The same list and checkout loads against the real server with one app process and with two on one database,
 * interleaved (1, 2, 1, 2) so a noisy machine weighs on both alike; the load generator shares the two cores.
 */
export const processesSection = section<BenchEnv>('One app process vs two (APP_PROCESSES)', async (ctx, env) => {
  const demo = env.catalogues[0];
  if (!demo) throw new Error('the catalogue section did not build the demo catalogue');
  const dir = path.join(env.workDir, 'processes');
  fs.mkdirSync(dir, { recursive: true });
  const results: Record<number, { list: number[]; category: number[]; checkout: number[]; checkoutP95: number[] }> = {
    1: { list: [], category: [], checkout: [], checkoutP95: [] },
    2: { list: [], category: [], checkout: [], checkoutP95: [] },
  };
  for (const [round, processes] of [1, 2, 1, 2].entries()) {
    // Fresh fakes each round: every round starts from the same catalogue file, so order numbers (and the payment
    // idempotency keys made from them) repeat across rounds.
    const payments = await startPaymentsFake({ port: 0, host: '127.0.0.1', webhookUrl: null, webhookSecret: WEBHOOK_SECRET });
    const mail = await startMailFake({ smtpPort: 0, httpPort: 0, host: '127.0.0.1' });
    try {
      const file = path.join(dir, `run-${round}.db`);
      for (const suffix of ['', '-wal', '-shm']) fs.rmSync(`${file}${suffix}`, { force: true });
      fs.copyFileSync(demo.file, file);
      // Plenty of one gasket to sell, put in through the stock service so the ledger stays true.
      const prepared = openDatabase(file);
      const plenty = prepared.$client
        .prepare("SELECT p.part_number FROM parts p JOIN stock s ON s.part_id = p.id WHERE p.category = 'gaskets-fittings' AND p.status = 'active' GROUP BY p.id ORDER BY SUM(s.on_hand) DESC LIMIT 1")
        .pluck()
        .get() as string;
      setAvailable({ db: prepared, app: { stock: createStockService(prepared) } } as unknown as Pick<TestApp, 'db' | 'app'>, plenty, 100_000);
      prepared.$client.close();
      const server = await startServerProcess(env.root, {
        NODE_ENV: 'test',
        HOST: '127.0.0.1',
        APP_PROCESSES: String(processes),
        DATABASE_FILE: file,
        UPLOADS_DIR: path.join(dir, 'uploads'),
        SEED_DEMO: 'false',
        SIGNIN_LIMIT_PER_MINUTE: '10000',
        ORDER_PAD_LIMIT_PER_MINUTE: '10000',
        PAYMENTS_API_PORT: String(payments.port),
        PAYMENTS_WEBHOOK_SECRET: WEBHOOK_SECRET,
        MAIL_PORT: String(mail.smtpPort),
        MAIL_INBOX_URL: mail.httpUrl,
      });
      const { url, output } = server;
      payments.setWebhookUrl(`${url}/api/webhooks/payments`);
      try {
        const load = async (target: string) => {
          await autocannon({ url: target, connections: 10, duration: 1 });
          const r = await autocannon({ url: target, connections: 50, duration: env.httpDurationS, timeout: 10 });
          if (r.errors + r.timeouts + r.non2xx > 0) throw new Error(`${target}: ${r.errors} errors, ${r.timeouts} timeouts, ${r.non2xx} non-2xx`);
          return r.requests.average;
        };
        results[processes]!.list.push(await load(`${url}/api/parts`));
        results[processes]!.category.push(await load(`${url}/api/parts?category=cartridges`));

        const buyers: Client[] = [];
        const app = { url } as TestApp;
        for (let i = 0; i < BUYERS; i++) {
          const email = `bench-${round}-${i}@spoolyard.test`;
          const res = await fetch(`${url}/api/auth/sign-up/email`, {
            method: 'POST',
            headers: { 'content-type': 'application/json', origin: url },
            body: JSON.stringify({ name: `Bench Buyer ${i}`, email, password: 'bench-password-1' }),
          });
          if (res.status !== 200) throw new Error(`sign-up failed: ${res.status}`);
          buyers.push(await signIn(app, email, 'bench-password-1'));
        }
        const seconds = Math.min(env.httpDurationS, 10);
        const until = performance.now() + seconds * 1000;
        const latencies: number[] = [];
        await Promise.all(
          buyers.map(async (c) => {
            while (performance.now() < until) {
              const started = performance.now();
              const add = await c.send('POST', '/api/cart/lines', { partNumber: plenty, quantity: 1 });
              if (add.status !== 201) throw new Error(`add to cart: ${add.status}\n${output().slice(-3000)}`);
              const res = await c.send('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY });
              if (res.status !== 201) throw new Error(`checkout: ${res.status} ${JSON.stringify(res.body)}\n${output().slice(-3000)}`);
              latencies.push(performance.now() - started);
            }
          }),
        );
        results[processes]!.checkout.push(latencies.length / seconds);
        results[processes]!.checkoutP95.push(summarize(latencies.sort((a, b) => a - b)).p95);
      } finally {
        await server.stop();
      }
      ctx.log(`round ${round + 1}: ${processes} process(es) done`);
    } finally {
      await payments.close();
      await mail.close();
    }
  }
  const median = (xs: number[]) => summarize(xs).p50;
  for (const [what, key, unit] of [
    ['GET /api/parts, demo catalogue', 'list', 'req/s'],
    ['GET /api/parts?category=cartridges, demo catalogue', 'category', 'req/s'],
    ['card checkouts through the payments fake', 'checkout', 'orders/s'],
    ['checkout p95 (add line + pay)', 'checkoutP95', 'ms'],
  ] as const) {
    const one = median(results[1]![key]);
    const two = median(results[2]![key]);
    ctx.record(`${what}, 1 process`, one, unit);
    ctx.record(`${what}, 2 processes`, two, unit, { detail: `${(two / one).toFixed(2)} × one process` });
  }
});
