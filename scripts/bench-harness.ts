import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { markdownTable, meetsGoal, type FigureRow } from './bench-figures';

/** A bound a measured value must meet; `<=` for latencies, `>=` for throughput and ratios. */
export interface Target {
  op: '<=' | '>=';
  value: number;
}

export interface BenchRow {
  section: string;
  measure: string;
  value: number;
  unit: string;
  target?: Target;
  pass?: boolean;
  detail?: string;
}

export interface BenchTable {
  section: string;
  title: string;
  headers: string[];
  rows: Array<Array<string | number>>;
}

export interface SectionContext {
  /** Adds one figure to the summary table (and the JSON); with a target it gets PASS or MISS. */
  record(measure: string, value: number, unit: string, options?: { target?: Target; detail?: string }): BenchRow;
  /** An extra breakdown table printed after the summary. */
  table(title: string, headers: string[], rows: Array<Array<string | number>>): void;
  /** A row of the closing markdown table: a figure beside the reference measured with it in the same run. */
  figure(row: FigureRow): void;
  log(message: string): void;
}

export interface BenchSection<E> {
  name: string;
  run: (ctx: SectionContext, env: E) => Promise<void> | void;
}

/** Declares a benchmark section; `bench.ts` runs them in order, each with the shared catalogues. */
export function section<E>(name: string, run: (ctx: SectionContext, env: E) => Promise<void> | void): BenchSection<E> {
  return { name, run };
}

export interface BenchReport {
  machine: { cores: number; cpu: string; memoryGb: number; node: string; platform: string };
  startedAt: string;
  durationMs: number;
  sections: Array<{ name: string; durationMs: number; error?: string }>;
  rows: BenchRow[];
  tables: BenchTable[];
  figures: FigureRow[];
}

export function machineInfo(): BenchReport['machine'] {
  return {
    cores: os.availableParallelism(),
    cpu: os.cpus()[0]?.model ?? 'unknown',
    memoryGb: Math.round(os.totalmem() / 2 ** 30),
    node: process.version,
    platform: `${os.platform()} ${os.arch()}`,
  };
}

/** Nearest-rank percentile of an ascending array. */
export function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  const rank = Math.ceil((p / 100) * sorted.length);
  return sorted[Math.min(sorted.length, Math.max(1, rank)) - 1]!;
}

export interface LatencySummary {
  n: number;
  p50: number;
  p95: number;
  max: number;
  mean: number;
}

export function summarize(samples: number[]): LatencySummary {
  const sorted = [...samples].sort((a, b) => a - b);
  const mean = sorted.reduce((s, x) => s + x, 0) / (sorted.length || 1);
  return { n: sorted.length, p50: percentile(sorted, 50), p95: percentile(sorted, 95), max: sorted.at(-1) ?? Number.NaN, mean };
}

const meets = (value: number, t: Target) => (t.op === '<=' ? value <= t.value : value >= t.value);

export function formatNumber(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (Math.abs(value) >= 1000) return Math.round(value).toLocaleString('en-US');
  if (Math.abs(value) >= 100) return value.toFixed(0);
  if (Math.abs(value) >= 10) return value.toFixed(1);
  return value.toFixed(2);
}

function printGrid(headers: string[], rows: string[][]) {
  const widths = headers.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) => cells.map((c, i) => (i === 0 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join('  ');
  console.log(line(headers));
  console.log(widths.map((w) => '-'.repeat(w)).join('  '));
  for (const r of rows) console.log(line(r));
}

export function printReport(report: BenchReport) {
  const m = report.machine;
  console.log(`\nMachine: ${m.cores} cores (os.availableParallelism), ${m.cpu}, ${m.memoryGb} GB, Node ${m.node}, ${m.platform}`);
  for (const s of report.sections) {
    const rows = report.rows.filter((r) => r.section === s.name);
    console.log(`\n${s.name} (${(s.durationMs / 1000).toFixed(1)} s)${s.error ? ` — FAILED: ${s.error}` : ''}`);
    if (rows.length > 0) {
      printGrid(
        ['measure', 'value', 'unit', 'target', 'result'],
        rows.map((r) => [
          r.measure,
          formatNumber(r.value),
          r.unit,
          r.target ? `${r.target.op} ${formatNumber(r.target.value)}` : '',
          r.target ? (r.pass ? 'PASS' : 'MISS') : '',
        ]),
      );
    }
    for (const t of report.tables.filter((x) => x.section === s.name)) {
      console.log(`\n  ${t.title}`);
      printGrid(t.headers, t.rows.map((r) => r.map((c) => (typeof c === 'number' ? formatNumber(c) : c))));
    }
  }
  const targeted = report.rows.filter((r) => r.target);
  const missed = targeted.filter((r) => !r.pass);
  console.log(`\nTargets: ${targeted.length - missed.length} of ${targeted.length} met${missed.length ? `; missed: ${missed.map((r) => r.measure).join('; ')}` : ''}`);
  if (report.figures.length > 0) {
    const goals = report.figures.filter((f) => f.goal);
    console.log(`\n${markdownTable(report.figures)}\n\nGoals: ${goals.filter((f) => meetsGoal(f)).length} of ${goals.length} met`);
  }
  console.log(`Total time ${(report.durationMs / 1000).toFixed(1)} s`);
}

/** Runs the sections in order; a failing section is reported and the rest still run. */
export async function runSections<E>(sections: Array<BenchSection<E>>, env: E): Promise<BenchReport> {
  const started = Date.now();
  const report: BenchReport = { machine: machineInfo(), startedAt: new Date(started).toISOString(), durationMs: 0, sections: [], rows: [], tables: [], figures: [] };
  for (const s of sections) {
    console.log(`\n== ${s.name} ==`);
    const t0 = Date.now();
    const ctx: SectionContext = {
      record(measure, value, unit, options = {}) {
        const row: BenchRow = { section: s.name, measure, value, unit, ...options };
        if (options.target) row.pass = meets(value, options.target);
        report.rows.push(row);
        return row;
      },
      table(title, headers, rows) {
        report.tables.push({ section: s.name, title, headers, rows });
      },
      figure(row) {
        report.figures.push(row);
      },
      log(message) {
        console.log(`  ${message}`);
      },
    };
    const entry: BenchReport['sections'][number] = { name: s.name, durationMs: 0 };
    try {
      await s.run(ctx, env);
    } catch (err) {
      entry.error = err instanceof Error ? err.message : String(err);
      console.error(err);
    }
    entry.durationMs = Date.now() - t0;
    report.sections.push(entry);
  }
  report.durationMs = Date.now() - started;
  return report;
}

export function writeReport(report: BenchReport, file: string) {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, `${JSON.stringify(report, null, 2)}\n`);
}
