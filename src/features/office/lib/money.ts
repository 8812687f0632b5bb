import { formatMoneyInput, parseMoneyToCents } from '../../../../shared/format';

/**
 * What the price box holds as the form's value: whole cents read by the one money parser in shared/format.ts.
 * A figure with more than two decimals ("12.345") keeps a fraction of a cent, so the shared schema's own
 * "whole cents" rule names the mistake; anything else that is not an amount is NaN ("enter the price…").
 */
export function moneyFieldCents(text: string): number {
  const cents = parseMoneyToCents(text);
  if (cents !== null) return cents;
  const extraDecimals = /^(.*\.\d{2})\d+\s*$/.exec(text);
  const truncated = extraDecimals ? parseMoneyToCents(extraDecimals[1]!) : null;
  return truncated === null ? Number.NaN : truncated + 0.5;
}

/** The price box's text for a stored price: "1,234.50"; empty while there is none. */
export const moneyFieldText = (cents: number | null | undefined): string =>
  cents === null || cents === undefined || !Number.isFinite(cents) ? '' : formatMoneyInput(cents);

export function formatBytes(bytes: number): string {
  if (bytes >= 1_000_000) return `${(bytes / 1_000_000).toFixed(1)} MB`;
  if (bytes >= 1000) return `${Math.round(bytes / 1000)} kB`;
  return `${bytes} bytes`;
}
