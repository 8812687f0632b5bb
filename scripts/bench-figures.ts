import fs from 'node:fs';

/** Pure helpers of the benchmark (tested in tests/unit/bench-figures.test.ts). */

export function median(xs: number[]): number {
  if (xs.length === 0) return Number.NaN;
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 === 1 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

/**
 * The rounds of an interleaved comparison: each variant once per round, the order alternating (A B, B A, A B …) so a
 * load that grows or fades on the machine weighs on every variant alike.
 */
export function interleave<T>(variants: readonly T[], rounds: number): T[] {
  const out: T[] = [];
  for (let r = 0; r < rounds; r++) out.push(...(r % 2 === 0 ? variants : [...variants].reverse()));
  return out;
}

export interface ProcStat {
  pid: number;
  ppid: number;
  /** User plus system time in clock ticks. */
  ticks: number;
}

/** One /proc/<pid>/stat line; the command name sits in parentheses and may itself hold spaces or parentheses. */
export function parseProcStat(line: string): ProcStat | null {
  const close = line.lastIndexOf(')');
  if (close < 0) return null;
  const pid = Number(line.slice(0, line.indexOf(' ')));
  // After ") ": state(3) ppid(4) … utime(14) stime(15), numbered from 1 as in proc(5).
  const rest = line.slice(close + 2).split(' ');
  const ppid = Number(rest[1]);
  const utime = Number(rest[11]);
  const stime = Number(rest[12]);
  if (![pid, ppid, utime, stime].every(Number.isFinite)) return null;
  return { pid, ppid, ticks: utime + stime };
}

/** Clock ticks per second of /proc's times; 100 on every Linux kernel built with the usual USER_HZ. */
const TICKS_PER_S = 100;

/**
 * CPU milliseconds used so far by a process and all its descendants (Linux /proc), so a server started through tsx,
 * or with cluster workers under it, is counted whole. Another process's `process.cpuUsage()`, read from outside.
 */
export function treeCpuMs(rootPid: number): number {
  const stats: ProcStat[] = [];
  for (const name of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const s = parseProcStat(fs.readFileSync(`/proc/${name}/stat`, 'utf8'));
      if (s) stats.push(s);
    } catch {
      // The process ended while the list was read.
    }
  }
  return (sumTree(stats, rootPid) * 1000) / TICKS_PER_S;
}

/** Ticks of `rootPid` and every process below it. */
export function sumTree(stats: ProcStat[], rootPid: number): number {
  const children = new Map<number, ProcStat[]>();
  for (const s of stats) children.set(s.ppid, [...(children.get(s.ppid) ?? []), s]);
  const root = stats.find((s) => s.pid === rootPid);
  let total = 0;
  const stack = root ? [root] : [];
  while (stack.length > 0) {
    const s = stack.pop()!;
    total += s.ticks;
    stack.push(...(children.get(s.pid) ?? []));
  }
  return total;
}

export interface FigureRow {
  figure: string;
  value: number;
  unit: string;
  reference?: { name: string; value: number };
  /** A goal on the value, or on the ratio when `on` says so. */
  goal?: { op: '<=' | '>='; value: number; on: 'value' | 'ratio' };
}

function fmt(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (Math.abs(value) >= 1000) return Math.round(value).toLocaleString('en-US');
  if (Math.abs(value) >= 100) return value.toFixed(0);
  if (Math.abs(value) >= 10) return value.toFixed(1);
  return value.toFixed(2);
}

export function ratioOf(row: FigureRow): number | null {
  return row.reference && row.reference.value !== 0 ? row.value / row.reference.value : null;
}

export function meetsGoal(row: FigureRow): boolean | null {
  if (!row.goal) return null;
  const x = row.goal.on === 'ratio' ? ratioOf(row) : row.value;
  if (x === null || !Number.isFinite(x)) return false;
  return row.goal.op === '<=' ? x <= row.goal.value : x >= row.goal.value;
}

const cell = (s: string) => s.replace(/\|/g, '\\|');

/** The figures as one markdown table: figure, value, reference, ratio, goal. */
export function markdownTable(rows: FigureRow[]): string {
  const lines = ['| figure | value | reference | ratio | goal |', '|---|---:|---|---:|---|'];
  for (const r of rows) {
    const ratio = ratioOf(r);
    const met = meetsGoal(r);
    const goal = r.goal ? `${r.goal.on === 'ratio' ? 'ratio ' : ''}${r.goal.op} ${fmt(r.goal.value)} ${met ? '✓ met' : '✗ missed'}` : '';
    lines.push(
      `| ${cell(r.figure)} | ${fmt(r.value)} ${r.unit} | ${r.reference ? `${cell(r.reference.name)}: ${fmt(r.reference.value)}` : ''} | ${ratio === null ? '' : `${ratio.toFixed(2)}×`} | ${goal} |`,
    );
  }
  return lines.join('\n');
}
