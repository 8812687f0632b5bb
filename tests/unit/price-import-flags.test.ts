import { describe, expect, it } from 'vitest';
import { DEFAULT_MAX_CHANGE_PCT, describeFlag, isAcknowledged, priceFlags } from '../../shared/price-import-flags';

const flags = (oldPriceCents: number | null, newPriceCents: number, coreDepositCents = 0, maxChangePct = DEFAULT_MAX_CHANGE_PCT) =>
  priceFlags({ oldPriceCents, newPriceCents, coreDepositCents, maxChangePct });

describe('price-import flags', () => {
  it('flags a move of more than the set share either way, not one of exactly the share', () => {
    expect(flags(10_000, 13_000)).toEqual([]);
    expect(flags(10_000, 13_001)).toEqual(['large-change']);
    expect(flags(10_000, 7_000)).toEqual([]);
    expect(flags(10_000, 6_999)).toEqual(['large-change']);
    // A price a hundred times too high (a decimal point lost).
    expect(flags(24_999, 2_499_900)).toEqual(['large-change']);
    // The share is adjustable.
    expect(flags(10_000, 13_001, 0, 50)).toEqual([]);
    expect(flags(10_000, 10_600, 0, 5)).toEqual(['large-change']);
  });

  it('flags a price that falls to near zero, for a new part too', () => {
    expect(flags(1_399, 1)).toEqual(['large-change', 'near-zero']);
    expect(flags(null, 99)).toEqual(['near-zero']);
    expect(flags(null, 100)).toEqual([]);
  });

  it('flags a core deposit above the price', () => {
    expect(flags(180_000, 180_000, 200_000)).toEqual(['core-over-price']);
    expect(flags(180_000, 180_000, 180_000)).toEqual([]);
  });

  it('holds an acknowledgement only for the flags that were seen', () => {
    expect(isAcknowledged([], null)).toBe(true);
    expect(isAcknowledged(['large-change'], null)).toBe(false);
    expect(isAcknowledged(['large-change'], ['large-change'])).toBe(true);
    expect(isAcknowledged(['large-change', 'near-zero'], ['large-change'])).toBe(false);
  });

  it('says what it saw with money written with separators', () => {
    const input = { oldPriceCents: 24_999, newPriceCents: 2_499_900, coreDepositCents: 3_000_000, maxChangePct: 30 };
    expect(describeFlag('large-change', input)).toBe('price +9,900 % (more than ±30 %)');
    expect(describeFlag('core-over-price', input)).toBe('core deposit $30,000.00 is more than the price $24,999.00');
    expect(describeFlag('near-zero', { ...input, newPriceCents: 1 })).toBe('price $0.01 is under $1.00');
  });
});
