import { fork } from 'node:child_process';
import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { openDatabase } from '../server/db/client';
import { createStockService } from '../server/services/stock';
import { testConfig } from '../tests/support/app-deps';
import type { BenchEnv } from './bench-catalogues';
import { median } from './bench-figures';
import { section } from './bench-harness';

interface AutocannonResult {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number; average: number };
  errors: number;
  timeouts: number;
  non2xx: number;
}
interface AutocannonRequest {
  method?: string;
  path?: string;
  headers?: Record<string, string>;
  body?: string;
  setupRequest?: (req: AutocannonRequest) => AutocannonRequest;
}
type Autocannon = (options: {
  url: string;
  connections: number;
  duration: number;
  timeout?: number;
  headers?: Record<string, string>;
  requests?: AutocannonRequest[];
}) => Promise<AutocannonResult>;

// autocannon ships no type declarations; this is the slice of its API the benchmark uses.
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

const CONNECTIONS = 50;
const LIST_RATIO_GOAL = 0.5;
const WRITES_PER_S = 10;

interface Ports {
  bareJson: number;
  bareSqlite: number;
  bareWrite: number;
  app0: number;
}

export function startServers(env: BenchEnv, file: string): Promise<{ ports: Ports; pid: number; stop: () => void }> {
  const child = fork(path.join(env.root, 'scripts', 'bench-servers.ts'), [file], {
    cwd: env.root,
    execArgv: ['--import', 'tsx'],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const stop = () => {
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
  };
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      stop();
      reject(new Error('the benchmark servers did not start within 120 s'));
    }, 120_000);
    child.once('message', (m: { ports: Ports }) => {
      clearTimeout(timer);
      resolve({ ports: m.ports, pid: child.pid!, stop });
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the benchmark servers exited early (code ${code})`));
    });
  });
}

/** Load with autocannon after a short untimed warm-up; any error or non-2xx answer fails the run. */
export async function load(
  name: string,
  url: string,
  seconds: number,
  extra: { headers?: Record<string, string>; requests?: AutocannonRequest[] } = {},
  afterWarmUp?: () => void,
) {
  await autocannon({ url, connections: 10, duration: 1, ...extra });
  afterWarmUp?.();
  const r = await autocannon({ url, connections: CONNECTIONS, duration: seconds, timeout: 10, ...extra });
  const bad = r.errors + r.timeouts + r.non2xx;
  if (bad > 0) throw new Error(`${name}: ${r.errors} errors, ${r.timeouts} timeouts, ${r.non2xx} non-2xx responses`);
  return r;
}

/** A signed-in customer on the benchmark app: signed up, its address marked confirmed in the file, signed in. */
async function signedInCookie(appUrl: string, file: string): Promise<string> {
  const origin = new URL(testConfig().publicUrl).origin;
  const email = 'bench-lists@spoolyard.test';
  const password = 'bench-password-1';
  const post = (p: string, body: unknown) =>
    fetch(`${appUrl}${p}`, { method: 'POST', headers: { 'content-type': 'application/json', origin }, body: JSON.stringify(body) });
  const signUp = await post('/api/auth/sign-up/email', { name: 'Bench Lists', email, password });
  if (signUp.status !== 200) throw new Error(`sign-up failed: ${signUp.status}`);
  const db = openDatabase(file);
  db.$client.prepare('UPDATE user SET email_verified = 1 WHERE email = ?').run(email);
  db.$client.close();
  const signIn = await post('/api/auth/sign-in/email', { email, password });
  if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status}`);
  return signIn.headers
    .getSetCookie()
    .map((c) => c.split(';')[0]!)
    .join('; ');
}

/** Ten stock moves a second on one part, through the stock service (ledger kept true); each one invalidates list caches. */
function startWriter(file: string) {
  const db = openDatabase(file);
  const stock = createStockService(db);
  const row = db.$client.prepare("SELECT part_id AS partId, bin_code AS bin FROM stock WHERE on_hand > 10 ORDER BY part_id LIMIT 1").get() as { partId: number; bin: string };
  let writes = 0;
  const timer = setInterval(() => {
    stock.adjust(row.partId, row.bin, writes % 2 === 0 ? -1 : 1, 'benchmark: a write while lists are read');
    writes++;
  }, 1000 / WRITES_PER_S);
  return {
    stop: () => {
      clearInterval(timer);
      db.$client.close();
      return writes;
    },
  };
}

/**
 * The catalogue list through the whole app, four ways, each beside a bare Express route with one SQLite select measured
 * in the same round, in alternating order (reference first, then the figure; next round the other way round).
 */
export const httpSection = section<BenchEnv>(`Catalogue list beside bare Express + SQLite (autocannon, ${CONNECTIONS} connections)`, async (ctx, env) => {
  const demo = env.catalogues[0];
  if (!demo) throw new Error('the catalogue section did not build the demo catalogue');
  const file = path.join(env.workDir, 'lists.db');
  for (const suffix of ['', '-wal', '-shm']) fs.rmSync(`${file}${suffix}`, { force: true });
  fs.copyFileSync(demo.file, file);
  const { ports, stop } = await startServers(env, file);
  try {
    const app = `http://127.0.0.1:${ports.app0}`;
    const bare = `http://127.0.0.1:${ports.bareSqlite}/part`;
    const cookie = await signedInCookie(app, file);
    let random = 1;
    const nextRandom = () => (random = (random * 48_271) % 2_147_483_647);
    // The goal (≥ 0.5× the bare route) is for lists served from the cache: with writes going on and signed in. A list
    // never cached is held to its time instead, in process, by the fresh-list section (≤ 10 ms at 50,000 parts).
    const figures: Array<{ name: string; run: () => Promise<AutocannonResult>; goal?: boolean }> = [
      {
        name: 'GET /api/parts, uncached (a different minimum power each request)',
        goal: false,
        run: () => load('uncached', app, env.httpDurationS, { requests: [{ setupRequest: (req) => ({ ...req, path: `/api/parts?minHp=${nextRandom() % 3000}` }) }] }),
      },
      { name: 'GET /api/parts, cached', run: () => load('cached', `${app}/api/parts`, env.httpDurationS) },
      {
        name: `GET /api/parts, cached, ${WRITES_PER_S} stock writes/s going on`,
        run: async () => {
          const writer = startWriter(file);
          try {
            return await load('cached with writes', `${app}/api/parts`, env.httpDurationS);
          } finally {
            const writes = writer.stop();
            ctx.log(`${writes} stock writes during the run`);
          }
        },
      },
      { name: 'GET /api/parts, cached, signed in (session cookie)', run: () => load('signed in', `${app}/api/parts`, env.httpDurationS, { headers: { cookie } }) },
    ];
    const rows: Array<Array<string | number>> = [];
    for (const f of figures) {
      const values: number[] = [];
      const refs: number[] = [];
      for (let round = 0; round < env.rounds; round++) {
        const pair = round % 2 === 0 ? (['ref', 'app'] as const) : (['app', 'ref'] as const);
        for (const which of pair) {
          const r = which === 'ref' ? await load('bare + sqlite', bare, env.httpDurationS) : await f.run();
          (which === 'ref' ? refs : values).push(r.requests.average);
          rows.push([which === 'ref' ? 'bare Express + SQLite select' : f.name, r.requests.average, r.latency.p50, r.latency.p99]);
        }
      }
      ctx.figure({
        figure: f.name,
        value: median(values),
        unit: 'req/s',
        reference: { name: 'bare Express + 1 SQLite select', value: median(refs) },
        ...(f.goal === false ? {} : { goal: { op: '>=' as const, value: LIST_RATIO_GOAL, on: 'ratio' as const } }),
      });
    }
    ctx.table(`each run ${env.httpDurationS} s after a 1 s warm-up, ${env.rounds} round(s); servers in a child process, load generator in this one`, ['route', 'req/s', 'p50 ms', 'p99 ms'], rows);
  } finally {
    stop();
  }
});
