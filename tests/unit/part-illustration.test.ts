import { describe, expect, it } from 'vitest';
import { generateCatalogue } from '../../catalog-seed/generate';
import { CATEGORY_SLUGS } from '../../shared/catalog';
import { ILLUSTRATION_KINDS, KINDS_BY_CATEGORY, illustrationKind, type IllustrationKind } from '../../shared/part-illustration';

const kindOf = (category: string, title: string, mounting: string | null = null) => illustrationKind({ category, title, specs: { mounting } });

describe('illustrationKind', () => {
  it('draws the four single-kind categories as themselves, whatever the title says', () => {
    expect(kindOf('turbochargers', 'VX99 turbocharger, ball bearing, 0.82 A/R turbine (exchange unit)')).toBe('turbocharger');
    expect(kindOf('cartridges', 'VX99 cartridge, journal bearing, 56.3 trim')).toBe('cartridge');
    expect(kindOf('compressor-housings', 'VX99 compressor housing 0.60 A/R, 60 mm inlet')).toBe('compressor-housing');
    expect(kindOf('turbine-housings', 'VX99 turbine housing 0.82 A/R, 4-bolt square 52, cast iron')).toBe('turbine-housing');
    expect(kindOf('cartridges', 'VX99 gasket and seal kit')).toBe('cartridge');
  });

  it('tells gaskets, lines, couplers, clamps and small fittings apart by their title words', () => {
    const cases: Array<[string, IllustrationKind]> = [
      ['4-bolt square 52 turbine inlet gasket', 'flange-gasket'],
      ['VX99 oil drain gasket', 'flange-gasket'],
      ['VX99 gasket and seal kit', 'flange-gasket'],
      ['VX99 oil feed line -4 AN, 600 mm', 'hose-line'],
      ['VX99 oil drain line -10 AN', 'hose-line'],
      ['VX99 water line kit', 'hose-line'],
      ['VX99 compressor outlet coupler 52 mm', 'silicone-coupler'],
      ['VX99 turbine outlet V-band clamp', 'v-band-clamp'],
      ['VX99 oil feed restrictor 1.0 mm', 'small-fitting'],
      ['Oil feed adaptor M12 to -4 AN', 'small-fitting'],
      ['Weld-on EGT bung', 'small-fitting'],
      ['Shaft speed sensor boss', 'small-fitting'],
    ];
    for (const [title, kind] of cases) expect(kindOf('gaskets-fittings', title), title).toBe(kind);
  });

  it('lets the mounting decide between a dash gauge, a sensor and a logger, then the title', () => {
    expect(kindOf('gauges-sensors', 'Boost gauge 52 mm, −1 to 2 bar', '52 mm dash pod')).toBe('dash-gauge');
    expect(kindOf('gauges-sensors', 'Shaft speed sensor kit, small frames, dash gauge', '52 mm dash gauge')).toBe('dash-gauge');
    expect(kindOf('gauges-sensors', 'Shaft speed sensor kit, small frames, plug-in logger', 'plug-in logger (USB download)')).toBe('plug-in-logger');
    expect(kindOf('gauges-sensors', 'Oil pressure sender 0–10 bar', 'threaded sender')).toBe('sensor-probe');
    expect(kindOf('gauges-sensors', 'EGT thermocouple probe, type K, exposed tip', 'compression fitting')).toBe('sensor-probe');
    // Without a mounting the title's words still choose.
    expect(kindOf('gauges-sensors', 'Shaft speed sensor kit, large frames, dash gauge')).toBe('dash-gauge');
    expect(kindOf('gauges-sensors', 'Manifold pressure sensor 4 bar absolute')).toBe('sensor-probe');
    expect(kindOf('gauges-sensors', 'Data logger with USB lead')).toBe('plug-in-logger');
  });

  it('falls back to the category’s own drawing when nothing more specific matches', () => {
    expect(kindOf('gaskets-fittings', 'Heat wrap, 50 mm × 10 m')).toBe('flange-gasket');
    expect(kindOf('gauges-sensors', 'Boost controller')).toBe('dash-gauge');
    expect(illustrationKind({ category: 'gauges-sensors', title: 'Wideband controller', specs: null })).toBe('dash-gauge');
  });

  it('never gives a part another category’s kind, even when its title names one', () => {
    // "turbocharger" and "compressor housing" are in these titles, but the part is a fitting and a gauge.
    expect(kindOf('gaskets-fittings', 'Turbocharger oil feed restrictor')).toBe('small-fitting');
    expect(kindOf('gauges-sensors', 'Compressor housing speed sensor', 'threaded sensor')).toBe('sensor-probe');
  });

  it('has one family per category and draws every kind in some family', () => {
    expect(Object.keys(KINDS_BY_CATEGORY).sort()).toEqual([...CATEGORY_SLUGS].sort());
    expect(new Set(Object.values(KINDS_BY_CATEGORY).flat())).toEqual(new Set(ILLUSTRATION_KINDS));
  });
});

describe('the demo catalogue', () => {
  const parts = generateCatalogue().parts;

  it('gives every part a kind that belongs to its category', () => {
    expect(parts.length).toBeGreaterThan(100);
    for (const p of parts) {
      const allowed: readonly string[] = KINDS_BY_CATEGORY[p.category as keyof typeof KINDS_BY_CATEGORY] ?? [];
      expect(allowed, `${p.partNumber} ${p.title}`).toContain(illustrationKind(p));
    }
  });

  it('uses every kind we draw, so each drawing is seen somewhere', () => {
    expect(new Set(parts.map((p) => illustrationKind(p)))).toEqual(new Set(ILLUSTRATION_KINDS));
  });

  it('draws each kind of gasket, fitting, gauge and sensor as intended', () => {
    const byTitle = (words: string) => parts.filter((p) => p.title.includes(words));
    const expectations: Array<[string, IllustrationKind]> = [
      ['turbine inlet gasket', 'flange-gasket'],
      ['oil drain gasket', 'flange-gasket'],
      ['gasket and seal kit', 'flange-gasket'],
      ['oil feed line', 'hose-line'],
      ['oil drain line', 'hose-line'],
      ['water line kit', 'hose-line'],
      ['coupler', 'silicone-coupler'],
      ['clamp', 'v-band-clamp'],
      ['restrictor', 'small-fitting'],
      ['Boost gauge', 'dash-gauge'],
      ['temperature gauge', 'dash-gauge'],
      ['Oil pressure gauge', 'dash-gauge'],
      ['dash gauge', 'dash-gauge'],
      ['probe', 'sensor-probe'],
      ['sender', 'sensor-probe'],
      ['pressure sensor', 'sensor-probe'],
      ['logger', 'plug-in-logger'],
    ];
    for (const [words, kind] of expectations) {
      const found = byTitle(words);
      expect(found.length, words).toBeGreaterThan(0);
      for (const p of found) expect(illustrationKind(p), p.title).toBe(kind);
    }
  });
});
