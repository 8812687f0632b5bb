import { describe, expect, it } from 'vitest';
import { ageInvoices, ageingBucket, daysPastDue, overdueCents } from '../../shared/ageing';

// Ageing by days past the due date into current, 1–30, 31–60, 61–90 and over 90: common practice in accounts
// receivable. The day counts below are calendar arithmetic, checked by hand.
describe('days past due', () => {
  it('counts whole calendar days from the due date, negative before it', () => {
    expect(daysPastDue('2026-12-03', '2026-12-03')).toBe(0);
    expect(daysPastDue('2026-12-04', '2026-12-03')).toBe(-1);
    expect(daysPastDue('2026-11-30', '2026-12-03')).toBe(3);
    // Across a year end and a leap day.
    expect(daysPastDue('2026-12-31', '2027-01-01')).toBe(1);
    expect(daysPastDue('2028-02-28', '2028-03-01')).toBe(2);
    // A timestamp is read by its date.
    expect(daysPastDue('2026-11-30T23:59:59.000Z', '2026-12-01T00:00:01.000Z')).toBe(1);
  });
});

describe('ageing buckets', () => {
  const asOf = '2026-12-31';
  const due = (days: number) => new Date(Date.UTC(2026, 11, 31) - days * 86_400_000).toISOString().slice(0, 10);
  it.each([
    [-10, 'current'],
    [0, 'current'],
    [1, 'days1to30'],
    [30, 'days1to30'],
    [31, 'days31to60'],
    [60, 'days31to60'],
    [61, 'days61to90'],
    [90, 'days61to90'],
    [91, 'over90'],
    [400, 'over90'],
  ] as const)('%i days past due is %s', (days, bucket) => {
    expect(daysPastDue(due(days), asOf)).toBe(days);
    expect(ageingBucket(due(days), asOf)).toBe(bucket);
  });

  it('adds the open amounts by bucket, and the buckets add up to the open total', () => {
    const invoices = [
      { dueDate: '2027-01-14', openCents: 250_000 },
      { dueDate: '2026-12-20', openCents: 12_345 },
      { dueDate: '2026-12-01', openCents: 1_000 },
      { dueDate: '2026-11-15', openCents: 99 },
      { dueDate: '2026-10-15', openCents: 5_000 },
      { dueDate: '2026-09-01', openCents: 7 },
    ];
    const totals = ageInvoices(invoices, asOf);
    expect(totals).toEqual({ current: 250_000, days1to30: 13_345, days31to60: 99, days61to90: 5_000, over90: 7 });
    expect(Object.values(totals).reduce((a, b) => a + b, 0)).toBe(invoices.reduce((a, i) => a + i.openCents, 0));
    expect(overdueCents(totals)).toBe(13_345 + 99 + 5_000 + 7);
  });

  it('refuses something that is not a date', () => {
    expect(() => daysPastDue('soon', asOf)).toThrow(RangeError);
  });
});
