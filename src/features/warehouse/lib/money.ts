import { parseMoneyToCents } from '../../../../shared/format';

/** Dollars as typed to whole cents; the one parser lives in shared/format.ts. */
export const dollarsToCents = parseMoneyToCents;

/** Cents as a plain dollars figure for a form field: 1250 -> "12.50". */
export const centsToDollarsInput = (cents: number): string => `${Math.floor(cents / 100)}.${String(cents % 100).padStart(2, '0')}`;
