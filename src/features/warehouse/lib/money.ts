/**
 * "12.5" or "12.50" dollars to 1250 cents, read from the digits so no float rounding creeps in.
 * Returns null for anything that is not a plain positive amount with at most two decimals.
 */
export function dollarsToCents(input: string): number | null {
  const m = /^\s*\$?\s*(\d{1,7})(?:\.(\d{1,2}))?\s*$/.exec(input);
  if (!m) return null;
  const whole = Number(m[1]);
  const fraction = Number((m[2] ?? '').padEnd(2, '0'));
  return whole * 100 + fraction;
}

/** Cents as a plain dollars figure for a form field: 1250 -> "12.50". */
export const centsToDollarsInput = (cents: number): string => `${Math.floor(cents / 100)}.${String(cents % 100).padStart(2, '0')}`;
