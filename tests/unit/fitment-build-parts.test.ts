import { describe, expect, it } from 'vitest';
import type { PartDetail, PartSummary, Specs } from '../../shared/schemas/parts';
import { compressorArFor, fittingLines, planBuild, turbineMaterialFor, type BuildRequest, type FrameStock } from '../../src/features/fitment/lib/build-parts';

const NO_SPECS: Specs = {
  compressorAr: null,
  turbineAr: null,
  trimPct: null,
  inducerMm: null,
  exducerMm: null,
  flangePattern: null,
  inletMm: null,
  outletMm: null,
  material: null,
  bearing: null,
  wastegate: null,
  cooling: null,
  gaugeType: null,
  rangeText: null,
  mounting: null,
  connection: null,
};

function createPart(overrides: Partial<Omit<PartSummary, 'specs'>> & { specs?: Partial<Specs> } = {}): PartSummary {
  const { specs, ...rest } = overrides;
  return {
    partNumber: 'TST-10-0201',
    gtin: '2473100000016',
    title: 'test part',
    category: 'turbochargers',
    frameCode: 'TST',
    status: 'active',
    condition: 'new',
    priceCents: 10_000,
    coreDepositCents: 0,
    weightGrams: 1000,
    supersededBy: null,
    stock: { available: 5, state: 'in-stock' },
    photo: null,
    ...rest,
    specs: { ...NO_SPECS, ...specs },
  };
}

// An invented frame shaped like the demo catalogue: complete units pair turbine A/R 0.57/0.63/0.82 with compressor
// A/R 0.50/0.60/0.70, and one larger turbine housing (0.94) is sold only on its own.
const unit = (n: number, turbineAr: number, compressorAr: number, bearing: 'ball' | 'journal', extra: Partial<PartSummary> = {}) =>
  createPart({ partNumber: `TST-10-020${n}`, specs: { turbineAr, compressorAr, bearing, inducerMm: 48, material: 'cast iron', cooling: 'oil and water' }, ...extra });

function stock(overrides: Partial<FrameStock> = {}): FrameStock {
  return {
    units: [unit(1, 0.57, 0.5, 'ball'), unit(2, 0.63, 0.6, 'ball'), unit(3, 0.82, 0.7, 'ball'), unit(4, 0.82, 0.7, 'ball', { condition: 'exchange', partNumber: 'TST-10-0203-XCH' })],
    cartridges: [
      createPart({ partNumber: 'TST-20-0201', category: 'cartridges', specs: { bearing: 'ball', inducerMm: 48, cooling: 'oil and water' } }),
      createPart({ partNumber: 'TST-20-0202', category: 'cartridges', specs: { bearing: 'ball', inducerMm: 50, cooling: 'oil and water' } }),
    ],
    compressorHousings: [
      createPart({ partNumber: 'TST-30-0201', category: 'compressor-housings', specs: { compressorAr: 0.7, inducerMm: 50 } }),
      createPart({ partNumber: 'TST-30-0202', category: 'compressor-housings', specs: { compressorAr: 0.7, inducerMm: 48 } }),
      createPart({ partNumber: 'TST-30-0203', category: 'compressor-housings', specs: { compressorAr: 0.6, inducerMm: 48 } }),
    ],
    turbineHousings: [
      createPart({ partNumber: 'TST-40-0201', category: 'turbine-housings', specs: { turbineAr: 0.94, material: 'cast iron' } }),
      createPart({ partNumber: 'TST-40-0202', category: 'turbine-housings', specs: { turbineAr: 0.94, material: 'cast stainless steel' } }),
      createPart({ partNumber: 'TST-40-0203', category: 'turbine-housings', specs: { turbineAr: 0.82, material: 'cast iron' } }),
    ],
    ...overrides,
  };
}

const request = (overrides: Partial<BuildRequest> = {}): BuildRequest => ({
  frameCode: 'TST',
  layout: 'single',
  bearing: 'ball',
  turbineAr: 0.82,
  application: 'street',
  turbineInletC: 950,
  ...overrides,
});

