import { fork } from 'node:child_process';
import { createRequire } from 'node:module';
import path from 'node:path';
import type { BenchEnv } from './bench-catalogues';
import { section } from './bench-harness';

interface AutocannonResult {
  requests: { average: number; total: number };
  latency: { p50: number; p99: number; average: number };
  errors: number;
  timeouts: number;
  non2xx: number;
}
type Autocannon = (options: { url: string; connections: number; duration: number; timeout?: number }) => Promise<AutocannonResult>;

// autocannon ships no type declarations; this is the slice of its API the benchmark uses.
const autocannon = createRequire(import.meta.url)('autocannon') as Autocannon;

const CONNECTIONS = 50;
const LIST_RATIO_TARGET = 0.5;

async function waitIdle(url: string) {
  const res = await fetch(url, { signal: AbortSignal.timeout(120_000) });
  await res.arrayBuffer();
}

interface Ports {
  bareJson: number;
  bareSqlite: number;
  [app: string]: number;
}

function startServers(env: BenchEnv): Promise<{ ports: Ports; stop: () => void }> {
  const child = fork(path.join(env.root, 'scripts', 'bench-servers.ts'), env.catalogues.map((c) => c.file), {
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
      resolve({ ports: m.ports, stop });
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the benchmark servers exited early (code ${code})`));
    });
  });
}

/** Requests/s of the list endpoint beside bare Express routes, servers in a child process, autocannon here. */
export const httpSection = section<BenchEnv>(`GET /api/parts throughput (autocannon, ${CONNECTIONS} connections)`, async (ctx, env) => {
  const { ports, stop } = await startServers(env);
  try {
    const run = async (name: string, url: string, idleUrl: string) => {
      // A short untimed run first so every server is measured warm; before each run the server finishes
      // what an earlier run left queued, so a slow route's backlog is not charged to the next one.
      await waitIdle(idleUrl);
      await autocannon({ url, connections: 10, duration: 1 });
      await waitIdle(idleUrl);
      const r = await autocannon({ url, connections: CONNECTIONS, duration: env.httpDurationS, timeout: 10 });
      const bad = r.errors + r.timeouts + r.non2xx;
      if (bad > 0) throw new Error(`${name}: ${r.errors} errors, ${r.timeouts} timeouts, ${r.non2xx} non-2xx responses`);
      ctx.log(`${name}: ${Math.round(r.requests.average)} req/s, latency p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms`);
      return r;
    };
    const rows: Array<Array<string | number>> = [];
    const measureRow = async (name: string, url: string, idleUrl = url) => {
      const r = await run(name, url, idleUrl);
      rows.push([name, r.requests.average, r.latency.p50, r.latency.p99, r.requests.total]);
      return r.requests.average;
    };
    const bareJson = await measureRow('bare Express, JSON', `http://127.0.0.1:${ports.bareJson}/bare`);
    const bareSqlite = await measureRow('bare Express + better-sqlite3 lookup', `http://127.0.0.1:${ports.bareSqlite}/part`);
    ctx.record('bare Express, JSON', bareJson, 'req/s');
    ctx.record('bare Express + better-sqlite3 lookup', bareSqlite, 'req/s');
    for (const [i, cat] of env.catalogues.entries()) {
      const base = `http://127.0.0.1:${ports[`app${i}`]}/api/parts`;
      const label = `${cat.parts.toLocaleString('en-US')} parts`;
      for (const [what, url] of [
        ['GET /api/parts', base],
        ['GET /api/parts?category=cartridges', `${base}?category=cartridges`],
      ] as const) {
        const rps = await measureRow(`${what}, ${label}`, url, `http://127.0.0.1:${ports[`app${i}`]}/api/health`);
        ctx.record(`${what}, ${label}`, rps, 'req/s');
        ctx.record(`${what}, ${label} ÷ bare + sqlite`, rps / bareSqlite, '×', {
          target: { op: '>=', value: LIST_RATIO_TARGET },
          detail: `÷ bare JSON ${(rps / bareJson).toFixed(2)}`,
        });
      }
    }
    ctx.table(`each run ${env.httpDurationS} s after a 1 s warm-up; servers in a child process, load generator in this one`, ['route', 'req/s', 'p50 ms', 'p99 ms', 'requests'], rows);
  } finally {
    stop();
  }
});
