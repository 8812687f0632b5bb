/**
 * One way to read and write money and dates everywhere (screens and e-mail): integer cents, US dollars with
 * thousands separators, and medium dates in one locale. Calendar dates are written in UTC so an order's date reads
 * the same on every machine.
 */
const LOCALE = 'en-US';
const USD = new Intl.NumberFormat(LOCALE, { style: 'currency', currency: 'USD' });
const DATE = new Intl.DateTimeFormat(LOCALE, { dateStyle: 'medium', timeZone: 'UTC' });
const DATE_TIME = new Intl.DateTimeFormat(LOCALE, { dateStyle: 'medium', timeStyle: 'short' });

/** Integer cents as dollars, e.g. 2_500_000 → "$25,000.00". */
export function formatMoney(cents: number): string {
  return USD.format(cents / 100);
}

/**
 * Dollars as people type them ("7500", "7,500.00", "$12.5") to whole cents, read from the digits so no
 * floating-point rounding creeps in; null for anything that is not a plain amount with at most two decimals.
 */
export function parseMoneyToCents(input: string): number | null {
  const m = /^\s*\$?\s*(\d{1,3}(?:,\d{3})+|\d{1,9})(?:\.(\d{1,2}))?\s*$/.exec(input);
  if (!m) return null;
  return Number(m[1]!.replace(/,/g, '')) * 100 + Number((m[2] ?? '').padEnd(2, '0'));
}

/** Integer cents as a figure to put in an input box, without the currency sign: 123_450 → "1,234.50". */
export function formatMoneyInput(cents: number): string {
  return formatMoney(cents).replace('$', '');
}

const toDate = (value: string | Date) => (value instanceof Date ? value : new Date(value));

/** "Dec 2, 2026"; an unreadable value is shown as it came. */
export function formatDate(value: string | Date): string {
  const d = toDate(value);
  return Number.isNaN(d.getTime()) ? String(value) : DATE.format(d);
}

/** "Dec 2, 2026, 9:40 AM" in the reader's own time zone. */
export function formatDateTime(value: string | Date): string {
  const d = toDate(value);
  return Number.isNaN(d.getTime()) ? String(value) : DATE_TIME.format(d);
}
