import { describe, expect, it } from 'vitest';
import { FRAMES } from '../../catalog-seed/frames';
import { buildCompressorMap } from '../../shared/fitment/compressor-map';
import { contourEfficiency, correctedShaftRpmAt, efficiencyAt, flowLimitAt, mapZoneAt, surgeFlowLbMinAt } from '../../shared/fitment/map-query';
import { CompressorMapSchema, type CompressorMap } from '../../shared/schemas/compressor-map';

const maps = FRAMES.map((frame) => ({ frame, maxShaftRpm: frame.maxShaftRpm, map: buildCompressorMap(frame) }));

const increasing = (values: number[]) => values.every((value, index) => index === 0 || value > (values[index - 1] ?? -Infinity));

describe('buildCompressorMap', () => {
  it.each(maps.map((entry) => [entry.frame.code, entry] as const))('%s: parses, is JSON-safe and deterministic', (_code, { frame, maxShaftRpm, map }) => {
    expect(CompressorMapSchema.parse(JSON.parse(JSON.stringify(map)))).toEqual(map);
    expect(buildCompressorMap(frame)).toEqual(map);
    expect(map.maxShaftRpm).toBe(maxShaftRpm);
    expect(map.maxPressureRatio).toBeCloseTo(frame.maxPressureRatio, 2);
  });

  it.each(maps.map((entry) => [entry.frame.code, entry.map, entry.frame.maxFlowLbMin] as const))(
    '%s: surge and choke lines rise, speed lines fall from surge to choke, the top line reaches the maximum ratio',
    (_code, map: CompressorMap, ratedFlow) => {
      expect(increasing(map.surgeLine.map((p) => p.pressureRatio))).toBe(true);
      expect(increasing(map.surgeLine.map((p) => p.flowLbMin))).toBe(true);
      expect(increasing(map.chokeLine.map((p) => p.pressureRatio))).toBe(true);
      expect(increasing(map.speedLines.map((line) => line.rpm))).toBe(true);
      for (const line of map.speedLines) {
        expect(increasing(line.points.map((p) => p.flowLbMin))).toBe(true);
        expect(increasing(line.points.map((p) => -p.pressureRatio))).toBe(true);
      }
      const top = map.speedLines[map.speedLines.length - 1];
      expect(top?.rpm).toBe(map.maxShaftRpm);
      expect(top?.points[0]?.pressureRatio).toBeCloseTo(map.maxPressureRatio, 3);
      // The rated flow lies on the map; full choke is a little past it.
      const chokeTop = map.chokeLine[map.chokeLine.length - 1]?.flowLbMin ?? 0;
      expect(chokeTop).toBeGreaterThan(ratedFlow);
      expect(chokeTop).toBeLessThan(ratedFlow * 1.15);
      expect(map.referenceTemperatureK).toBe(288.15);
      expect(map.referencePressureKpa).toBe(101.325);
    },
  );

  it.each(maps.map((entry) => [entry.frame.code, entry.map] as const))('%s: islands are closed, nested and between 60 and 80 %', (_code, map) => {
    expect(map.efficiencyIslands.length).toBeGreaterThanOrEqual(3);
    let previous = 0;
    for (const island of map.efficiencyIslands) {
      expect(island.efficiency).toBeGreaterThan(previous);
      previous = island.efficiency;
      expect(island.points[0]).toEqual(island.points[island.points.length - 1]);
    }
    expect(map.peakEfficiency).toBeGreaterThan(0.69);
    expect(map.peakEfficiency).toBeLessThan(0.8);
  });

  it('efficiency is highest in the middle of the map and falls towards surge and choke', () => {
    const { map } = maps[3] ?? maps[0]!;
    const pr = 2.2;
    const surge = surgeFlowLbMinAt(map, pr) ?? 0;
    const limit = flowLimitAt(map, pr)?.flowLbMin ?? 0;
    const middle = efficiencyAt(map, surge + 0.4 * (limit - surge), pr) ?? 0;
    expect(middle).toBeGreaterThan(efficiencyAt(map, surge * 1.02, pr) ?? 1);
    expect(middle).toBeGreaterThan(efficiencyAt(map, limit * 0.98, pr) ?? 1);
    expect(efficiencyAt(map, surge * 0.9, pr)).toBeNull();
  });

  it('reads back each speed line\'s own rpm from its points', () => {
    for (const { map } of maps) {
      for (const line of map.speedLines.slice(1, -1)) {
        const point = line.points[6];
        if (!point) continue;
        const rpm = correctedShaftRpmAt(map, point.flowLbMin, point.pressureRatio) ?? 0;
        expect(Math.abs(rpm / line.rpm - 1)).toBeLessThan(0.01);
      }
    }
  });

  it('classifies points left of surge, past choke, past the top speed line and above the maximum ratio', () => {
    const { map, frame } = maps[3]!;
    expect(mapZoneAt(map, 5, 2.5)).toBe('surge');
    expect(mapZoneAt(map, frame.maxFlowLbMin * 1.2, 1.8)).toBe('choke');
    expect(mapZoneAt(map, frame.maxFlowLbMin, frame.maxPressureRatio - 0.1)).toBe('overspeed');
    expect(mapZoneAt(map, frame.maxFlowLbMin * 0.6, frame.maxPressureRatio + 0.1)).toBe('above-max-pr');
    expect(mapZoneAt(map, frame.maxFlowLbMin * 0.7, 2.0)).toBe('inside');
  });

  it('falls back to the Euler relation when a map carries no speed lines', () => {
    const { map } = maps[0]!;
    expect(correctedShaftRpmAt({ ...map, speedLines: [] }, 8, 2)).toBeNull();
  });
});

describe('efficiency read through the per-map table', () => {
  it('matches the contour interpolation it caches: 95 % of points within 0.1 point, 99 % within 1 point', () => {
    const diffs: number[] = [];
    for (const { map } of maps) {
      const maxFlow = Math.max(...map.chokeLine.map((p) => p.flowLbMin));
      for (let i = 1; i < 50; i++) {
        for (let j = 1; j < 50; j++) {
          const w = (maxFlow * i) / 50;
          const pr = 1 + ((map.maxPressureRatio - 1) * j) / 50;
          if (mapZoneAt(map, w, pr) !== 'inside') continue;
          diffs.push(Math.abs((efficiencyAt(map, w, pr) ?? 0) - contourEfficiency(map, w, pr)));
        }
      }
    }
    diffs.sort((a, b) => a - b);
    expect(diffs.length).toBeGreaterThan(5000);
    expect(diffs[Math.floor(diffs.length * 0.95)]).toBeLessThan(0.001);
    expect(diffs[Math.floor(diffs.length * 0.99)]).toBeLessThan(0.01);
  });
});
