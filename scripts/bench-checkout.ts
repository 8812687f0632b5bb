import fs from 'node:fs';
import path from 'node:path';
import type { BenchEnv } from './bench-catalogues';
import { buildForBench, runCheckout, type CheckoutRun } from './bench-checkout-load';
import { interleave, median, treeCpuMs } from './bench-figures';
import { section } from './bench-harness';
import { load, startServers } from './bench-http';

/** Buyers checking out at once (fewer in a smoke run: each is signed up and in, which costs a password hash). */
const buyersFor = (quick: boolean) => (quick ? 8 : 24);
const ORDERS_PER_S_GOAL = 300;

/**
 * Card checkout through the compiled server with 1 and with 2 app processes (APP_PROCESSES), the payments and mail
 * fakes in processes of their own and the buyers here, interleaved (1 2, 2 1 …); beside it, in the same run, a bare
 * Express route writing one SQLite row, of which an order costs two (the cart line and the order). After every run the
 * stock is checked: nothing oversold in a stampede on the last units, every row equal to its ledger's sum.
 */
export const checkoutSection = section<BenchEnv>('Card checkout, 1 and 2 app processes', async (ctx, env) => {
  const demo = env.catalogues[0];
  if (!demo) throw new Error('the catalogue section did not build the demo catalogue');
  const dir = path.join(env.workDir, 'checkout');
  fs.mkdirSync(dir, { recursive: true });
  const build = await buildForBench(path.join(dir, 'build'));
  const seconds = Math.max(2, env.httpDurationS);
  const buyers = buyersFor(env.quick);

  const refFile = path.join(dir, 'reference.db');
  fs.copyFileSync(demo.file, refFile);
  const servers = await startServers(env, refFile);
  const bareWrite = async () => {
    let cpu0 = 0;
    const r = await load(
      'bare write',
      `http://127.0.0.1:${servers.ports.bareWrite}/write`,
      seconds,
      { requests: [{ method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ partNumber: 'QQQ-00-0000', quantity: 1 }) }] },
      () => (cpu0 = treeCpuMs(servers.pid)),
    );
    return { perS: r.requests.average, cpuMsPerRequest: (treeCpuMs(servers.pid) - cpu0) / Math.max(1, r.requests.total) };
  };

  const runs: Record<number, CheckoutRun[]> = { 1: [], 2: [] };
  const refs: Array<{ perS: number; cpuMsPerRequest: number }> = [];
  try {
    for (const processes of interleave([1, 2], env.rounds)) {
      refs.push(await bareWrite());
      const r = await runCheckout({ root: env.root, build, catalogueFile: demo.file, workDir: dir, processes, seconds, buyers, log: (m) => ctx.log(m) });
      runs[processes]!.push(r);
      ctx.log(
        `${processes} process(es): ${r.ordersPerS.toFixed(1)} orders/s, app ${r.appCpuMsPerOrder.toFixed(2)} ms CPU/order, fakes ${r.fakesCpuMsPerOrder.toFixed(2)} ms; ` +
          `${r.failed} failed, ${r.unpaid} unpaid, ${r.mailUnsent} mails unsent; ${r.scarceSold} of ${r.scarceUnits} last units sold; ${r.badStockRows + r.ledgerMismatches} stock rows wrong`,
      );
    }
  } finally {
    servers.stop();
  }

  const twoWrites = { name: 'two bare Express + SQLite writes', value: median(refs.map((r) => r.perS)) / 2 };
  const twoWritesCpu = { name: 'CPU of two bare writes', value: 2 * median(refs.map((r) => r.cpuMsPerRequest)) };
  for (const processes of [1, 2]) {
    const rs = runs[processes]!;
    ctx.figure({
      figure: `card checkout, ${processes} app process${processes === 1 ? '' : 'es'}, fakes apart`,
      value: median(rs.map((r) => r.ordersPerS)),
      unit: 'orders/s',
      reference: twoWrites,
      ...(processes === 2 ? { goal: { op: '>=' as const, value: ORDERS_PER_S_GOAL, on: 'value' as const } } : {}),
    });
    ctx.figure({ figure: `app CPU per card order, ${processes} process${processes === 1 ? '' : 'es'}`, value: median(rs.map((r) => r.appCpuMsPerOrder)), unit: 'ms', reference: twoWritesCpu });
    ctx.figure({ figure: `fakes' CPU per card order, ${processes} process${processes === 1 ? '' : 'es'}`, value: median(rs.map((r) => r.fakesCpuMsPerOrder)), unit: 'ms' });
    const worst = (pick: (r: CheckoutRun) => number) => Math.max(...rs.map(pick));
    ctx.figure({ figure: `units oversold, ${processes} process${processes === 1 ? '' : 'es'} (last ${rs[0]!.scarceUnits} units, ${buyers} buyers at once)`, value: worst((r) => Math.max(0, r.scarceSold - r.scarceUnits)), unit: 'units', goal: { op: '<=', value: 0, on: 'value' } });
    ctx.figure({ figure: `stock rows off their ledger or out of bounds, ${processes} process${processes === 1 ? '' : 'es'}`, value: worst((r) => r.badStockRows + r.ledgerMismatches), unit: 'rows', goal: { op: '<=', value: 0, on: 'value' } });
    ctx.figure({ figure: `orders left unpaid or mail left unsent after the run, ${processes} process${processes === 1 ? '' : 'es'}`, value: worst((r) => r.unpaid + r.mailUnsent + r.failed), unit: 'orders/mails', goal: { op: '<=', value: 0, on: 'value' } });
  }
});
