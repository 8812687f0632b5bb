/**
 * A dealer's statement as CSV for a spreadsheet: one row per line of activity, with the running balance. Amounts are
 * plain decimal dollars ("1234.50", no currency sign or thousands separator) so spreadsheets read them as numbers;
 * the screen and the printout write money with separators.
 */
import type { AccountStatement } from './schemas/statement';

export const STATEMENT_CSV_HEADER = ['date', 'type', 'reference', 'order', 'detail', 'debit_usd', 'credit_usd', 'balance_usd'] as const;

const KIND_WORDS: Record<AccountStatement['lines'][number]['kind'], string> = {
  'brought-forward': 'Balance brought forward',
  invoice: 'Invoice',
  payment: 'Payment',
  'credit-note': 'Credit note',
};

/** Cents as a plain decimal: -123_456 → "-1234.56". */
export function csvAmount(cents: number): string {
  const sign = cents < 0 ? '-' : '';
  const abs = Math.abs(cents);
  return `${sign}${Math.floor(abs / 100)}.${String(abs % 100).padStart(2, '0')}`;
}

/** Quotes a field when it holds a comma, quote or line break (RFC 4180); a leading = + - @ is defused for spreadsheets. */
export function csvField(value: string): string {
  const safe = /^[=+\-@\t\r]/.test(value) && !/^-?\d+(\.\d+)?$/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

export function statementCsv(s: AccountStatement): string {
  const rows: string[][] = [[...STATEMENT_CSV_HEADER]];
  for (const l of s.lines) {
    rows.push([l.date, KIND_WORDS[l.kind], l.reference, l.orderNumber ?? '', l.detail, l.debitCents ? csvAmount(l.debitCents) : '', l.creditCents ? csvAmount(l.creditCents) : '', csvAmount(l.balanceCents)]);
  }
  rows.push([s.asOf, 'Closing balance', '', '', `Statement of ${s.dealer.companyName}`, '', '', csvAmount(s.totals.balanceCents)]);
  return `${rows.map((r) => r.map(csvField).join(',')).join('\r\n')}\r\n`;
}
