// Search figures on a seeded catalogue: `npx tsx scripts/measure-search.ts <db file>` (seed with
// `npm run seed -- --parts 50000 --file <db> --reset`). Prints medians and 95th percentiles of search() and of the
// whole GET /api/parts?q= handler's work, the total for a common phrase against a SQL count, and what a one-part
// refresh costs. A copy of the database is used, so the seeded file stays as it was.
import fs from 'node:fs';
import { performance } from 'node:perf_hooks';
import { createApp } from '../server/app';
import { openDatabase } from '../server/db/client';
import { PartsQuerySchema } from '../shared/schemas/parts';
import { offlineDeps } from '../tests/support/app-deps';
import { buildQueries } from './bench-queries';
import { summarize } from './bench-harness';

const source = process.argv[2];
if (!source) throw new Error('usage: measure-search.ts <db file>');
const file = `${source}.measure.db`;
for (const s of ['', '-wal', '-shm']) fs.rmSync(`${file}${s}`, { force: true });
fs.copyFileSync(source, file);
const db = openDatabase(file);
let t = performance.now();
const { search, catalog } = createApp(offlineDeps(db, { log: () => {} }));
console.log(`index ready in ${(performance.now() - t).toFixed(0)} ms`);
const queries = [...buildQueries(db.$client).map((q) => q.q), 'turbine housing', 'turbocharger', 'cartridge', 'gasket', 'ball bearing'];
const handler = (q: string) => JSON.stringify(catalog.listParts(PartsQuerySchema.parse({ q })));
for (const q of queries) {
  search.search(q);
  handler(q);
}
// Wall time, and CPU time of the process (less disturbed when other work shares the machine's cores).
const cpuMs = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};
const s: number[] = [];
const h: number[] = [];
const sc: number[] = [];
const hc: number[] = [];
for (let round = 0; round < 5; round++) {
  for (const q of queries) {
    t = performance.now();
    let c = cpuMs();
    search.search(q);
    sc.push(cpuMs() - c);
    s.push(performance.now() - t);
    t = performance.now();
    c = cpuMs();
    handler(q);
    hc.push(cpuMs() - c);
    h.push(performance.now() - t);
  }
}
const f = (x: ReturnType<typeof summarize>) => `median ${x.p50.toFixed(2)} ms, p95 ${x.p95.toFixed(2)} ms, max ${x.max.toFixed(1)} ms`;
console.log(`search():            ${f(summarize(s))}`);
console.log(`GET /api/parts?q=:   ${f(summarize(h))}`);
console.log(`search() CPU:        ${f(summarize(sc))}`);
console.log(`GET /api/parts?q= CPU: ${f(summarize(hc))}`);
const phrase = catalog.listParts(PartsQuerySchema.parse({ q: 'turbine housing' }));
const counted = db.$client.prepare("SELECT count(*) FROM parts p WHERE lower(p.title) LIKE '%turbine housing%'").pluck().get();
console.log(`"turbine housing": total ${phrase.total}, category facet sum ${phrase.facets.category.reduce((a, b) => a + b.count, 0)}, titles containing it ${String(counted)}`);
const id = db.$client.prepare("SELECT id FROM parts WHERE status = 'active' ORDER BY id DESC LIMIT 1").pluck().get() as number;
const r: number[] = [];
for (let i = 0; i < 5; i++) {
  db.$client.prepare("UPDATE parts SET title = title || ' x', updated_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?").run(id);
  t = performance.now();
  search.refresh([id]);
  search.search('turbine housing');
  r.push(performance.now() - t);
}
console.log(`one-part refresh then a search: ${f(summarize(r))}`);
db.$client.close();
for (const x of ['', '-wal', '-shm']) fs.rmSync(`${file}${x}`, { force: true });
