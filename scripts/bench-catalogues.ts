import fs from 'node:fs';
import path from 'node:path';
import { performance } from 'node:perf_hooks';
import { generateCatalogue } from '../catalog-seed/generate';
import { loadCatalogue } from '../catalog-seed/load';
import { openDatabase } from '../server/db/client';
import { section } from './bench-harness';

export interface BenchCatalogue {
  label: string;
  file: string;
  parts: number;
}

export interface BenchEnv {
  root: string;
  workDir: string;
  /** Generated catalogue sizes for the search figures, besides the demo catalogue. */
  sizes: number[];
  httpDurationS: number;
  /** Interleaved rounds per figure (figure and reference once each per round). */
  rounds: number;
  /** A smoke run: fewer buyers and rounds, rough figures. */
  quick: boolean;
  /** Filled by the catalogue section: the demo catalogue first, then one per size. */
  catalogues: BenchCatalogue[];
}

export function removeDatabase(file: string) {
  for (const suffix of ['', '-wal', '-shm']) fs.rmSync(`${file}${suffix}`, { force: true });
}

/** Generates and loads the demo and the large catalogue into fresh SQLite files under the work directory. */
export const catalogueSection = section<BenchEnv>('Catalogues', (ctx, env) => {
  fs.mkdirSync(env.workDir, { recursive: true });
  const wanted: Array<[string, number | undefined]> = [['demo', undefined], ...env.sizes.map((n): [string, number] => [`${Math.round(n / 1000)}k`, n])];
  for (const [label, parts] of wanted) {
    const file = path.join(env.workDir, `catalogue-${label}.db`);
    removeDatabase(file);
    const t0 = performance.now();
    const seed = generateCatalogue({ parts });
    const t1 = performance.now();
    const db = openDatabase(file);
    loadCatalogue(db, seed);
    db.$client.close();
    const t2 = performance.now();
    env.catalogues.push({ label, file, parts: seed.parts.length });
    ctx.record(`${label} catalogue: parts`, seed.parts.length, 'parts');
    ctx.record(`${label} catalogue: generate + load`, (t2 - t0) / 1000, 's', { detail: `generate ${((t1 - t0) / 1000).toFixed(1)} s` });
  }
});
