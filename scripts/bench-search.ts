import { performance } from 'node:perf_hooks';
import { createApp } from '../server/app';
import { offlineDeps } from '../tests/support/app-deps';
import { openDatabase } from '../server/db/client';
import { PartsQuerySchema } from '../shared/schemas/parts';
import type { BenchCatalogue, BenchEnv } from './bench-catalogues';
import { section, summarize, type LatencySummary, type SectionContext } from './bench-harness';
import { buildQueries, QUERY_KINDS, type BenchQuery } from './bench-queries';

/** The goals at 50,000 parts: `search()` in process, and the whole `GET /api/parts?q=` handler. */
const SEARCH_P95_TARGET_MS = 5;
const HANDLER_P95_TARGET_MS = 15;
const GOAL_PARTS = 50_000;
const ROUNDS = 3;

interface Measured {
  search: LatencySummary;
  handler: LatencySummary;
  /** The reference: a bare FTS5 prefix query on the words index for the same text. */
  fts: LatencySummary;
  byKind: Map<string, { search: LatencySummary; handler: LatencySummary }>;
  exactFirst: { hit: number; of: number };
}

function measure(cat: BenchCatalogue, ctx: SectionContext): Measured {
  const db = openDatabase(cat.file);
  try {
    const t0 = performance.now();
    // The same wiring the server uses: createApp builds the search index, listParts is the handler's work.
    const { search, catalog } = createApp(offlineDeps(db, { log: () => {} }));
    ctx.log(`${cat.label}: index built in ${((performance.now() - t0) / 1000).toFixed(1)} s`);
    const queries = buildQueries(db.$client);
    const runHandler = (q: BenchQuery) => JSON.stringify(catalog.listParts(PartsQuerySchema.parse({ q: q.q })));
    // The reference's own FTS5 table (the shop's search lives in memory and keeps none on disk): in the temp schema, so
    // the catalogue file is left as it was; the tokenizer and prefix indexes the shop once used on disk.
    db.$client.exec(
      "CREATE VIRTUAL TABLE temp.ref_fts USING fts5(part_id UNINDEXED, title, body, tokenize = 'unicode61 remove_diacritics 2', prefix = '2 3');" +
        'INSERT INTO temp.ref_fts (part_id, title, body) SELECT id, title, description FROM parts;',
    );
    const ftsPrefix = db.$client.prepare('SELECT part_id FROM temp.ref_fts WHERE ref_fts MATCH ? LIMIT 50');
    const runFts = (q: BenchQuery) => ftsPrefix.all(ftsPrefixQuery(q.q));

    // One untimed pass, so the figures are steady-state rather than the first call's JIT and page-cache warm-up.
    for (const q of queries) {
      search.search(q.q);
      runHandler(q);
      runFts(q);
    }
    const searchMs = new Map<BenchQuery, number[]>();
    const handlerMs = new Map<BenchQuery, number[]>();
    const ftsMs: number[] = [];
    for (let round = 0; round < ROUNDS; round++) {
      for (const q of queries) {
        let t = performance.now();
        search.search(q.q);
        (searchMs.get(q) ?? searchMs.set(q, []).get(q)!).push(performance.now() - t);
        t = performance.now();
        runHandler(q);
        (handlerMs.get(q) ?? handlerMs.set(q, []).get(q)!).push(performance.now() - t);
        t = performance.now();
        runFts(q);
        ftsMs.push(performance.now() - t);
      }
    }
    const all = (m: Map<BenchQuery, number[]>, kind?: string) => [...m].filter(([q]) => !kind || q.kind === kind).flatMap(([, xs]) => xs);
    const byKind = new Map(QUERY_KINDS.map((k) => [k, { search: summarize(all(searchMs, k)), handler: summarize(all(handlerMs, k)) }]));

    const expecting = queries.filter((q) => q.expectFirst);
    const hit = expecting.filter((q) => {
      const first = search.search(q.q)[0];
      return first !== undefined && db.$client.prepare('SELECT part_number AS n FROM parts WHERE id = ?').pluck().get(first.partId) === q.expectFirst;
    }).length;

    const slowest = [...searchMs].map(([q, xs]) => ({ q, ms: Math.max(...xs) })).sort((a, b) => b.ms - a.ms).slice(0, 5);
    ctx.log(`${cat.label}: slowest search queries: ${slowest.map((s) => `${s.q.kind} "${s.q.q}" ${s.ms.toFixed(1)} ms`).join('; ')}`);
    return { search: summarize(all(searchMs)), handler: summarize(all(handlerMs)), fts: summarize(ftsMs), byKind, exactFirst: { hit, of: expecting.length } };
  } finally {
    db.$client.close();
  }
}

/** The reference query: the first word or number of the text as an FTS5 prefix term, e.g. `"gimlet"*`. */
export function ftsPrefixQuery(text: string): string {
  const token = /[\p{L}\p{N}]{2,}/u.exec(text.toLowerCase())?.[0] ?? 'aa';
  return `"${token}"*`;
}

/** Search latency for 100 mixed queries, on the demo catalogue and on each generated size. */
export const searchSection = section<BenchEnv>('Search latency (100 mixed queries × 3 rounds)', (ctx, env) => {
  const results = env.catalogues.map((cat) => ({ cat, m: measure(cat, ctx) }));
  for (const { cat, m } of results) {
    const label0 = `${cat.parts.toLocaleString('en-US')} parts`;
    const reference = { name: 'FTS5 prefix query, same text', value: m.fts.p95 };
    const atGoalSize = cat.parts === GOAL_PARTS;
    const goal = (value: number) => (atGoalSize ? { op: '<=' as const, value, on: 'value' as const } : undefined);
    ctx.figure({ figure: `search() p95, ${label0}`, value: m.search.p95, unit: 'ms', reference, goal: goal(SEARCH_P95_TARGET_MS) });
    ctx.figure({ figure: `GET /api/parts?q= handler p95, ${label0}`, value: m.handler.p95, unit: 'ms', reference, goal: goal(HANDLER_P95_TARGET_MS) });
    const label = `${cat.parts.toLocaleString('en-US')} parts`;
    ctx.record(`search() p50, ${label}`, m.search.p50, 'ms');
    ctx.record(`search() p95, ${label}`, m.search.p95, 'ms', { target: atGoalSize ? { op: '<=', value: SEARCH_P95_TARGET_MS } : undefined });
    ctx.record(`GET /api/parts?q= handler p50, ${label}`, m.handler.p50, 'ms');
    ctx.record(`GET /api/parts?q= handler p95, ${label}`, m.handler.p95, 'ms', { target: atGoalSize ? { op: '<=', value: HANDLER_P95_TARGET_MS } : undefined });
    ctx.record(`exact / lower-case numbers ranked first, ${label}`, (100 * m.exactFirst.hit) / m.exactFirst.of, '%', {
      target: { op: '>=', value: 100 },
      detail: `${m.exactFirst.hit} of ${m.exactFirst.of}`,
    });
  }
  ctx.table(
    'p50 / p95 / max in ms by query kind (search() | whole handler)',
    ['kind', ...results.flatMap(({ cat }) => [`search ${cat.label}`, `handler ${cat.label}`])],
    QUERY_KINDS.map((k) => [
      k,
      ...results.flatMap(({ m }) => {
        const s = m.byKind.get(k)!;
        const f = (x: LatencySummary) => `${x.p50.toFixed(1)} / ${x.p95.toFixed(1)} / ${x.max.toFixed(1)}`;
        return [f(s.search), f(s.handler)];
      }),
    ]),
  );
});
