/**
 * Ageing of a dealer's open invoices, as an accounts-receivable statement shows it.
 *
 * Convention (common practice in accounts receivable): an invoice is aged by the whole calendar days that have passed
 * since its due date, counted in UTC dates. An invoice not yet due, or due today, is "current"; one day after the due
 * date it is 1 day past due. The buckets are current, 1–30, 31–60, 61–90 and over 90 days past due. (Some ledgers age
 * by invoice date instead; we age by due date so that a dealer on longer terms is not shown as late.)
 */

export const AGEING_BUCKETS = [
  { key: 'current', label: 'Current', min: Number.NEGATIVE_INFINITY, max: 0 },
  { key: 'days1to30', label: '1–30 days', min: 1, max: 30 },
  { key: 'days31to60', label: '31–60 days', min: 31, max: 60 },
  { key: 'days61to90', label: '61–90 days', min: 61, max: 90 },
  { key: 'over90', label: 'Over 90 days', min: 91, max: Number.POSITIVE_INFINITY },
] as const;
export type AgeingBucketKey = (typeof AGEING_BUCKETS)[number]['key'];
export type AgeingTotals = Record<AgeingBucketKey, number>;

const DAY_MS = 86_400_000;

/** A YYYY-MM-DD date (or the date part of a timestamp) as the UTC midnight it names. */
function utcDay(value: string): number {
  const m = /^(\d{4})-(\d{2})-(\d{2})/.exec(value);
  if (!m) throw new RangeError(`Not a date: ${value}`);
  return Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]));
}

/** The calendar date (UTC) of a moment, as YYYY-MM-DD. */
export function utcDate(moment: Date): string {
  return moment.toISOString().slice(0, 10);
}

/** Whole days from the due date to the statement date: negative before the due date, 0 on it. */
export function daysPastDue(dueDate: string, asOf: string): number {
  return Math.round((utcDay(asOf) - utcDay(dueDate)) / DAY_MS);
}

/** The bucket an invoice falls in on the statement date. */
export function ageingBucket(dueDate: string, asOf: string): AgeingBucketKey {
  const days = daysPastDue(dueDate, asOf);
  return AGEING_BUCKETS.find((b) => days >= b.min && days <= b.max)!.key;
}

export const emptyAgeing = (): AgeingTotals => ({ current: 0, days1to30: 0, days31to60: 0, days61to90: 0, over90: 0 });

/** What is still open on each invoice, added up by bucket; the buckets together equal the open total. */
export function ageInvoices(invoices: ReadonlyArray<{ dueDate: string; openCents: number }>, asOf: string): AgeingTotals {
  const totals = emptyAgeing();
  for (const i of invoices) totals[ageingBucket(i.dueDate, asOf)] += i.openCents;
  return totals;
}

/** What falls due past the current bucket: the overdue amount a statement calls out. */
export function overdueCents(totals: AgeingTotals): number {
  return totals.days1to30 + totals.days31to60 + totals.days61to90 + totals.over90;
}
