import type { CompressorMap, EfficiencyIsland, MapPoint, SpeedLine } from '../schemas/compressor-map';
import { CP_AIR_J_PER_KG_K, ISENTROPIC_EXPONENT, REFERENCE_TEMPERATURE_K } from './gas';
import { tipSpeedMs } from './shaft-speed';

/** What the generator needs from a frame; FrameSeed plus its maximum shaft speed satisfies it. */
export interface CompressorMapInput {
  inducerMm: number;
  exducerMm: number;
  maxFlowLbMin: number;
  maxPressureRatio: number;
  maxShaftRpm: number;
}

/**
 * The invented map is laid out in two coordinates: n = N/N_max along the speed lines' order and x ∈ [0, 1] from
 * the surge end (x = 0) to the choke end (x = 1) of each speed line. Constants are chosen so the result looks like
 * a radial compressor with a backswept wheel; they are not taken from any product.
 */
const LOWEST_SPEED_FRACTION = 0.3;
/**
 * The catalogue rates a frame's flow at its power band's top (10 hp per lb/min, in actual flow). On a warm day with
 * an intake loss the same engine needs about 5 % more corrected flow, so full choke is placed 10 % past the rated
 * flow: a band-top engine then runs just inside choke, where the low-efficiency edge of the map lies.
 */
const CHOKE_OVER_RATED_FLOW = 1.1;
/** Surge flow as a share of the speed line's choke flow: wide at low speed, narrower at the top (≈ 0.45). */
const SURGE_SHARE_LOW = 0.28;
const SURGE_SHARE_RISE = 0.17;
/** Speed lines fall by this share of their pressure rise from surge to choke, steepest at the choke end. */
const SPEED_LINE_DROP = 0.3;
const SPEED_LINE_SHAPE_EXPONENT = 3;
/** Efficiency falls off as a paraboloid in (x, n) around the best point. */
const EFFICIENCY_FALL_X = 0.4;
const EFFICIENCY_FALL_N = 0.45;
const BEST_POINT_N = 0.68;
const BEST_POINT_X = 0.38;
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
  surgePrAt(n: number): number;
  point(x: number, n: number): MapPoint;
  efficiency(x: number, n: number): number;
  peakEfficiency: number;
  bestX: number;
}

function mapModel(input: CompressorMapInput): MapModel {
  const chokeTop = input.maxFlowLbMin * CHOKE_OVER_RATED_FLOW;
  // Constant-efficiency Euler scaling: the isentropic head at surge grows with U², i.e. with n².
  const headAtTop = input.maxPressureRatio ** ISENTROPIC_EXPONENT - 1;
  const trim = (input.inducerMm / input.exducerMm) ** 2;
  // Larger wheels run at higher Reynolds number and smaller relative clearances: a few points more efficient.
  const peakEfficiency = 0.7 + 0.08 * clamp((input.exducerMm - 40) / 100, 0, 1);
  // A larger trim moves the best point towards the choke side.
  const bestX = clamp(BEST_POINT_X + (trim - 0.56), 0.25, 0.5);

  const chokeFlowAt = (n: number) => chokeTop * Math.sin((Math.PI / 2) * n);
  const surgeFlowAt = (n: number) => chokeFlowAt(n) * (SURGE_SHARE_LOW + SURGE_SHARE_RISE * n * n);
  const surgePrAt = (n: number) => (1 + headAtTop * n * n) ** (1 / ISENTROPIC_EXPONENT);
  const point = (x: number, n: number): MapPoint => {
    const flow = surgeFlowAt(n) + x * (chokeFlowAt(n) - surgeFlowAt(n));
    const pr = 1 + (surgePrAt(n) - 1) * (1 - SPEED_LINE_DROP * x ** SPEED_LINE_SHAPE_EXPONENT);
    return { flowLbMin: round(flow, 3), pressureRatio: round(pr, 4) };
  };
  const efficiency = (x: number, n: number) =>
    peakEfficiency - EFFICIENCY_FALL_X * (x - bestX) ** 2 - EFFICIENCY_FALL_N * (n - BEST_POINT_N) ** 2;
  return { chokeFlowAt, surgeFlowAt, surgePrAt, point, efficiency, peakEfficiency, bestX };
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
 * A deterministic, physically plausible invented compressor map for a frame, in corrected flow (lb/min at
 * 288.15 K, 101.325 kPa) and pressure ratio. The top speed line is the frame's maximum shaft speed and reaches
 * its maximum pressure ratio at surge.
 */
export function buildCompressorMap(input: CompressorMapInput): CompressorMap {
  const model = mapModel(input);
  const rpms = speedLineRpms(input.maxShaftRpm);
  const fractions = rpms.map((rpm) => rpm / input.maxShaftRpm);

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

  const edgeFractions = [...new Set([...fractions, ...Array.from({ length: 15 }, (_, i) => LOWEST_SPEED_FRACTION + 0.05 * i)])]
    .filter((n) => n <= 1)
    .sort((a, b) => a - b);
  const surgeLine = edgeFractions.map((n) => model.point(0, n));
  const chokeLine = edgeFractions.map((n) => model.point(1, n));

  const efficiencyIslands = ISLAND_LEVELS.filter((level) => level < model.peakEfficiency - 0.01).map((level) =>
    island(model, level),
  );

  const topTipSpeed = tipSpeedMs(input.exducerMm, input.maxShaftRpm);
  const efficiencyAtTopSurge = model.efficiency(0, 1);
  const workCoefficient =
    (CP_AIR_J_PER_KG_K * REFERENCE_TEMPERATURE_K * (input.maxPressureRatio ** ISENTROPIC_EXPONENT - 1)) /
    efficiencyAtTopSurge /
    (topTipSpeed * topTipSpeed);

  return {
    surgeLine,
    chokeLine,
    speedLines,
    efficiencyIslands,
    maxPressureRatio: input.maxPressureRatio,
    maxShaftRpm: input.maxShaftRpm,
    peakEfficiency: round(model.peakEfficiency, 4),
    workCoefficient: round(workCoefficient, 4),
  };
}
