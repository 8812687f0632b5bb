import { describe, expect, it } from 'vitest';
import { formatDate, formatMoney, parseMoneyToCents } from '../../shared/format';

describe('money and dates, one way everywhere', () => {
  it('writes cents as dollars with thousands separators (Intl en-US currency format)', () => {
    expect(formatMoney(21_859_017)).toBe('$218,590.17');
    expect(formatMoney(500_000)).toBe('$5,000.00');
    expect(formatMoney(99)).toBe('$0.99');
  });

  it('reads dollars as typed to whole cents without floating-point rounding', () => {
    expect(parseMoneyToCents('7500')).toBe(750_000);
    expect(parseMoneyToCents('7,500.00')).toBe(750_000);
    expect(parseMoneyToCents(' $12.5 ')).toBe(1250);
    // 0.1 + 0.2 style rounding would give 1000.9999…: read from the digits it is exact.
    expect(parseMoneyToCents('10.01')).toBe(1001);
    for (const bad of ['', 'abc', '12.345', '-5', '1,23', '1.2.3']) expect(parseMoneyToCents(bad), bad).toBeNull();
  });

  it('writes calendar dates the same on every machine (UTC, en-US medium)', () => {
    expect(formatDate('2026-12-02T23:30:00Z')).toBe('Dec 2, 2026');
    expect(formatDate('not a date')).toBe('not a date');
  });
});
