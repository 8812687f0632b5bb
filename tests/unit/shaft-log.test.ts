import { describe, expect, it } from 'vitest';
import { isaPressureKpa } from '../../shared/fitment/atmosphere';
import {
  analyseShaftLog,
  EXCURSIONS_LISTED,
  MAX_HALF_GAP_S,
  NEAR_SURGE_MARGIN_PCT,
  rowDurationsS,
  shaftLogPoint,
  shaftLogPoints,
  summariseShaftLog,
} from '../../shared/fitment/shaft-log';
import { CompressorMapSchema } from '../../shared/schemas/compressor-map';
import type { ShaftLogRow } from '../../shared/schemas/shaft-logs';
import { TEST_ENGINE } from '../support/test-compressor-map';

const within = (actual: number | null | undefined, expected: number, share: number) =>
  expect(Math.abs((actual ?? Number.NaN) / expected - 1), `${actual} vs ${expected}`).toBeLessThanOrEqual(share);

/** A map drawn for the hand calculation: a straight surge line (10, 1.5) – (20, 2.5) – (30, 3.5), top ratio 3.5. */
const HAND_MAP = CompressorMapSchema.parse({
  surgeLine: [
    { flowLbMin: 10, pressureRatio: 1.5 },
    { flowLbMin: 20, pressureRatio: 2.5 },
    { flowLbMin: 30, pressureRatio: 3.5 },
  ],
  chokeLine: [
    { flowLbMin: 40, pressureRatio: 1.5 },
    { flowLbMin: 50, pressureRatio: 3.5 },
  ],
  speedLines: [],
  efficiencyIslands: [],
  maxPressureRatio: 3.5,
  maxShaftRpm: 200_000,
});
const FRAME = { maxShaftRpm: 200_000, map: HAND_MAP };
const row = (over: Partial<ShaftLogRow> = {}): ShaftLogRow => ({ t: 0, engineRpm: 6500, boostKpa: 111.1, shaftRpm: 150_000, intakeC: 45, ...over });

/*
 * Hand calculation (calculator) from the formulas the brief names, for the engine of the fitment chain's worked
 * example A (2.0 L, VE 0.90, sea level, ambient 25 °C = 298.15 K, charge loss 2.0 psi, inlet loss 0.5 psi) and
 * a logged row of 6500 rpm, 111.1 kPa boost, 45 °C (318.15 K) charge air:
 *   p_amb = 101.325 kPa (ISA, sea level);  MAP = 101.325 + 111.1            = 212.425 kPa
 *   ṁ     = MAP·VE·V_d·(N/60) / (2·R·T) = 212 425·0.9·0.002·108.333 / (2·287.05·318.15)
 *         = 41 422.9 / 182 649.9                                          = 0.226788 kg/s = 29.999 lb/min
 *   p1    = 101.325 − 0.5·6.894757 = 97.8776 kPa;  p2 = 212.425 + 2·6.894757 = 226.2145 kPa
 *   PR    = 226.2145 / 97.8776                                            = 2.31120
 *   Wc    = 29.999·√(298.15/288.15) / (97.8776/101.325)                   = 31.590 lb/min
 *   surge flow at PR 2.3112 on HAND_MAP = 10 + (2.3112 − 1.5)·10          = 18.112 lb/min
 *   surge margin = (31.590 − 18.112)/31.590                               = 42.67 %
 * At 4000 and 3500 rpm flow scales with rpm: Wc 19.440 (margin 6.83 %, near surge) and 17.010 (−6.48 %, in surge).
 */
