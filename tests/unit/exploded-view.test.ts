import { describe, expect, it } from 'vitest';
import { FRAMES } from '../../catalog-seed/frames';
import { generateCatalogue } from '../../catalog-seed/generate';
import {
  catalogueLinkOf,
  clockAngle,
  clockingOf,
  clockWords,
  CLOCK_POSITIONS,
  orientationProblem,
  orientationText,
  partsOfPiece,
  pieceForCategory,
  piecesOf,
  PIECE_IDS,
  turbineJointOf,
} from '../../shared/exploded-view';

const catalogue = generateCatalogue();
const onSale = catalogue.parts.filter((p) => p.status !== 'superseded');

describe('the pieces of the exploded view', () => {
  it('draws every frame in the same pieces, intake side first', () => {
    for (const f of FRAMES) expect(piecesOf(f).map((p) => p.id)).toEqual([...PIECE_IDS]);
  });

  it.each(FRAMES.map((f) => [f.code, f] as const))('frame %s: each piece opens exactly its categories of the frame, or says it has none', (code, frame) => {
    for (const piece of piecesOf(frame)) {
      const opened = partsOfPiece(piece, code, onSale).map((p) => p.partNumber).sort();
      const expected = onSale.filter((p) => p.frameCode === code && (piece.categories as readonly string[]).includes(p.category)).map((p) => p.partNumber).sort();
      expect(opened).toEqual(expected);
      if (piece.categories.length === 0) {
        expect(opened).toEqual([]);
        expect(catalogueLinkOf(piece, code)).toBeNull();
        expect(piece.noPartsText).toMatch(/not sold on (its|their) own/i);
      } else {
        // The demo catalogue sells something for every drawn piece but the joint.
        expect(opened.length).toBeGreaterThan(0);
        expect(catalogueLinkOf(piece, code)).toBe(`/catalogue?frame=${code}&category=${piece.categories[0]}`);
      }
    }
  });

  it('never opens another frame’s parts, nor parts without a frame', () => {
    const mixed = [
      { partNumber: 'A', category: 'cartridges', frameCode: 'AWL' },
      { partNumber: 'B', category: 'cartridges', frameCode: 'BUR' },
      { partNumber: 'C', category: 'gaskets-fittings', frameCode: null },
    ];
    const cartridge = piecesOf(FRAMES[0]!).find((p) => p.id === 'cartridge')!;
    const gaskets = piecesOf(FRAMES[0]!).find((p) => p.id === 'gaskets')!;
    expect(partsOfPiece(cartridge, 'AWL', mixed).map((p) => p.partNumber)).toEqual(['A']);
    expect(partsOfPiece(gaskets, 'AWL', mixed)).toEqual([]);
  });

  it('draws each category as its piece, and a complete unit as the whole', () => {
    expect(pieceForCategory('compressor-housings')).toBe('compressor-cover');
    expect(pieceForCategory('cartridges')).toBe('cartridge');
    expect(pieceForCategory('turbine-housings')).toBe('turbine-housing');
    expect(pieceForCategory('gaskets-fittings')).toBe('gaskets');
    expect(pieceForCategory('turbochargers')).toBeNull();
    expect(pieceForCategory('gauges-sensors')).toBeNull();
  });

  it('holds the turbine housing with a clamp on V-band frames and with bolts on the others', () => {
    expect(turbineJointOf({ flangePattern: 'V-band 96' })).toBe('clamp');
    expect(turbineJointOf({ flangePattern: '4-bolt square 52' })).toBe('bolts');
    expect(piecesOf({ flangePattern: 'V-band 96' }).find((p) => p.id === 'turbine-joint')!.name).toMatch(/clamp/i);
  });
});

describe('clocked positions', () => {
  it('turns clock positions into angles clockwise from 12 (a clock face: 30° an hour)', () => {
    expect(clockAngle('12:00')).toBe(0);
    expect(clockAngle('1:30')).toBe(45);
    expect(clockAngle('3:00')).toBe(90);
    expect(clockAngle('6:00')).toBe(180);
    expect(clockAngle('10:30')).toBe(315);
    expect(clockWords('6:00')).toBe("6 o'clock");
    expect(clockWords('4:30')).toBe('4:30');
  });

  it.each(FRAMES.map((f) => [f.code, f] as const))('frame %s: compressor every 45°, turbine every 60°, standard among them', (_code, frame) => {
    const c = clockingOf(frame);
    const steps = (list: readonly (typeof CLOCK_POSITIONS)[number][]) => list.map(clockAngle).map((a, i, all) => ((all[(i + 1) % all.length]! - a + 360) % 360));
    // Our choice, matching the catalogue's housings ("8 clocking positions", "6 clocking positions").
    expect(c.compressorOutlet).toHaveLength(8);
    expect(new Set(steps(c.compressorOutlet))).toEqual(new Set([45]));
    expect(c.turbineInlet).toHaveLength(6);
    expect(new Set(steps(c.turbineInlet))).toEqual(new Set([60]));
    expect(c.compressorOutlet).toContain(c.standard.compressorOutlet);
    expect(c.turbineInlet).toContain(c.standard.turbineInlet);
  });

  it('matches the clocking the catalogue states on its housings', () => {
    const c = clockingOf(FRAMES[0]!);
    const compressor = onSale.find((p) => p.category === 'compressor-housings')!;
    const turbine = onSale.find((p) => p.category === 'turbine-housings')!;
    expect(compressor.specs.mounting).toContain(`${c.compressorOutlet.length} clocking positions`);
    expect(turbine.specs.mounting).toContain(`${c.turbineInlet.length} clocking positions`);
  });

  it('allows an orientation only on a complete unit of the frame, at positions the frame offers', () => {
    const frame = { code: 'CHS', flangePattern: '4-bolt square 52' };
    const unit = { partNumber: 'CHS-10-0201', category: 'turbochargers', frameCode: 'CHS' };
    expect(orientationProblem(unit, frame, { compressorOutlet: '1:30', turbineInlet: '4:00' })).toBeNull();
    expect(orientationProblem(unit, frame, { compressorOutlet: '2:00', turbineInlet: '6:00' })).toMatch(/compressor outlet/);
    expect(orientationProblem(unit, frame, { compressorOutlet: '12:00', turbineInlet: '4:30' })).toMatch(/turbine inlet/);
    expect(orientationProblem({ ...unit, category: 'turbine-housings' }, frame, { compressorOutlet: '12:00', turbineInlet: '6:00' })).toMatch(/not a complete turbocharger/);
    expect(orientationProblem({ ...unit, frameCode: null }, null, { compressorOutlet: '12:00', turbineInlet: '6:00' })).toMatch(/not a complete turbocharger/);
  });

  it('states the side it is viewed from, and says when it is the standard position', () => {
    expect(orientationText({ compressorOutlet: '12:00', turbineInlet: '6:00' })).toBe(
      "Compressor outlet 12 o'clock, turbine inlet 6 o'clock (viewed from the compressor inlet), standard position",
    );
    expect(orientationText({ compressorOutlet: '3:00', turbineInlet: '8:00' })).toBe("Compressor outlet 3 o'clock, turbine inlet 8 o'clock (viewed from the compressor inlet)");
  });
});
