import { describe, expect, it } from 'vitest';
import { demoShaftLogCsv, demoShaftLogRows, type DemoLogOptions } from '../../catalog-seed/demo-logs';
import { analyseShaftLog } from '../../shared/fitment/shaft-log';
import { parseShaftLogCsv } from '../../shared/shaft-log-csv';
import { testCompressorMap, TEST_ENGINE, testOperatingLine } from '../support/test-compressor-map';

const options: DemoLogOptions = {
  engine: TEST_ENGINE,
  chargeAirC: 45,
  frame: { maxShaftRpm: 200_000, map: testCompressorMap() },
  operatingLine: testOperatingLine(),
  seed: 11,
};

function analysed(extra: Partial<DemoLogOptions> = {}) {
  const parsed = parseShaftLogCsv(demoShaftLogCsv({ ...options, ...extra }));
  if (!parsed.ok) throw new Error(JSON.stringify(parsed.errors));
  return analyseShaftLog(parsed.rows, options.engine, options.frame);
}

describe('demo shaft-speed logs', () => {
  it('are deterministic for a seed and differ between seeds', () => {
    expect(demoShaftLogCsv(options)).toBe(demoShaftLogCsv(options));
    expect(demoShaftLogCsv({ ...options, seed: 12 })).not.toBe(demoShaftLogCsv(options));
  });

  it('read back through our own parser in every boost unit, times rising at 10 Hz', () => {
    for (const boostUnit of ['kpa', 'psi', 'bar'] as const) {
      const parsed = parseShaftLogCsv(demoShaftLogCsv({ ...options, boostUnit, comments: ['invented'] }));
      expect(parsed.ok, boostUnit).toBe(true);
    }
    const rows = demoShaftLogRows(options);
    expect(rows.length).toBeGreaterThan(150);
    rows.forEach((r, i) => i > 0 && expect(r.t - (rows[i - 1]?.t ?? 0)).toBeCloseTo(0.1, 6));
  });

  it('spool up through a pull to the check’s boost and the top of the rev range', () => {
    const { points } = analysed();
    const top = Math.max(...points.map((p) => p.engineRpm));
    expect(top).toBeGreaterThan(6500);
    expect(top).toBeLessThan(6800);
    const boosted = points.filter((p) => p.engineRpm > 5000 && p.boostKpa > 100);
    // 16 psi is 110.3 kPa (NIST SP 811: 1 psi = 6.894 757 kPa); the line holds it within a few kPa.
    expect(Math.max(...boosted.map((p) => p.boostKpa))).toBeGreaterThan(105);
    expect(Math.max(...boosted.map((p) => p.boostKpa))).toBeLessThan(120);
    expect(points[0]?.pressureRatio).toBeLessThan(1);
    expect(points.at(-1)?.pressureRatio).toBeLessThan(1);
  });

  it('lift off with a brief near-surge and never into surge or over speed', () => {
    const { summary } = analysed();
    expect(summary.excursions.map((e) => e.kind)).toEqual(['near-surge']);
    expect(summary.timeNearOrInSurgeS).toBeGreaterThan(0.1);
    expect(summary.timeNearOrInSurgeS).toBeLessThan(1);
    expect(summary.timeInSurgeS).toBe(0);
    expect(summary.timeOverSpeedS).toBe(0);
    expect(summary.peakShaftSpeedPct).toBeLessThan(95);
  });

  it('the variant touches past the shaft-speed limit briefly on a boost spike', () => {
    const { summary } = analysed({ overspeedTouch: true });
    const over = summary.excursions.filter((e) => e.kind === 'overspeed');
    expect(over).toHaveLength(1);
    expect(summary.timeOverSpeedS).toBeGreaterThan(0.1);
    expect(summary.timeOverSpeedS).toBeLessThan(0.6);
    expect(summary.peakShaftSpeedPct).toBeGreaterThan(100);
    expect(summary.peakShaftSpeedPct).toBeLessThan(103);
    expect(summary.timeInSurgeS).toBe(0);
  });
});
