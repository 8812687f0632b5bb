import { describe, expect, it } from 'vitest';
import { FRAMES, maxShaftRpmFor } from '../../catalog-seed/frames';
import { generateCatalogue } from '../../catalog-seed/generate';
import { CATEGORY_SLUGS, trimPct } from '../../shared/catalog';

const catalogue = generateCatalogue();
const active = catalogue.parts.filter((p) => p.status !== 'superseded');

describe('demo frames', () => {
  it('span a small frame for about 100 hp to a large one for about 2000 hp that weighs about 40 kg (common practice)', () => {
    expect(FRAMES.length).toBeGreaterThanOrEqual(8);
    expect(FRAMES.length).toBeLessThanOrEqual(12);
    const small = FRAMES[0]!;
    const large = FRAMES.at(-1)!;
    expect(small.powerBandHp[0]).toBeLessThanOrEqual(100);
    expect(small.powerBandHp[1]).toBeGreaterThanOrEqual(100);
    expect(large.powerBandHp[1]).toBeGreaterThanOrEqual(2000);
    expect(large.weightKg).toBeGreaterThanOrEqual(36);
    expect(large.weightKg).toBeLessThanOrEqual(44);
  });

  it('rate flow at about 10 hp per lb/min on petrol at the top of the band (common practice, ±15%)', () => {
    for (const f of FRAMES) {
      const hpPerLbMin = f.powerBandHp[1] / f.maxFlowLbMin;
      expect(hpPerLbMin, f.code).toBeGreaterThan(8.5);
      expect(hpPerLbMin, f.code).toBeLessThan(11.5);
    }
  });

  it('keep compressor tip speed at the rated shaft speed near 540 m/s, a common-practice limit for cast aluminium wheels', () => {
    for (const f of FRAMES) {
      const tip = (Math.PI * (f.exducerMm / 1000) * maxShaftRpmFor(f.exducerMm)) / 60;
      expect(tip, f.code).toBeGreaterThan(520);
      expect(tip, f.code).toBeLessThan(560);
    }
  });

  it('grow in flow, pressure ratio and weight from the smallest to the largest', () => {
    for (let i = 1; i < FRAMES.length; i++) {
      expect(FRAMES[i]!.maxFlowLbMin).toBeGreaterThan(FRAMES[i - 1]!.maxFlowLbMin);
      expect(FRAMES[i]!.maxPressureRatio).toBeGreaterThanOrEqual(FRAMES[i - 1]!.maxPressureRatio);
      expect(FRAMES[i]!.weightKg).toBeGreaterThan(FRAMES[i - 1]!.weightKg);
    }
  });
});

describe('trim', () => {
  it('follows the definition trim = 100·(inducer/exducer)² (common practice across compressor-wheel literature)', () => {
    // A 45 mm inducer on a 60 mm exducer is 56.25 trim: 100 · 0.75² (worked by hand).
    expect(trimPct(45, 60)).toBe(56.3);
    expect(trimPct(30, 41)).toBeCloseTo(53.5, 1);
  });
  it('is consistent on every part that states wheel diameters', () => {
    const withWheels = active.filter((p) => p.specs.inducerMm && p.specs.exducerMm);
    expect(withWheels.length).toBeGreaterThan(100);
    for (const p of withWheels) {
      const expected = 100 * (p.specs.inducerMm! / p.specs.exducerMm!) ** 2;
      expect(Math.abs(p.specs.trimPct! - expected), p.partNumber).toBeLessThan(0.06);
      expect(p.specs.inducerMm!).toBeLessThan(p.specs.exducerMm!);
    }
  });
});

describe('demo catalogue', () => {
  it('has at least 400 parts across the six categories', () => {
    expect(active.length).toBeGreaterThanOrEqual(400);
    for (const slug of CATEGORY_SLUGS) expect(active.filter((p) => p.category === slug).length, slug).toBeGreaterThan(10);
  });

  it('makes compressor housings of aluminium and turbine housings of cast iron or steel', () => {
    for (const p of active.filter((x) => x.category === 'compressor-housings')) expect(p.specs.material).toMatch(/aluminium/);
    for (const p of active.filter((x) => x.category === 'turbine-housings')) expect(p.specs.material).toMatch(/^cast (iron|stainless steel)$/);
  });

  it('sells ball and journal bearing versions of every frame, new and on exchange with a core deposit', () => {
    for (const f of FRAMES) {
      const turbos = active.filter((p) => p.frameCode === f.code && p.category === 'turbochargers');
      expect(new Set(turbos.map((p) => p.specs.bearing))).toEqual(new Set(['ball', 'journal']));
      const exchange = turbos.filter((p) => p.condition === 'exchange');
      expect(exchange.length).toBeGreaterThan(0);
      for (const x of exchange) expect(x.coreDepositCents).toBeGreaterThan(0);
    }
  });

  it('has the four kinds of gauge and sensor, with shaft-speed sensors as dash gauge and logger', () => {
    const gauges = active.filter((p) => p.category === 'gauges-sensors');
    expect(new Set(gauges.map((g) => g.specs.gaugeType))).toEqual(new Set(['boost', 'egt', 'oil-pressure', 'shaft-speed']));
    const speed = gauges.filter((g) => g.specs.gaugeType === 'shaft-speed');
    expect(speed.some((g) => /dash gauge/.test(g.specs.mounting ?? ''))).toBe(true);
    expect(speed.some((g) => /logger/.test(g.specs.mounting ?? ''))).toBe(true);
  });

  it('has superseded numbers that point at a live part, cross-references, and parts out of stock', () => {
    const numbers = new Set(catalogue.parts.map((p) => p.partNumber));
    const superseded = catalogue.parts.filter((p) => p.status === 'superseded');
    expect(superseded.length).toBeGreaterThan(10);
    for (const s of superseded) expect(numbers.has(s.supersededBy!)).toBe(true);
    expect(active.filter((p) => p.aliases.some((a) => a.kind === 'cross-reference')).length).toBeGreaterThan(10);
    expect(active.filter((p) => p.stock.length === 0).length).toBeGreaterThan(5);
    expect(new Set(catalogue.parts.map((p) => p.partNumber)).size).toBe(catalogue.parts.length);
  });

  it('is deterministic and can be made large for benchmarks', () => {
    const again = generateCatalogue();
    expect(again.parts.map((p) => p.partNumber)).toEqual(catalogue.parts.map((p) => p.partNumber));
    const big = generateCatalogue({ parts: 5000 });
    expect(big.parts.length).toBe(5000);
    expect(new Set(big.parts.map((p) => p.partNumber)).size).toBe(5000);
  });
});