describe('planBuild', () => {
  it('takes the new complete unit with the bearing and turbine A/R when one is sold and in stock', () => {
    const plan = planBuild(request(), stock());
    expect(plan.kind).toBe('complete');
    expect(plan.lines.map((l) => l.part?.partNumber)).toEqual(['TST-10-0203']);
    expect(plan.compressorAr).toBe(0.7);
  });

  it('builds from a cartridge and both housings when no complete unit has the turbine A/R', () => {
    const plan = planBuild(request({ turbineAr: 0.94 }), stock());
    expect(plan.kind).toBe('assembled');
    expect(plan.completeOffered).toBe(false);
    // The standard 48 mm wheel (the map's), a compressor housing bored for it at the A/R paired with the nearest
    // complete unit (0.82 → 0.70), and a cast-iron 0.94 turbine housing for a street engine.
    expect(plan.lines.map((l) => [l.role, l.part?.partNumber])).toEqual([
      ['cartridge', 'TST-20-0201'],
      ['compressor-housing', 'TST-30-0202'],
      ['turbine-housing', 'TST-40-0201'],
    ]);
    expect(plan.missing).toEqual([]);
  });

  it('takes two of each for a twin', () => {
    const plan = planBuild(request({ layout: 'twin', turbineAr: 0.94 }), stock());
    expect(plan.lines.every((l) => l.quantity === 2)).toBe(true);
  });

  it('uses stainless in place of iron when iron is short, but never iron in place of stainless', () => {
    const shortIron = stock({
      turbineHousings: [
        createPart({ partNumber: 'TST-40-0201', category: 'turbine-housings', stock: { available: 0, state: 'out-of-stock' }, specs: { turbineAr: 0.94, material: 'cast iron' } }),
        createPart({ partNumber: 'TST-40-0202', category: 'turbine-housings', specs: { turbineAr: 0.94, material: 'cast stainless steel' } }),
      ],
    });
    expect(planBuild(request({ turbineAr: 0.94 }), shortIron).lines[2]?.part?.partNumber).toBe('TST-40-0202');
    const shortSteel = stock({
      turbineHousings: [
        createPart({ partNumber: 'TST-40-0201', category: 'turbine-housings', specs: { turbineAr: 0.94, material: 'cast iron' } }),
        createPart({ partNumber: 'TST-40-0202', category: 'turbine-housings', stock: { available: 0, state: 'out-of-stock' }, specs: { turbineAr: 0.94, material: 'cast stainless steel' } }),
      ],
    });
    const circuit = planBuild(request({ turbineAr: 0.94, application: 'circuit' }), shortSteel);
    expect(circuit.lines[2]?.part?.partNumber).toBe('TST-40-0202');
  });

  it('falls back to the parts when the complete unit is out of stock and the parts are not', () => {
    const plan = planBuild(request(), stock({ units: [unit(3, 0.82, 0.7, 'ball', { stock: { available: 0, state: 'out-of-stock' } })] }));
    expect(plan.kind).toBe('assembled');
    expect(plan.completeOffered).toBe(true);
    expect(planBuild(request({ prefer: 'complete' }), stock({ units: [unit(3, 0.82, 0.7, 'ball', { stock: { available: 0, state: 'out-of-stock' } })] })).kind).toBe('complete');
  });

  it('names the line it cannot fill', () => {
    const plan = planBuild(request({ turbineAr: 0.94 }), stock({ cartridges: [] }));
    expect(plan.missing).toEqual(['cartridge']);
  });
});

describe('compressorArFor and turbineMaterialFor', () => {
  it('pairs a turbine A/R with the compressor A/R of the nearest complete unit', () => {
    const units = stock().units;
    expect(compressorArFor(units, 0.57)).toBe(0.5);
    expect(compressorArFor(units, 0.62)).toBe(0.6);
    expect(compressorArFor([], 0.6)).toBeNull();
  });

  it('asks for stainless only for sustained full load at 950 °C or more', () => {
    expect(turbineMaterialFor('street', 950).material).toBe('cast iron');
    expect(turbineMaterialFor('marine', 950).material).toBe('cast stainless steel');
    expect(turbineMaterialFor('circuit', 880).material).toBe('cast iron');
  });
});

describe('fittingLines', () => {
  const fitting = (partNumber: string, title: string, frameCode: string | null = 'TST') =>
    createPart({ partNumber, title, category: 'gaskets-fittings', frameCode });
  const main = (specs: Partial<Specs>): PartDetail => ({
    ...createPart({ specs }),
    description: '',
    images: [],
    frame: null,
    crossReferences: [],
    earlierNumbers: [],
    replacement: null,
    goesWith: [
      fitting('TST-50-0201', 'TST oil drain gasket'),
      fitting('TST-50-0202', 'TST gasket and seal kit'),
      fitting('TST-50-0203', 'TST oil feed line -4 AN, 600 mm'),
      fitting('TST-50-0204', 'TST oil drain line -10 AN'),
      fitting('TST-50-0207', 'TST oil feed restrictor 1.0 mm'),
      fitting('TST-50-0208', 'TST water line kit'),
      fitting('FLG-50-0201', '4-bolt square 52 turbine inlet gasket', null),
    ],
  });

  it('takes the seal kit and oil lines from the goes-with links, with a restrictor for ball bearings and coolant lines when water-cooled', () => {
    expect(fittingLines(main({ bearing: 'ball', cooling: 'oil and water' }), 1).map((l) => [l.role, l.part?.partNumber])).toEqual([
      ['seal-kit', 'TST-50-0202'],
      ['oil-feed', 'TST-50-0203'],
      ['oil-restrictor', 'TST-50-0207'],
      ['oil-drain', 'TST-50-0204'],
      ['water-lines', 'TST-50-0208'],
    ]);
    expect(fittingLines(main({ bearing: 'journal', cooling: 'oil' }), 2).map((l) => [l.role, l.quantity])).toEqual([
      ['seal-kit', 2],
      ['oil-feed', 2],
      ['oil-drain', 2],
    ]);
  });
});
