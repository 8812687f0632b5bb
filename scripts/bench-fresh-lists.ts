import { performance } from 'node:perf_hooks';
import { createApp } from '../server/app';
import { openDatabase } from '../server/db/client';
import { PartsQuerySchema, type PartsQuery } from '../shared/schemas/parts';
import { offlineDeps } from '../tests/support/app-deps';
import type { BenchEnv } from './bench-catalogues';
import { section, summarize } from './bench-harness';
import { listSet } from './bench-list-set';

/** A fresh list at 50,000 parts. */
const FRESH_LIST_P95_TARGET_MS = 10;
const ROUNDS = 12;

/** A list's query as it arrives in the address (every value a string), so the handler's parsing is timed too. */
const asAddress = (query: PartsQuery) => Object.fromEntries(Object.entries(query).map(([k, v]) => [k, String(v)]));

/**
 * The catalogue list with no cache in front of it, at each catalogue size: the handler's work for the 25 lists of the
 * list set (parse the address's query, run the list service, write the JSON), each list once per round, beside a bare
 * select of one page of parts in primary-key order timed in the same rounds.
 */
export const freshListSection = section<BenchEnv>(`Fresh catalogue lists, no cache (25 lists × ${ROUNDS} rounds, in process)`, (ctx, env) => {
  for (const cat of env.catalogues) {
    const db = openDatabase(cat.file);
    try {
      // The server's own wiring; the list cache sits in the route, in front of listParts, so this is the fresh list.
      const { catalog } = createApp(offlineDeps(db, { log: () => {} }));
      const lists = listSet(db.$client);
      const bare = db.$client.prepare('SELECT id, part_number, title, category, price_cents FROM parts ORDER BY id LIMIT 24 OFFSET ?');
      const handler = (query: PartsQuery) => JSON.stringify(catalog.listParts(PartsQuerySchema.parse(asAddress(query))));
      for (const [, q] of lists) handler(q);
      const perList = new Map<string, number[]>();
      const listMs: number[] = [];
      const bareMs: number[] = [];
      for (let round = 0; round < ROUNDS; round++) {
        for (const [label, q] of lists) {
          let t = performance.now();
          handler(q);
          const ms = performance.now() - t;
          listMs.push(ms);
          (perList.get(label) ?? perList.set(label, []).get(label)!).push(ms);
          t = performance.now();
          JSON.stringify(bare.all((round * lists.length) % 1000));
          bareMs.push(performance.now() - t);
        }
      }
      const s = summarize(listMs);
      const label = `${cat.parts.toLocaleString('en-US')} parts`;
      // The goal is set at 50,000 parts; larger catalogues are shown for how the lists grow.
      const goal = cat.label === '50k' ? { op: '<=' as const, value: FRESH_LIST_P95_TARGET_MS, on: 'value' as const } : undefined;
      ctx.figure({ figure: `GET /api/parts fresh list handler p95, ${label}`, value: s.p95, unit: 'ms', reference: { name: 'bare select of one page', value: summarize(bareMs).p95 }, goal });
      ctx.record(`fresh list handler p50, ${label}`, s.p50, 'ms');
      ctx.record(`fresh list handler p95, ${label}`, s.p95, 'ms', { target: goal ? { op: '<=', value: FRESH_LIST_P95_TARGET_MS } : undefined });
      const slowest = [...perList].map(([l, xs]) => ({ l, p: summarize(xs).p50 })).sort((a, b) => b.p - a.p).slice(0, 4);
      ctx.log(`${cat.label}: slowest fresh lists (median): ${slowest.map((x) => `${x.l} ${x.p.toFixed(1)} ms`).join('; ')}`);
    } finally {
      db.$client.close();
    }
  }
});
