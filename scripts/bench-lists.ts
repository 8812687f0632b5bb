/**
 * Times a fresh (uncached) catalogue list in process, for the lists buyers open most: the search-less list, a
 * category page, a filter facet, each sort and a few filter mixes. Prints the median and 90th percentile of many
 * runs of the list service itself (no HTTP, no cache), and the query plan of each list's rows.
 *
 *   npm run seed -- --parts 50000 --file .tmp/50k.db --reset
 *   npx tsx scripts/bench-lists.ts .tmp/50k.db [runs] [--plans]
 *
 * The file is copied first: opening it applies pending migrations, and the timing should not depend on them.
 */
import fs from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { openDatabase } from '../server/db/client';
import { createCatalogService } from '../server/services/catalog';
import { createSearchService } from '../server/services/search';
import { listSet } from './bench-list-set';

const source = process.argv[2];
const runs = Number(process.argv.slice(3).find((a) => /^\d+$/.test(a)) ?? 60);
if (!source || !fs.existsSync(source)) {
  console.error('usage: tsx scripts/bench-lists.ts <database file> [runs]');
  process.exit(2);
}
const copy = path.join(path.dirname(source), `bench-lists-${process.pid}.db`);
fs.copyFileSync(source, copy);
const db = openDatabase(copy);
const search = createSearchService(db);
search.rebuild();
const catalog = createCatalogService(db, search);
const lists = listSet(db.$client);

function median(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}
function p90(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length * 0.9)]!;
}

// The rows query of each list (the one with a LIMIT), caught as it runs, for its query plan.
const seen: Array<{ sql: string; params: unknown[] }> = [];
const prepare = db.$client.prepare.bind(db.$client);
db.$client.prepare = ((source: string) => {
  const statement = prepare(source);
  if (!/ limit \?/i.test(source)) return statement;
  const all = statement.all.bind(statement);
  statement.all = ((...params: unknown[]) => {
    seen.push({ sql: source, params });
    return all(...params);
  }) as typeof statement.all;
  return statement;
}) as typeof db.$client.prepare;
const showPlans = process.argv.includes('--plans');

const parts = prepare('SELECT count(*) FROM parts').pluck().get() as number;
console.log(`${parts} parts, ${runs} runs each (median / p90 ms of a fresh list, total rows)`);
for (const [label, query] of lists) {
  for (let i = 0; i < 5; i++) catalog.listParts(query);
  const times: number[] = [];
  let total = 0;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    total = catalog.listParts(query).total;
    times.push(performance.now() - t0);
  }
  console.log(`${label.padEnd(32)} ${median(times).toFixed(2).padStart(7)} ${p90(times).toFixed(2).padStart(7)}  ${total}`);
  const last = seen.at(-1);
  if (showPlans && last) {
    for (const step of prepare(`EXPLAIN QUERY PLAN ${last.sql}`).all(...last.params) as Array<{ detail: string }>) console.log(`    ${step.detail}`);
  }
  seen.length = 0;
}
db.$client.close();
for (const suffix of ['', '-wal', '-shm']) fs.rmSync(`${copy}${suffix}`, { force: true });
