import { describe, expect, it } from 'vitest';
import {
  balanceLimitPerPlaneGmm,
  balancePasses,
  normalizeServiceReference,
  permissibleUnbalanceGmm,
  priceInspectionFee,
  priceQuote,
  shaftPlayFlags,
  shaftPlayLimits,
} from '../../shared/service';

describe('service request numbers', () => {
  it('reads a scanned or typed number in any of the usual spellings', () => {
    for (const typed of ['SR-7001', 'sr7001', 'SR 7001', ' sr-7001 ']) expect(normalizeServiceReference(typed)).toBe('SR-7001');
    for (const typed of ['RT-5001', 'SR-', 'SR-7000', 'SY-100001', '7001']) expect(normalizeServiceReference(typed)).toBeNull();
  });
});

describe('balance limit', () => {
  it('follows the balance-quality relation U = 1000·G·m/ω (ISO 21940-11, from memory)', () => {
    // Worked by hand: G 2.5 mm/s, 1 kg at 3000 rpm: ω = 314.159 rad/s, e = 7.958 µm, U = 7.958 g·mm.
    expect(permissibleUnbalanceGmm(1, 3000)).toBeCloseTo(7.958, 3);
    // Twice the speed halves the permissible unbalance; twice the mass doubles it.
    expect(permissibleUnbalanceGmm(1, 6000)).toBeCloseTo(3.979, 3);
    expect(permissibleUnbalanceGmm(2, 3000)).toBeCloseTo(15.915, 3);
  });
  it('shares it between two planes and passes a rotor only when both are within', () => {
    // An 8 kg unit: rotor 0.32 kg (our 4 % figure); at 180,000 rpm U = 1000·2.5·0.32/18849.6 = 0.04244 g·mm, 0.0212 per plane.
    const limit = balanceLimitPerPlaneGmm(8, 180_000);
    expect(limit).toBeCloseTo(0.021, 3);
    expect(balancePasses({ compressorGmm: limit, turbineGmm: 0 }, limit)).toBe(true);
    expect(balancePasses({ compressorGmm: 0, turbineGmm: limit + 0.001 }, limit)).toBe(false);
  });
});

describe('shaft play limits (our own figures)', () => {
  it('allows more radial play on a journal bearing than on a ball bearing, and flags readings over', () => {
    const journal = shaftPlayLimits(42, 'journal');
    const ball = shaftPlayLimits(42, 'ball');
    expect(journal.radial).toBeGreaterThan(ball.radial);
    expect(shaftPlayFlags({ axialPlayMm: journal.axial + 0.01, radialPlayMm: journal.radial }, journal)).toEqual({ axialOver: true, radialOver: false });
  });
});

describe('quote money', () => {
  it('discounts parts for a dealer, never labour, and taxes parts, labour and balancing', () => {
    const q = priceQuote({ lines: [{ partNumber: 'X', quantity: 2, retailUnitCents: 10_000 }], labourHours: 2, labourRateCents: 9_500, balancingCents: 4_800, tier: 'standard', taxRatePct: 8 });
    expect(q).toMatchObject({ partsRetailCents: 20_000, partsCents: 18_000, discountCents: 2_000, labourCents: 19_000 });
    expect(q.taxCents).toBe(Math.round((18_000 + 19_000 + 4_800) * 0.08));
    expect(q.totalCents).toBe(18_000 + 19_000 + 4_800 + q.taxCents);
    expect(priceInspectionFee(6_500, 8)).toEqual({ feeCents: 6_500, taxCents: 520, totalCents: 7_020 });
  });
});
