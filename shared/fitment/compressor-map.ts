import type { CompressorMap, EfficiencyIsland, MapPoint, SpeedLine } from '../schemas/compressor-map';
import {
  BEST_POINT_N,
  EFFICIENCY_FALL_N,
  EFFICIENCY_FALL_X,
  bestPointX,
  chokeFlowLbMin,
  efficiencyOnMap,
  frameRatings,
  peakEfficiency,
  surgePressureRatio,
  type WheelShape,
} from './frame-family';
import { CP_AIR_J_PER_KG_K, ISENTROPIC_EXPONENT, REFERENCE_PRESSURE_KPA, REFERENCE_TEMPERATURE_K } from './gas';
import { tipSpeedMs } from './shaft-speed';

/**
 * The invented map is laid out in two coordinates: n = N/N_max along the speed lines' order and x ∈ [0, 1] from
 * the surge end (x = 0) to the choke end (x = 1) of each speed line. The surge end of every speed line follows
 * the Euler work equation at the family's work coefficient and the map's own efficiency there
 * (frame-family.ts); flow capacity follows the inducer area. The remaining shape constants make it look like a
 * radial compressor with a backswept wheel; they are not taken from any product.
 */
const LOWEST_SPEED_FRACTION = 0.3;
/** Surge flow as a share of the speed line's choke flow: wide at low speed, narrower at the top (≈ 0.45). */
const SURGE_SHARE_LOW = 0.28;
const SURGE_SHARE_RISE = 0.17;
/** Speed lines fall by this share of their pressure rise from surge to choke, steepest at the choke end. */
const SPEED_LINE_DROP = 0.3;
const SPEED_LINE_SHAPE_EXPONENT = 3;
const ISLAND_LEVELS = [0.6, 0.64, 0.68, 0.72, 0.75, 0.77];
const POINTS_PER_SPEED_LINE = 14;
const POINTS_PER_ISLAND = 48;

const round = (value: number, digits: number) => {
  const scale = 10 ** digits;
  return Math.round(value * scale) / scale;
};
const clamp = (value: number, low: number, high: number) => Math.min(high, Math.max(low, value));

interface MapModel {
  chokeFlowAt(n: number): number;
  surgeFlowAt(n: number): number;
  point(x: number, n: number): MapPoint;
  efficiency(x: number, n: number): number;
  peakEfficiency: number;
  bestX: number;
}

function mapModel(shape: WheelShape): MapModel {
  const chokeTop = chokeFlowLbMin(shape.inducerMm);
  const chokeFlowAt = (n: number) => chokeTop * Math.sin((Math.PI / 2) * n);
  const surgeFlowAt = (n: number) => chokeFlowAt(n) * (SURGE_SHARE_LOW + SURGE_SHARE_RISE * n * n);
  const point = (x: number, n: number): MapPoint => {
    const flow = surgeFlowAt(n) + x * (chokeFlowAt(n) - surgeFlowAt(n));
    const pr = 1 + (surgePressureRatio(shape, n) - 1) * (1 - SPEED_LINE_DROP * x ** SPEED_LINE_SHAPE_EXPONENT);
    return { flowLbMin: round(flow, 3), pressureRatio: round(pr, 4) };
  };
  return {
    chokeFlowAt,
    surgeFlowAt,
    point,
    efficiency: (x, n) => efficiencyOnMap(shape, x, n),
    peakEfficiency: peakEfficiency(shape.exducerMm),
    bestX: bestPointX(shape),
  };
}

/** Closer lines near the top, where they crowd together and a frame's limits are read. */
const SPEED_LINE_FRACTIONS = [0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.85, 0.9, 0.95];

function speedLineRpms(maxShaftRpm: number): number[] {
  return [...SPEED_LINE_FRACTIONS.map((fraction) => Math.round((maxShaftRpm * fraction) / 1000) * 1000), maxShaftRpm];
}