describe('shaftLogPoint: a hand-worked point', () => {
  const p = shaftLogPoint(row(), TEST_ENGINE, FRAME);

  it('manifold pressure and pressure ratio', () => {
    within(p.manifoldKpa, 212.425, 1e-6);
    within(p.pressureRatio, 2.3112, 5e-5);
  });
  it('air mass flow by speed-density, and corrected flow', () => {
    within(p.airflowLbMin, 29.999, 5e-5);
    within(p.correctedFlowLbMin, 31.59, 5e-5);
  });
  it('surge flow, margin and flags', () => {
    within(p.surgeFlowLbMin, 18.112, 5e-5);
    within(p.surgeMarginPct, 42.67, 2e-4);
    expect(p.surge).toBe('clear');
    expect(p.shaftSpeedPct).toBe(75);
    expect(p.speed).toBe('ok');
    expect(p).toMatchObject({ t: 0, engineRpm: 6500, boostKpa: 111.1, shaftRpm: 150_000, intakeC: 45 });
  });
  it('near surge and in surge as the revs fall at the same boost', () => {
    const near = shaftLogPoint(row({ engineRpm: 4000 }), TEST_ENGINE, FRAME);
    within(near.correctedFlowLbMin, 19.44, 5e-5);
    within(near.surgeMarginPct, 6.831, 5e-4);
    expect(near.surge).toBe('near-surge');
    const inSurge = shaftLogPoint(row({ engineRpm: 3500 }), TEST_ENGINE, FRAME);
    within(inSurge.surgeMarginPct, -6.479, 5e-4);
    expect(inSurge.surge).toBe('surge');
    expect(NEAR_SURGE_MARGIN_PCT).toBe(10);
  });
});

describe('shaftLogPoint: the edges', () => {
  it('flags shaft speed strictly above 95 % as near the limit and strictly above 100 % as over speed', () => {
    const speed = (shaftRpm: number) => shaftLogPoint(row({ shaftRpm }), TEST_ENGINE, FRAME).speed;
    expect([speed(190_000), speed(190_001), speed(200_000), speed(200_001)]).toEqual(['ok', 'near-limit', 'near-limit', 'overspeed']);
  });

  it('takes ambient from the ISA at the check’s altitude (ICAO Doc 7488 table: 84.556 kPa at 1500 m)', () => {
    const high = shaftLogPoint(row(), { ...TEST_ENGINE, altitudeM: 1500 }, FRAME);
    expect(isaPressureKpa(1500)).toBeCloseTo(84.556, 2);
    within(high.manifoldKpa, 84.556 + 111.1, 2e-5);
    // Thinner air: the same boost is a higher ratio.
    expect(high.pressureRatio).toBeGreaterThan(2.3112 + 0.2);
  });

  it('uses the logged charge-air temperature: hotter air is less dense, so less flow', () => {
    const hot = shaftLogPoint(row({ intakeC: 90 }), TEST_ENGINE, FRAME);
    // ṁ ∝ 1/T: 318.15/363.15 of the 45 °C flow.
    within(hot.airflowLbMin, 29.999 * (318.15 / 363.15), 5e-5);
  });

  it('leaves vacuum rows off the map and says nothing of surge there', () => {
    const cruise = shaftLogPoint(row({ boostKpa: -45, engineRpm: 2300 }), TEST_ENGINE, FRAME);
    expect(cruise.pressureRatio).toBeLessThan(1);
    expect(cruise).toMatchObject({ surge: 'clear', surgeMarginPct: null, surgeFlowLbMin: null });
  });

  it('marks a ratio above the map’s top as above the map', () => {
    const spike = shaftLogPoint(row({ boostKpa: 300 }), TEST_ENGINE, FRAME);
    expect(spike.pressureRatio).toBeGreaterThan(3.5);
    expect(spike).toMatchObject({ surge: 'above-map', surgeFlowLbMin: null, surgeMarginPct: null });
  });

  it('treats boost with the engine stopped as surge, and no boost with it stopped as nothing', () => {
    expect(shaftLogPoint(row({ engineRpm: 0 }), TEST_ENGINE, FRAME)).toMatchObject({ airflowLbMin: 0, surge: 'surge' });
    expect(shaftLogPoint(row({ engineRpm: 0, boostKpa: 0 }), TEST_ENGINE, FRAME)).toMatchObject({ airflowLbMin: 0, surge: 'clear' });
  });
});

describe('rowDurationsS', () => {
  it('gives each row half the gap to each neighbour, adding up to the logged time', () => {
    const d = rowDurationsS([0, 0.1, 0.2, 0.4]);
    [0.05, 0.1, 0.15, 0.1].forEach((v, i) => expect(d[i]).toBeCloseTo(v, 12));
  });
  it('does not count a pause in logging as time in a state', () => {
    const d = rowDurationsS([0, 0.1, 30, 30.1]);
    expect(d[1]).toBeCloseTo(0.05 + MAX_HALF_GAP_S, 12);
    expect(d[2]).toBeCloseTo(MAX_HALF_GAP_S + 0.05, 12);
  });
});

