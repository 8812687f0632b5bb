/**
 * Which rows of a price list look wrong enough that a person must look at them before the list is applied. A flag
 * never stops a row by itself: staff acknowledge it (a real price rise of 40 % happens) and then it applies.
 */
import { formatMoney } from './format';

/** How far a price may move before its row is flagged, as a share of the old price, unless staff set another. */
export const DEFAULT_MAX_CHANGE_PCT = 30;
export const MIN_MAX_CHANGE_PCT = 1;
export const MAX_MAX_CHANGE_PCT = 500;
/** A price below this is taken for a slip (a missing digit, cents typed as dollars): nothing we sell costs under $1. */
export const NEAR_ZERO_CENTS = 100;

export const PRICE_FLAGS = ['large-change', 'near-zero', 'core-over-price'] as const;
export type PriceFlag = (typeof PRICE_FLAGS)[number];

export const PRICE_FLAG_LABELS: Record<PriceFlag, string> = {
  'large-change': 'Large change',
  'near-zero': 'Near zero',
  'core-over-price': 'Core deposit above price',
};

export interface FlagInput {
  /** Null for a part the file adds. */
  oldPriceCents: number | null;
  newPriceCents: number;
  /** The core deposit the part will carry after the import (the file's, or the one it keeps). */
  coreDepositCents: number;
  maxChangePct: number;
}

/** The change from old to new as a signed percentage of the old price, e.g. +9,900 for a price a hundred times higher. */
export function priceChangePct(oldCents: number, newCents: number): number {
  if (oldCents <= 0) return Number.POSITIVE_INFINITY;
  return ((newCents - oldCents) / oldCents) * 100;
}

/** The flags a row earns, in a fixed order. Integer arithmetic, so a change of exactly the limit is not flagged. */
export function priceFlags(input: FlagInput): PriceFlag[] {
  const flags: PriceFlag[] = [];
  const { oldPriceCents: old, newPriceCents: price } = input;
  if (old !== null && old > 0 && Math.abs(price - old) * 100 > input.maxChangePct * old) flags.push('large-change');
  if (price < NEAR_ZERO_CENTS) flags.push('near-zero');
  if (input.coreDepositCents > price) flags.push('core-over-price');
  return flags;
}

/** Staff's acknowledgement holds only for the flags they saw: a flag that appears later needs a look of its own. */
export function isAcknowledged(flags: readonly PriceFlag[], acknowledged: readonly PriceFlag[] | null | undefined): boolean {
  return flags.every((f) => acknowledged?.includes(f) ?? false);
}

const pct = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0, signDisplay: 'always' });

/** One sentence per flag, saying what was seen, with money written the shop's way. */
export function describeFlag(flag: PriceFlag, input: FlagInput): string {
  switch (flag) {
    case 'large-change':
      return `price ${pct.format(priceChangePct(input.oldPriceCents ?? 0, input.newPriceCents))} % (more than ±${input.maxChangePct} %)`;
    case 'near-zero':
      return `price ${formatMoney(input.newPriceCents)} is under ${formatMoney(NEAR_ZERO_CENTS)}`;
    case 'core-over-price':
      return `core deposit ${formatMoney(input.coreDepositCents)} is more than the price ${formatMoney(input.newPriceCents)}`;
  }
}