function island(model: MapModel, level: number): EfficiencyIsland {
  const depth = model.peakEfficiency - level;
  const radiusX = Math.sqrt(depth / EFFICIENCY_FALL_X);
  const radiusN = Math.sqrt(depth / EFFICIENCY_FALL_N);
  const points: MapPoint[] = [];
  for (let step = 0; step < POINTS_PER_ISLAND; step += 1) {
    const angle = (2 * Math.PI * step) / POINTS_PER_ISLAND;
    // Parts of the ellipse outside the map are pressed onto its edges, so each island stays on the map.
    const x = clamp(model.bestX + radiusX * Math.cos(angle), 0, 1);
    const n = clamp(BEST_POINT_N + radiusN * Math.sin(angle), LOWEST_SPEED_FRACTION, 1);
    const next = model.point(x, n);
    const previous = points[points.length - 1];
    if (!previous || previous.flowLbMin !== next.flowLbMin || previous.pressureRatio !== next.pressureRatio) {
      points.push(next);
    }
  }
  const first = points[0];
  if (first) points.push({ ...first });
  return { efficiency: level, points };
}

/**
 * A deterministic, physically plausible invented compressor map for a frame's wheel, in corrected flow (lb/min at
 * 288.15 K, 101.325 kPa) and pressure ratio. The top speed line is the frame's maximum shaft speed and reaches
 * its maximum pressure ratio at surge.
 */
export function buildCompressorMap(shape: WheelShape): CompressorMap {
  const model = mapModel(shape);
  const ratings = frameRatings(shape);
  const rpms = speedLineRpms(ratings.maxShaftRpm);
  const fractions = rpms.map((rpm) => rpm / ratings.maxShaftRpm);

  const speedLines: SpeedLine[] = rpms.map((rpm, index) => {
    const n = fractions[index] ?? 1;
    const points: MapPoint[] = [];
    for (let step = 0; step < POINTS_PER_SPEED_LINE; step += 1) {
      // Denser towards choke, where the line bends over.
      const t = step / (POINTS_PER_SPEED_LINE - 1);
      points.push(model.point(1 - (1 - t) ** 2, n));
    }
    return { rpm, points };
  });

  // Rounded before de-duplicating, so a speed line's own fraction and an equal step of the grid make one point.
  const edgeFractions = [...new Set([...fractions, ...Array.from({ length: 15 }, (_, i) => LOWEST_SPEED_FRACTION + 0.05 * i)].map((n) => round(n, 9)))]
    .filter((n) => n <= 1)
    .sort((a, b) => a - b);
  const surgeLine = edgeFractions.map((n) => model.point(0, n));
  const chokeLine = edgeFractions.map((n) => model.point(1, n));

  const efficiencyIslands = ISLAND_LEVELS.filter((level) => level < model.peakEfficiency - 0.01).map((level) =>
    island(model, level),
  );

  // The work coefficient the top surge point implies, from its pressure ratio and efficiency: SURGE_WORK_COEFFICIENT
  // by construction; stored so the Euler fallback uses the same figure.
  const topTipSpeed = tipSpeedMs(shape.exducerMm, ratings.maxShaftRpm);
  const topSurge = model.point(0, 1);
  const workCoefficient =
    (CP_AIR_J_PER_KG_K * REFERENCE_TEMPERATURE_K * (topSurge.pressureRatio ** ISENTROPIC_EXPONENT - 1)) /
    model.efficiency(0, 1) /
    (topTipSpeed * topTipSpeed);

  return {
    surgeLine,
    chokeLine,
    speedLines,
    efficiencyIslands,
    maxPressureRatio: topSurge.pressureRatio,
    maxShaftRpm: ratings.maxShaftRpm,
    peakEfficiency: round(model.peakEfficiency, 4),
    workCoefficient: round(workCoefficient, 4),
    referenceTemperatureK: REFERENCE_TEMPERATURE_K,
    referencePressureKpa: REFERENCE_PRESSURE_KPA,
    wheel: shape.wheel,
    tipSpeedLimitMs: round(ratings.tipSpeedLimitMs, 1),
  };
}