describe('summariseShaftLog', () => {
  // 10 Hz: 5 rows clear, 3 near surge, 2 in surge, 4 clear with 2 of them over speed, 2 above the map, 1 in vacuum.
  const rows: ShaftLogRow[] = [
    ...[0, 1, 2, 3, 4].map(() => row()),
    ...[0, 1, 2].map(() => row({ engineRpm: 4000 })),
    row({ engineRpm: 3500 }),
    row({ engineRpm: 3400 }),
    row({ shaftRpm: 192_000 }),
    row({ shaftRpm: 201_000 }),
    row({ shaftRpm: 204_000 }),
    row(),
    row({ boostKpa: 300 }),
    row({ boostKpa: 310 }),
    row({ boostKpa: -40, engineRpm: 2500, shaftRpm: 30_000 }),
  ].map((r, i) => ({ ...r, t: i / 10 }));
  const points = shaftLogPoints(rows, TEST_ENGINE, FRAME);
  const summary = summariseShaftLog(points, FRAME);

  it('peak shaft speed against the limit', () => {
    expect(summary).toMatchObject({ points: 17, maxShaftRpm: 200_000, peakShaftRpm: 204_000, peakShaftSpeedPct: 102, peakAtS: 1.2 });
    expect(summary.durationS).toBeCloseTo(1.6, 12);
  });

  it('time near or in surge, over speed and above the map, 0.1 s a row', () => {
    expect(summary.timeNearOrInSurgeS).toBeCloseTo(0.5, 12);
    expect(summary.timeInSurgeS).toBeCloseTo(0.2, 12);
    expect(summary.timeOverSpeedS).toBeCloseTo(0.2, 12);
    expect(summary.timeNearLimitS).toBeCloseTo(0.1, 12);
    expect(summary.timeAboveMapS).toBeCloseTo(0.2, 12);
    expect(summary.pointsBelowMap).toBe(1);
    expect(summary.leastSurgeMarginPct).toBeLessThan(-6.479);
  });

  it('tells each excursion once, at its worst row, in time order', () => {
    expect(summary.excursions.map((e) => [e.kind, e.fromS, e.toS, e.points, e.worstAtS])).toEqual([
      ['surge', 0.5, 0.9, 5, 0.9],
      ['overspeed', 1, 1.2, 3, 1.2],
      ['above-map', 1.4, 1.5, 2, 1.5],
    ]);
    expect(summary.excursions[0]?.durationS).toBeCloseTo(0.5, 12);
    expect(summary.excursions[1]?.shaftSpeedPct).toBe(102);
    expect(summary.moreExcursions).toBe(0);
  });

  it('a near-surge run that never crosses the line stays near surge', () => {
    const near = summariseShaftLog(shaftLogPoints([0, 1, 2].map((i) => row({ t: i / 10, engineRpm: 4000 })), TEST_ENGINE, FRAME), FRAME);
    expect(near.excursions.map((e) => e.kind)).toEqual(['near-surge']);
    expect(near.timeInSurgeS).toBe(0);
  });

  it('caps the list of excursions and counts the rest', () => {
    const many = Array.from({ length: 2 * (EXCURSIONS_LISTED + 5) }, (_, i) => row({ t: i / 10, shaftRpm: i % 2 === 0 ? 205_000 : 100_000 }));
    const s = summariseShaftLog(shaftLogPoints(many, TEST_ENGINE, FRAME), FRAME);
    expect(s.excursions).toHaveLength(EXCURSIONS_LISTED);
    expect(s.moreExcursions).toBe(5);
  });

  it('analyseShaftLog is the two together; an empty log is all zeros', () => {
    expect(analyseShaftLog(rows, TEST_ENGINE, FRAME)).toEqual({ points, summary });
    expect(summariseShaftLog([], FRAME)).toMatchObject({ points: 0, durationS: 0, peakShaftRpm: 0, leastSurgeMarginPct: null, excursions: [] });
  });
});
