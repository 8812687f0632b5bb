import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEALER_TIERS, FREIGHT_TABLE, POSTCODE_AREA_ZONES, dealerUnitPriceCents, freightCents, postcodeArea, priceOrder, zoneForPostcode } from '../../shared/pricing';

describe('dealer prices', () => {
  it('take the tier discount off the retail price, to the nearest cent', () => {
    // 15 % off $639.99 is $543.9915, which rounds to $543.99 (worked by hand).
    expect(dealerUnitPriceCents(63_999, 'preferred')).toBe(54_399);
    expect(dealerUnitPriceCents(63_999, 'standard')).toBe(57_599);
    expect(dealerUnitPriceCents(1_399, 'partner')).toBe(1_119);
  });
  it('are never above retail and never negative', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.constantFrom(...(Object.keys(DEALER_TIERS) as Array<keyof typeof DEALER_TIERS>)), (cents, tier) => {
        const p = dealerUnitPriceCents(cents, tier);
        return Number.isInteger(p) && p >= 0 && p <= cents;
      }),
    );
  });
});

describe('freight', () => {
  it('follows the weight bands of the demo table', () => {
    expect(freightCents(0, 'national')).toBe(0);
    expect(freightCents(1_000, 'local')).toBe(695);
    expect(freightCents(1_001, 'local')).toBe(1_195);
    expect(freightCents(4_500, 'remote')).toBe(3_295);
    // The largest frame, about 40 kg, falls in the 30–50 kg band.
    expect(freightCents(40_000, 'national')).toBe(6_995);
    // Above 50 kg each further 10 kg (or part of it) costs the step: 54 kg is one step.
    expect(freightCents(54_000, 'national')).toBe(6_995 + FREIGHT_TABLE.stepCents.national);
    expect(freightCents(70_001, 'remote')).toBe(13_495 + 3 * FREIGHT_TABLE.stepCents.remote);
  });
  it('never falls as a parcel gets heavier, in any zone', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 200_000 }), fc.integer({ min: 0, max: 50_000 }), fc.constantFrom('local', 'national', 'remote' as const), (w, extra, zone) => freightCents(w + extra, zone) >= freightCents(w, zone)),
    );
  });
});

describe('freight zone from the postcode', () => {
  it('reads the postcode area whatever the case and spacing, and defaults to national', () => {
    expect(postcodeArea(' em4 2qt')).toBe('EM');
    expect(postcodeArea('P1 8LD')).toBe('P');
    expect(postcodeArea('12345')).toBeNull();
    expect(zoneForPostcode('EM4 2QT')).toBe('local');
    expect(zoneForPostcode('pf1 8ld')).toBe('remote');
    expect(zoneForPostcode('WH9 3AB')).toBe('national');
    expect(zoneForPostcode('')).toBe('national');
  });
  it('gives every listed area its zone, and nothing else a zone other than national', () => {
    for (const [area, zone] of Object.entries(POSTCODE_AREA_ZONES)) expect(zoneForPostcode(`${area}1 1AA`)).toBe(zone);
    fc.assert(
      fc.property(fc.string({ maxLength: 12 }), (postcode) => {
        const area = postcodeArea(postcode);
        expect(zoneForPostcode(postcode)).toBe((area && POSTCODE_AREA_ZONES[area]) || 'national');
      }),
    );
  });
});

describe('order totals', () => {
  const lines = [
    { partNumber: 'CHS-10-0201-XCH', quantity: 1, retailUnitCents: 80_499, coreDepositCents: 25_000, weightGrams: 8_000 },
    { partNumber: 'CHS-50-0202', quantity: 2, retailUnitCents: 4_599, coreDepositCents: 0, weightGrams: 180 },
  ];
  it('add goods, core deposits, freight and tax on goods and freight (deposits are not taxed)', () => {
    const t = priceOrder(lines, { kind: 'retail' }, 'national', 8);
    expect(t.goodsCents).toBe(80_499 + 2 * 4_599);
    expect(t.coreDepositCents).toBe(25_000);
    expect(t.weightGrams).toBe(8_360);
    expect(t.freightCents).toBe(2_895);
    expect(t.taxCents).toBe(Math.round((t.goodsCents + t.freightCents) * 0.08));
    expect(t.totalCents).toBe(t.goodsCents + t.coreDepositCents + t.freightCents + t.taxCents);
    expect(t.discountCents).toBe(0);
  });
  it('price a dealer at the tier and show the discount against retail', () => {
    const retail = priceOrder(lines, { kind: 'retail' }, 'local', 8);
    const dealer = priceOrder(lines, { kind: 'dealer', tier: 'preferred' }, 'local', 8);
    expect(dealer.lines[0]!.unitCents).toBe(dealerUnitPriceCents(80_499, 'preferred'));
    expect(dealer.discountCents).toBe(retail.goodsCents - dealer.goodsCents);
    expect(dealer.coreDepositCents).toBe(retail.coreDepositCents);
    expect(dealer.totalCents).toBeLessThan(retail.totalCents);
  });
  it('stay in whole cents for any order', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ partNumber: fc.constant('X'), quantity: fc.integer({ min: 1, max: 50 }), retailUnitCents: fc.integer({ min: 1, max: 500_000 }), coreDepositCents: fc.integer({ min: 0, max: 50_000 }), weightGrams: fc.integer({ min: 1, max: 45_000 }) }), { minLength: 1, maxLength: 8 }),
        fc.float({ min: 0, max: 25, noNaN: true }),
        (ls, tax) => {
          const t = priceOrder(ls, { kind: 'dealer', tier: 'partner' }, 'remote', tax);
          return [t.goodsCents, t.taxCents, t.totalCents, t.freightCents].every(Number.isInteger);
        },
      ),
    );
  });
});
