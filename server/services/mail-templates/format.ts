import { formatDate, formatMoney } from '../../../shared/format';
import type { MailAddress } from './types';

/** Integer cents as US dollars, e.g. 123450 -> "$1,234.50". Fractions of a cent mean a bug upstream. */
export function money(cents: number): string {
  if (!Number.isSafeInteger(cents)) throw new RangeError(`Money must be whole cents, got ${cents}`);
  return formatMoney(cents);
}

/** A discount shown as taken off: "-$12.00", never "--" or "-$0.00". */
export function minusMoney(cents: number): string {
  return cents === 0 ? money(0) : `-${money(Math.abs(cents))}`;
}

// Built once: a formatter costs far more to make than to use.
const PERCENT = new Intl.NumberFormat('en-US', { maximumFractionDigits: 2 });

export function percent(value: number): string {
  return `${PERCENT.format(value)}%`;
}

/** Calendar dates as on every screen (shared/format.ts: UTC, so the same order date reads the same everywhere). */
export function calendarDate(date: Date): string {
  return formatDate(date);
}

export function duration(minutes: number): string {
  if (!Number.isFinite(minutes) || minutes <= 0) throw new RangeError(`Duration must be positive, got ${minutes}`);
  if (minutes % 1440 === 0) return plural(minutes / 1440, 'day');
  if (minutes % 60 === 0) return plural(minutes / 60, 'hour');
  return plural(Math.round(minutes), 'minute');
}

export function plural(count: number, word: string): string {
  return `${count} ${word}${count === 1 ? '' : 's'}`;
}

/** Subjects are one header line; a stray newline in a name must not break them. */
export function oneLine(value: string): string {
  return value.replace(/\s+/g, ' ').trim();
}

/** Links go only to web pages; anything else in an href would be an injection or a bug. */
export function webUrl(url: string): string {
  const parsed = new URL(url);
  if (parsed.protocol !== 'https:' && parsed.protocol !== 'http:') {
    throw new TypeError(`Mail links must be http(s), got ${parsed.protocol}`);
  }
  return parsed.href;
}

export function addressLines(address: MailAddress): string[] {
  const cityLine = [address.city, address.region].filter(Boolean).join(', ');
  return [
    address.name,
    address.company,
    ...address.lines,
    `${cityLine} ${address.postalCode}`.trim(),
    address.country,
  ].filter((line): line is string => typeof line === 'string' && line.trim() !== '');
}
