import { formatMoneyInput, parseMoneyToCents } from '../../../../shared/format';

/** Dollars as typed to whole cents; the one parser lives in shared/format.ts. */
export const dollarsToCents = parseMoneyToCents;

/** Cents as a dollars figure for a form field, with separators: 123_450 -> "1,234.50". */
export const centsToDollarsInput = formatMoneyInput;
