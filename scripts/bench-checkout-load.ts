import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { openDatabase } from '../server/db/client';
import { createStockService } from '../server/services/stock';
import { freePort } from '../tests/support/server-process';
import { clientOf, type Client } from '../tests/support/session';
import type { TestApp } from '../tests/support/test-app';
import { build } from 'esbuild';
import { buildServer } from './build-server';
import { buyerLoop, type BuyerRequest } from './bench-buyer';
import { treeCpuMs } from './bench-figures';

const WEBHOOK_SECRET = 'whsec_spoolyard_bench';
const PASSWORD = 'bench-password-1';
const DELIVERY = { name: 'Bench Buyer', line1: '1 Load Street', city: 'Quenchfold', postcode: 'QF1 1AA', zone: 'local' };

export interface FakeProcess {
  pid: number;
  stop: () => Promise<void>;
}

export interface Started {
  pid: number;
  output: () => string;
  stop: () => Promise<void>;
}

/** Runs a compiled entry under plain node with only the given environment; resolves when its output matches `ready`. */
async function startNode(what: string, file: string, env: Record<string, string>, ready: RegExp, cwd: string, execArgv: string[] = []): Promise<Started> {
  const child: ChildProcess = spawn(process.execPath, [...execArgv, file], { cwd, env: { PATH: process.env.PATH, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${what} did not start within 60 s:\n${output}`)), 60_000);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (output.length > 100_000) output = output.slice(-50_000);
      if (ready.test(output)) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`${what} exited (${code}):\n${output}`));
    });
  });
  return {
    pid: child.pid!,
    output: () => output,
    stop: () =>
      new Promise<void>((resolve) => {
        if (child.exitCode !== null || child.signalCode !== null) return resolve();
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}

export interface BenchBuild {
  app: string;
  payments: string;
  mail: string;
}

/**
 * Compiles the server as `npm start` runs it (scripts/build-server.ts) and the two fakes the same way, so the figures
 * are of plain node, not of a TypeScript loader that also maps every stack trace back to the sources.
 */
export async function buildForBench(outdir: string): Promise<BenchBuild> {
  await buildServer(outdir);
  await build({
    absWorkingDir: path.resolve(import.meta.dirname, '..'),
    entryPoints: { payments: 'fakes/payments/main.ts', mail: 'fakes/mail/main.ts' },
    outdir,
    outExtension: { '.js': '.mjs' },
    bundle: true,
    packages: 'external',
    platform: 'node',
    format: 'esm',
    target: 'node20',
    logLevel: 'warning',
  });
  return { app: path.join(outdir, 'index.mjs'), payments: path.join(outdir, 'payments.mjs'), mail: path.join(outdir, 'mail.mjs') };
}

export interface CheckoutRun {
  processes: number;
  seconds: number;
  orders: number;
  ordersPerS: number;
  /** CPU of the app's processes (and tsx's parent) per order, from the first order until every order is paid and mailed. */
  appCpuMsPerOrder: number;
  /** CPU of the payments and mail fakes per order, over the same span. */
  fakesCpuMsPerOrder: number;
  /** CPU of this process (the buyers' requests) per order, over the measured span. */
  buyersCpuMsPerOrder: number;
  failed: number;
  unpaid: number;
  mailUnsent: number;
  /** Stampede on a part with `scarceUnits` free: how many orders were taken. */
  scarceSold: number;
  scarceUnits: number;
  /** Stock rows with reserved above on hand or either below nought, and rows whose totals differ from their ledger. */
  badStockRows: number;
  ledgerMismatches: number;
}

export interface CheckoutRunOptions {
  root: string;
  /** A catalogue file to copy (the demo catalogue). */
  catalogueFile: string;
  workDir: string;
  build: BenchBuild;
  processes: number;
  seconds: number;
  buyers: number;
  /** Extra settings for the app. */
  serverEnv?: Record<string, string>;
  /** Node flags for the app and the fakes (e.g. `--cpu-prof` to profile them). */
  execArgv?: string[];
  /** Called just before and just after the measured span, with the app's process id (e.g. to signal a profiler). */
  onMeasure?: (phase: 'start' | 'end', appPid: number) => void;
  log?: (message: string) => void;
}

/** Rows whose on-hand or reserved differ from the sum of their ledger's movements, and rows out of bounds. */
export function stockIntegrity(file: string): { badStockRows: number; ledgerMismatches: number } {
  const db = openDatabase(file);
  try {
    const sqlite = db.$client;
    const badStockRows = sqlite.prepare('SELECT count(*) FROM stock WHERE on_hand < 0 OR reserved < 0 OR reserved > on_hand').pluck().get() as number;
    const ledgerMismatches = sqlite
      .prepare(
        `SELECT count(*) FROM stock s LEFT JOIN (
           SELECT part_id, bin_code, sum(on_hand_delta) AS oh, sum(reserved_delta) AS r FROM stock_movements GROUP BY part_id, bin_code
         ) m ON m.part_id = s.part_id AND m.bin_code = s.bin_code
         WHERE s.on_hand != coalesce(m.oh, 0) OR s.reserved != coalesce(m.r, 0)`,
      )
      .pluck()
      .get() as number;
    return { badStockRows, ledgerMismatches };
  } finally {
    db.$client.close();
  }
}

/** Leaves exactly `n` units of a part free, through the stock service so the ledger stays true. */
function setFree(file: string, partNumber: string, n: number) {
  const db = openDatabase(file);
  try {
    const stock = createStockService(db);
    const sqlite = db.$client;
    const id = sqlite.prepare('SELECT id FROM parts WHERE part_number = ?').pluck().get(partNumber) as number;
    const bins = sqlite.prepare('SELECT bin_code AS bin, on_hand - reserved AS free FROM stock WHERE part_id = ? ORDER BY bin_code').all(id) as Array<{ bin: string; free: number }>;
    for (const b of bins) if (b.free > 0) stock.adjust(id, b.bin, -b.free, 'benchmark setup');
    const bin = bins[0]?.bin ?? (sqlite.prepare('SELECT code FROM bins ORDER BY walk_order LIMIT 1').pluck().get() as string);
    if (n > 0) stock.goodsIn(id, bin, n, 'benchmark setup');
  } finally {
    db.$client.close();
  }
}

async function until(what: string, check: () => boolean, timeoutMs: number) {
  const end = Date.now() + timeoutMs;
  while (!check()) {
    if (Date.now() > end) throw new Error(`${what} did not happen within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/**
 * Card checkout against the real server (`APP_PROCESSES` processes) with the payments and mail fakes in processes of
 * their own, the buyers here: every buyer adds a line and pays in a loop for `seconds`. Afterwards it waits until every
 * order is paid by webhook and every message has left the outbox, runs a stampede on a part with 5 free units, and
 * checks the stock against its ledger.
 */
export async function runCheckout(o: CheckoutRunOptions): Promise<CheckoutRun> {
  const log = o.log ?? (() => {});
  fs.mkdirSync(o.workDir, { recursive: true });
  const file = path.join(o.workDir, `checkout-${o.processes}p-${process.pid}-${Date.now()}.db`);
  fs.copyFileSync(o.catalogueFile, file);
  const info = openDatabase(file);
  const pick = (category: string, order: string) =>
    info.$client
      .prepare(
        `SELECT p.part_number FROM parts p JOIN stock s ON s.part_id = p.id WHERE p.category = ? AND p.status = 'active' GROUP BY p.id ORDER BY ${order} LIMIT 1`,
      )
      .pluck()
      .get(category) as string;
  const plenty = pick('gaskets-fittings', 'SUM(s.on_hand) DESC');
  const scarce = pick('cartridges', 'p.id');
  info.$client.close();
  setFree(file, plenty, 1_000_000);

  const appPort = await freePort();
  const appUrl = `http://127.0.0.1:${appPort}`;
  const [paymentsPort, smtpPort, inboxPort] = [await freePort(), await freePort(), await freePort()];
  const payments = await startNode('the payments fake', o.build.payments, {
    PAYMENTS_FAKE_PORT: String(paymentsPort),
    PAYMENTS_FAKE_HOST: '127.0.0.1',
    PAYMENTS_WEBHOOK_URL: `${appUrl}/api/webhooks/payments`,
    PAYMENTS_WEBHOOK_SECRET: WEBHOOK_SECRET,
  }, /listening on/, o.root, o.execArgv);
  const mail = await startNode('the mail fake', o.build.mail, { MAIL_FAKE_SMTP_PORT: String(smtpPort), MAIL_FAKE_HTTP_PORT: String(inboxPort), MAIL_FAKE_HOST: '127.0.0.1' }, /SMTP on/, o.root, o.execArgv);
  let server: Started | null = null;
  try {
    server = await startNode('the app', o.build.app, {
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(appPort),
      APP_PROCESSES: String(o.processes),
      DATABASE_FILE: file,
      UPLOADS_DIR: path.join(o.workDir, 'uploads'),
      SEED_DEMO: 'false',
      SIGNIN_LIMIT_PER_MINUTE: '10000',
      ORDER_PAD_LIMIT_PER_MINUTE: '10000',
      PAYMENTS_API_PORT: String(paymentsPort),
      PAYMENTS_WEBHOOK_SECRET: WEBHOOK_SECRET,
      MAIL_PORT: String(smtpPort),
      MAIL_INBOX_URL: `http://127.0.0.1:${inboxPort}`,
      ...o.serverEnv,
    }, /is running at/, o.root, o.execArgv);
    const srv = server;
    const app = { url: appUrl } as TestApp;

    // Buyers: signed up as a person does; their addresses are marked confirmed here rather than through each link.
    const emails = Array.from({ length: o.buyers }, (_, i) => `bench-buyer-${i}@spoolyard.test`);
    await Promise.all(
      emails.map(async (email, i) => {
        const res = await fetch(`${appUrl}/api/auth/sign-up/email`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', origin: appUrl },
          body: JSON.stringify({ name: `Bench Buyer ${i}`, email, password: PASSWORD }),
        });
        if (res.status !== 200) throw new Error(`sign-up failed: ${res.status}`);
      }),
    );
    const db = openDatabase(file);
    const sqlite = db.$client;
    try {
      sqlite.prepare("UPDATE user SET email_verified = 1 WHERE email LIKE 'bench-buyer-%'").run();
      const buyers: Client[] = [];
      for (const email of emails) {
        const c = clientOf(app);
        const res = await c.send('POST', '/api/auth/sign-in/email', { email, password: PASSWORD });
        if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
        buyers.push(c);
      }

      // Each buyer adds a line and pays, in turn, on a kept-alive connection of its own (scripts/bench-buyer.ts).
      const round: BuyerRequest[] = [
        { method: 'POST', path: '/api/cart/lines', body: JSON.stringify({ partNumber: plenty, quantity: 1 }), expect: 201 },
        { method: 'POST', path: '/api/checkout', body: JSON.stringify({ method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY }), expect: 201 },
      ];
      const loop = async (seconds: number) => {
        const until = performance.now() + seconds * 1000;
        const runs = await Promise.all(buyers.map((c) => buyerLoop(appUrl, { origin: appUrl, cookie: c.cookie(), 'content-type': 'application/json' }, round, until)));
        const failed = runs.reduce((n, r) => n + r.failed, 0);
        if (failed > 0) log(`${failed} requests failed or were refused\n${srv.output().slice(-2000)}`);
        return failed;
      };

      // Warm-up, then wait for it to settle so its webhooks and mail are not charged to the measured orders.
      await loop(1);
      const settled = () =>
        (sqlite.prepare("SELECT count(*) FROM orders WHERE status = 'pending_payment'").pluck().get() as number) === 0 &&
        (sqlite.prepare("SELECT count(*) FROM mail_outbox WHERE state IN ('queued', 'sending')").pluck().get() as number) === 0;
      await until('the warm-up orders being paid and mailed', settled, 60_000).catch((error: unknown) => {
        throw new Error(`${(error as Error).message}; the app said:\n${srv.output().slice(-3000)}`);
      });
      const ordersBefore = sqlite.prepare('SELECT count(*) FROM orders').pluck().get() as number;

      const cpu0 = { app: treeCpuMs(srv.pid), fakes: treeCpuMs(payments.pid) + treeCpuMs(mail.pid) };
      const buyersCpu0 = process.cpuUsage();
      o.onMeasure?.('start', srv.pid);
      const t0 = performance.now();
      const failed = await loop(o.seconds);
      o.onMeasure?.('end', srv.pid);
      const elapsedS = (performance.now() - t0) / 1000;
      const buyersCpu = process.cpuUsage(buyersCpu0);
      let unpaid = 0;
      let mailUnsent = 0;
      try {
        await until('every order paid and mailed', settled, 60_000);
      } catch {
        unpaid = sqlite.prepare("SELECT count(*) FROM orders WHERE status = 'pending_payment'").pluck().get() as number;
        mailUnsent = sqlite.prepare("SELECT count(*) FROM mail_outbox WHERE state IN ('queued', 'sending')").pluck().get() as number;
      }
      const cpu1 = { app: treeCpuMs(srv.pid), fakes: treeCpuMs(payments.pid) + treeCpuMs(mail.pid) };
      const orders = (sqlite.prepare('SELECT count(*) FROM orders').pluck().get() as number) - ordersBefore;

      // The last units, once: every buyer at once for a part with 5 free.
      const scarceUnits = 5;
      setFree(file, scarce, scarceUnits);
      for (const c of buyers) await c.send('POST', '/api/cart/lines', { partNumber: scarce, quantity: 1 });
      const results = await Promise.all(buyers.map((c) => c.send('POST', '/api/checkout', { method: 'card', paymentMethod: 'pm_card_visa', delivery: DELIVERY })));
      const scarceSold = results.filter((r) => r.status === 201).length;
      await until('the stampede orders being paid', settled, 60_000).catch(() => {});

      return {
        processes: o.processes,
        seconds: elapsedS,
        orders,
        ordersPerS: orders / elapsedS,
        appCpuMsPerOrder: (cpu1.app - cpu0.app) / Math.max(1, orders),
        fakesCpuMsPerOrder: (cpu1.fakes - cpu0.fakes) / Math.max(1, orders),
        buyersCpuMsPerOrder: (buyersCpu.user + buyersCpu.system) / 1000 / Math.max(1, orders),
        failed,
        unpaid,
        mailUnsent,
        scarceSold,
        scarceUnits,
        ...stockIntegrity(file),
      };
    } finally {
      sqlite.close();
    }
  } finally {
    await server?.stop();
    await payments.stop();
    await mail.stop();
    for (const suffix of ['', '-wal', '-shm']) fs.rmSync(`${file}${suffix}`, { force: true });
  }
}
