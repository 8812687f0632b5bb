import { describe, expect, it } from 'vitest';
import { interleave, markdownTable, median, meetsGoal, parseProcStat, sumTree } from '../../scripts/bench-figures';
import { ftsPrefixQuery } from '../../scripts/bench-search';

describe('benchmark figures', () => {
  it('takes the median of odd and even counts', () => {
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([])).toBeNaN();
  });

  it('alternates the order of the variants round by round', () => {
    expect(interleave([1, 2], 3)).toEqual([1, 2, 2, 1, 1, 2]);
  });

  it('reads CPU ticks and the parent from a /proc stat line whose name holds spaces and parentheses', () => {
    // Layout of /proc/<pid>/stat from proc(5): pid (comm) state ppid … utime(14) stime(15).
    const line = '4242 (node (worker) 1) S 4200 4242 4200 0 -1 4194560 100 0 0 0 250 50 0 0 20 0 11 0 1000 0 0';
    expect(parseProcStat(line)).toEqual({ pid: 4242, ppid: 4200, ticks: 300 });
    expect(parseProcStat('garbage')).toBeNull();
  });

  it('sums a process and everything below it, and nothing beside it', () => {
    const stats = [
      { pid: 1, ppid: 0, ticks: 1 },
      { pid: 10, ppid: 1, ticks: 5 },
      { pid: 11, ppid: 10, ticks: 7 },
      { pid: 12, ppid: 10, ticks: 3 },
      { pid: 20, ppid: 1, ticks: 100 },
    ];
    expect(sumTree(stats, 10)).toBe(15);
    expect(sumTree(stats, 99)).toBe(0);
  });

  it('writes one markdown row per figure with its reference, ratio and goal', () => {
    const rows = [
      { figure: 'list | cached', value: 900, unit: 'req/s', reference: { name: 'bare', value: 1200 }, goal: { op: '>=' as const, value: 0.5, on: 'ratio' as const } },
      { figure: 'oversold', value: 1, unit: 'units', goal: { op: '<=' as const, value: 0, on: 'value' as const } },
    ];
    expect(meetsGoal(rows[0]!)).toBe(true);
    expect(meetsGoal(rows[1]!)).toBe(false);
    const table = markdownTable(rows).split('\n');
    expect(table[0]).toBe('| figure | value | reference | ratio | goal |');
    expect(table[2]).toBe('| list \\| cached | 900 req/s | bare: 1,200 | 0.75× | ratio >= 0.50 ✓ met |');
    expect(table[3]).toContain('✗ missed');
  });

  it('makes the reference FTS5 query a prefix term of the first word or number', () => {
    expect(ftsPrefixQuery('Gimlet cartridge')).toBe('"gimlet"*');
    expect(ftsPrefixQuery('awl-10-0201')).toBe('"awl"*');
    expect(ftsPrefixQuery('-')).toBe('"aa"*');
  });
});
