import { describe, expect, it } from 'vitest';
import { FRAMES, flangeInletMm, isVBand } from '../../catalog-seed/frames';
import { generateCatalogue, type PartSeed } from '../../catalog-seed/generate';
import { CATEGORY_SLUGS, trimPct } from '../../shared/catalog';
import { parsePartNumber } from '../../shared/part-number';

const catalogue = generateCatalogue();
const active = catalogue.parts.filter((p) => p.status !== 'superseded');
const onSale = catalogue.parts.filter((p) => p.status === 'active');
const byNumber = new Map(catalogue.parts.map((p) => [p.partNumber, p]));
const linked = (p: PartSeed) => p.goesWith.map((n) => byNumber.get(n)!);

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

  it('grow in flow and weight from the smallest to the largest, at a single-stage pressure ratio of about 4 to 5 (common practice)', () => {
    for (let i = 1; i < FRAMES.length; i++) {
      expect(FRAMES[i]!.maxFlowLbMin).toBeGreaterThan(FRAMES[i - 1]!.maxFlowLbMin);
      expect(FRAMES[i]!.weightKg).toBeGreaterThan(FRAMES[i - 1]!.weightKg);
    }
    for (const f of FRAMES) {
      expect(f.maxPressureRatio, f.code).toBeGreaterThan(3.6);
      expect(f.maxPressureRatio, f.code).toBeLessThan(5.3);
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
  it('has at least 400 parts across the seven categories', () => {
    expect(active.length).toBeGreaterThanOrEqual(400);
    for (const slug of CATEGORY_SLUGS) expect(active.filter((p) => p.category === slug).length, slug).toBeGreaterThanOrEqual(20);
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

  it('has the four kinds of sensor, each as a dash gauge and as a plug-in logger, with their fittings', () => {
    const gauges = onSale.filter((p) => p.category === 'gauges-sensors');
    expect(new Set(gauges.map((g) => g.specs.gaugeType))).toEqual(new Set(['boost', 'egt', 'oil-pressure', 'shaft-speed']));
    for (const type of ['boost', 'egt', 'oil-pressure', 'shaft-speed']) {
      const kind = gauges.filter((g) => g.specs.gaugeType === type);
      expect(kind.some((g) => /dash (gauge|pod)/.test(g.specs.mounting ?? '')), type).toBe(true);
      expect(kind.some((g) => /plug-in logger/.test(g.specs.mounting ?? '')), type).toBe(true);
    }
    for (const fitting of ['weld bung', 'T-adaptor', 'sensor boss']) expect(gauges.some((g) => g.title.includes(fitting)), fitting).toBe(true);
  });

  it('has superseded numbers that point at a live part, cross-references, and parts out of stock', () => {
    const numbers = new Set(catalogue.parts.map((p) => p.partNumber));
    const superseded = catalogue.parts.filter((p) => p.status === 'superseded');
    expect(superseded.length).toBeGreaterThan(10);
    for (const s of superseded) {
      expect(numbers.has(s.supersededBy!)).toBe(true);
      // An earlier number reads as an older revision: a lower serial than the number that replaced it.
      expect(parsePartNumber(s.partNumber)!.serial, s.partNumber).toBeLessThan(parsePartNumber(s.supersededBy!)!.serial);
    }
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

describe('demo catalogue hangs together', () => {
  it('links both ways, between parts on sale only', () => {
    let links = 0;
    for (const p of catalogue.parts) {
      for (const n of p.goesWith) {
        const other = byNumber.get(n);
        expect(other, `${p.partNumber} → ${n}`).toBeDefined();
        expect(other!.goesWith, `${n} → ${p.partNumber}`).toContain(p.partNumber);
        expect(p.status, p.partNumber).toBe('active');
        expect(other!.status, n).toBe('active');
        links++;
      }
    }
    expect(links).toBeGreaterThan(1000);
  });

  it('sends discontinued parts to a replacement on sale with a higher serial', () => {
    const discontinued = catalogue.parts.filter((p) => p.status === 'discontinued');
    expect(discontinued.length).toBeGreaterThan(2);
    for (const d of discontinued) {
      const r = byNumber.get(d.supersededBy ?? '');
      expect(r?.status, d.partNumber).toBe('active');
      expect(parsePartNumber(r!.partNumber)!.serial).toBeGreaterThan(parsePartNumber(d.partNumber)!.serial);
    }
  });

  const units = onSale.filter((p) => p.category === 'turbochargers' || p.category === 'cartridges');
  it("links every water-cooled unit to its frame's water line kit", () => {
    const water = units.filter((p) => p.specs.cooling === 'oil and water');
    expect(water.length).toBeGreaterThan(80);
    for (const u of water) expect(linked(u).some((x) => x.title.includes('water line kit') && x.frameCode === u.frameCode), u.partNumber).toBe(true);
  });

  it("links every ball-bearing unit to its frame's oil feed restrictor (their text says they need one)", () => {
    const ball = units.filter((p) => p.specs.bearing === 'ball');
    expect(ball.length).toBeGreaterThan(70);
    for (const u of ball) expect(linked(u).some((x) => x.title.includes('oil feed restrictor') && x.frameCode === u.frameCode), u.partNumber).toBe(true);
  });

  it('links every housing to the cartridges it fits, compressor housings by their inducer bore', () => {
    for (const h of onSale.filter((p) => p.category === 'compressor-housings' || p.category === 'turbine-housings')) {
      const carts = linked(h).filter((x) => x.category === 'cartridges');
      expect(carts.length, h.partNumber).toBeGreaterThan(0);
      for (const c of carts) {
        expect(c.frameCode, h.partNumber).toBe(h.frameCode);
        if (h.category === 'compressor-housings') expect(c.specs.inducerMm, `${h.partNumber} ↔ ${c.partNumber}`).toBe(h.specs.inducerMm);
      }
    }
  });

  it('states the turbine inlet the flange names, and seals V-band joints with no flat gasket', () => {
    for (const h of onSale.filter((p) => p.category === 'turbine-housings')) {
      expect(h.specs.inletMm, h.partNumber).toBe(flangeInletMm(h.specs.flangePattern!));
      expect(h.title).toContain(h.specs.flangePattern!);
    }
    for (const g of onSale.filter((p) => p.category === 'gaskets-fittings' && p.specs.flangePattern && isVBand(p.specs.flangePattern))) {
      expect(g.title, g.partNumber).not.toMatch(/\bgasket\b(?! and seal kit)/);
    }
  });

  it('sells each part under one number: no two parts on sale alike', () => {
    const seen = new Map<string, string>();
    for (const p of onSale) {
      const key = [p.category, p.condition, p.frameCode, p.title, JSON.stringify(p.specs)].join('|');
      expect(seen.get(key), `${p.partNumber} duplicates ${seen.get(key)}`).toBeUndefined();
      seen.set(key, p.partNumber);
    }
    // Parts made for a flange pattern exist once per pattern, whichever frames share it.
    const inletSeals = onSale.filter((p) => p.category === 'gaskets-fittings' && p.title.includes('turbine inlet'));
    expect(inletSeals.length).toBe(new Set(FRAMES.map((f) => f.flangePattern)).size);
  });

  it('writes whole sentences: no doubled spaces, no empty words', () => {
    for (const p of catalogue.parts) {
      for (const text of [p.title, p.description]) {
        expect(text, p.partNumber).not.toMatch(/ {2}| [,.;]|\(\s*\)|undefined|null|NaN/);
      }
    }
  });
});

describe('rebuild kits', () => {
  const kits = onSale.filter((p) => p.category === 'rebuild-kits');

  it('has one kit for each cartridge family (frame and bearing), numbered in the kits group', () => {
    const families = new Set(onSale.filter((p) => p.category === 'cartridges').map((p) => `${p.frameCode} ${p.specs.bearing}`));
    expect(new Set(kits.map((k) => `${k.frameCode} ${k.specs.bearing}`))).toEqual(families);
    expect(kits.length).toBe(families.size);
    for (const k of kits) expect(parsePartNumber(k.partNumber)?.group, k.partNumber).toBe(7);
  });

  it('lists what is in it: journal kits the bearings, thrust parts, rings and O-rings; ball kits only seals and O-rings', () => {
    for (const k of kits) {
      if (k.specs.bearing === 'journal') {
        expect(k.description, k.partNumber).toMatch(/journal bearings.*thrust bearing and thrust collar.*piston rings.*O-rings/);
      } else {
        expect(k.description, k.partNumber).toMatch(/seals.*O-rings/);
        // The ball bearing cartridge is a separate part; replacing it whole is common practice.
        expect(k.description, k.partNumber).toMatch(/separate part.*common practice/);
        expect(k.specs.material).not.toMatch(/bearing/);
      }
    }
  });

  it('goes with every cartridge and complete unit of its family, both ways', () => {
    for (const k of kits) {
      const family = onSale.filter((p) => (p.category === 'cartridges' || p.category === 'turbochargers') && p.frameCode === k.frameCode && p.specs.bearing === k.specs.bearing);
      expect(family.length).toBeGreaterThan(0);
      expect(new Set(k.goesWith)).toEqual(new Set(family.map((p) => p.partNumber)));
      for (const p of family) expect(p.goesWith, p.partNumber).toContain(k.partNumber);
    }
  });
});

