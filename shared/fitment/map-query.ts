import type { CompressorMap, MapPoint, SpeedLine } from '../schemas/compressor-map';
import type { MapZone } from '../schemas/fitment';

/**
 * Look-ups on a compressor map as stored (plain polylines), so maps drawn from the database or edited by hand
 * answer the same questions as generated ones. Flows are corrected lb/min; speeds read off the lines are
 * corrected rpm.
 */

const lerp = (a: number, b: number, t: number) => a + (b - a) * t;

/**
 * Flow where a polyline ordered by rising pressure ratio reaches `pr`. Below its first point the surge line runs
 * on to (0, 1); the choke line is taken as vertical, since a limit of zero flow would mean nothing.
 */
function flowOnRisingLine(line: readonly MapPoint[], pr: number, below: 'to-origin' | 'vertical'): number | null {
  const first = line[0];
  if (!first) return null;
  if (pr <= first.pressureRatio) {
    if (below === 'vertical' || first.pressureRatio <= 1) return first.flowLbMin;
    return (first.flowLbMin * Math.max(pr - 1, 0)) / (first.pressureRatio - 1);
  }
  for (let index = 1; index < line.length; index += 1) {
    const a = line[index - 1];
    const b = line[index];
    if (!a || !b) continue;
    if (pr <= b.pressureRatio) {
      const span = b.pressureRatio - a.pressureRatio;
      return span <= 0 ? b.flowLbMin : lerp(a.flowLbMin, b.flowLbMin, (pr - a.pressureRatio) / span);
    }
  }
  return null;
}

/** Flow where a speed line (surge end first, pressure ratio falling) passes `pr`; below its choke end it is vertical. */
function flowOnSpeedLine(line: SpeedLine, pr: number): number | null {
  const first = line.points[0];
  const last = line.points[line.points.length - 1];
  if (!first || !last) return null;
  if (pr > first.pressureRatio) return null;
  if (pr <= last.pressureRatio) return last.flowLbMin;
  for (let index = 1; index < line.points.length; index += 1) {
    const a = line.points[index - 1];
    const b = line.points[index];
    if (!a || !b) continue;
    if (pr >= b.pressureRatio) {
      const span = a.pressureRatio - b.pressureRatio;
      return span <= 0 ? b.flowLbMin : lerp(a.flowLbMin, b.flowLbMin, (a.pressureRatio - pr) / span);
    }
  }
  return last.flowLbMin;
}

/** Surge flow at a pressure ratio; null above the map. */
export function surgeFlowLbMinAt(map: CompressorMap, pr: number): number | null {
  if (pr > map.maxPressureRatio) return null;
  return flowOnRisingLine(map.surgeLine, Math.max(pr, 1), 'to-origin');
}

export interface FlowLimit {
  flowLbMin: number;
  /** Choke below the top of the choke line; above it, the top speed line (the shaft-speed limit). */
  limitedBy: 'choke' | 'max-speed';
}

/** The largest flow the map allows at a pressure ratio; null above the map. */
export function flowLimitAt(map: CompressorMap, pr: number): FlowLimit | null {
  if (pr > map.maxPressureRatio) return null;
  const ratio = Math.max(pr, 1);
  const chokeTop = map.chokeLine[map.chokeLine.length - 1];
  if (!chokeTop || ratio <= chokeTop.pressureRatio) {
    const flow = flowOnRisingLine(map.chokeLine, ratio, 'vertical');
    return flow === null ? null : { flowLbMin: flow, limitedBy: 'choke' };
  }
  const topLine = map.speedLines[map.speedLines.length - 1];
  const onTop = topLine ? flowOnSpeedLine(topLine, ratio) : null;
  if (onTop !== null) return { flowLbMin: onTop, limitedBy: 'max-speed' };
  // No speed lines: join the top of the choke line straight to the top of the surge line.
  const surgeTop = map.surgeLine[map.surgeLine.length - 1];
  if (!surgeTop || surgeTop.pressureRatio <= chokeTop.pressureRatio) return null;
  const t = (ratio - chokeTop.pressureRatio) / (surgeTop.pressureRatio - chokeTop.pressureRatio);
  return t > 1 ? null : { flowLbMin: lerp(chokeTop.flowLbMin, surgeTop.flowLbMin, t), limitedBy: 'max-speed' };
}

export function mapZoneAt(map: CompressorMap, flowLbMin: number, pr: number): MapZone {
  const surge = surgeFlowLbMinAt(map, pr);
  const limit = flowLimitAt(map, pr);
  if (surge === null || limit === null) return 'above-max-pr';
  if (flowLbMin < surge) return 'surge';
  if (flowLbMin > limit.flowLbMin) return limit.limitedBy === 'choke' ? 'choke' : 'overspeed';
  return 'inside';
}

/**
 * Corrected shaft speed at a map point, interpolated in flow between the speed lines at that pressure ratio.
 * Beyond the top line it scales with flow; null where the lines cannot say (no lines, or below the
 * lowest line at a low ratio), and the caller falls back to the Euler relation.
 */
export function correctedShaftRpmAt(map: CompressorMap, flowLbMin: number, pr: number): number | null {
  if (map.speedLines.length < 2) return null;
  const anchors: Array<{ flowLbMin: number; rpm: number; atSurge: boolean }> = [];
  let unreached: SpeedLine | undefined;
  for (const line of map.speedLines) {
    const flow = flowOnSpeedLine(line, pr);
    if (flow === null) {
      unreached = line;
      continue;
    }
    const below = unreached?.points[0];
    const here = line.points[0];
    if (anchors.length === 0 && unreached && below && here && here.pressureRatio > below.pressureRatio) {
      // Between two lines' surge ends: the speed at which the surge line crosses this ratio.
      const t = (pr - below.pressureRatio) / (here.pressureRatio - below.pressureRatio);
      const surgeFlow = surgeFlowLbMinAt(map, pr) ?? lerp(below.flowLbMin, here.flowLbMin, t);
      anchors.push({ flowLbMin: surgeFlow, rpm: lerp(unreached.rpm, line.rpm, t), atSurge: true });
    }
    anchors.push({ flowLbMin: flow, rpm: line.rpm, atSurge: false });
  }
  const first = anchors[0];
  if (!first) return null;
  if (flowLbMin <= first.flowLbMin) return first.atSurge ? first.rpm : null;
  for (let index = 1; index < anchors.length; index += 1) {
    const a = anchors[index - 1];
    const b = anchors[index];
    if (!a || !b) continue;
    if (flowLbMin <= b.flowLbMin) {
      const span = b.flowLbMin - a.flowLbMin;
      return span <= 0 ? b.rpm : lerp(a.rpm, b.rpm, (flowLbMin - a.flowLbMin) / span);
    }
  }
  // Past the top line: scale speed with flow at this ratio. Near choke the lines bunch together and a slope
  // between them would run away; the point is off the map either way, this only says by roughly how much.
  const last = anchors[anchors.length - 1];
  if (!last || last.flowLbMin <= 0) return null;
  return (last.rpm * flowLbMin) / last.flowLbMin;
}

interface NormalisedPoint {
  u: number;
  v: number;
}

function normaliser(map: CompressorMap) {
  const maxFlow = Math.max(...map.chokeLine.map((point) => point.flowLbMin), 1e-9);
  const prSpan = Math.max(map.maxPressureRatio - 1, 1e-9);
  return (point: MapPoint): NormalisedPoint => ({ u: point.flowLbMin / maxFlow, v: (point.pressureRatio - 1) / prSpan });
}

function isInside(polygon: readonly NormalisedPoint[], p: NormalisedPoint): boolean {
  let inside = false;
  for (let i = 0, j = polygon.length - 1; i < polygon.length; j = i, i += 1) {
    const a = polygon[i];
    const b = polygon[j];
    if (!a || !b) continue;
    if (a.v > p.v !== b.v > p.v && p.u < ((b.u - a.u) * (p.v - a.v)) / (b.v - a.v) + a.u) inside = !inside;
  }
  return inside;
}

function distanceToBoundary(polygon: readonly NormalisedPoint[], p: NormalisedPoint): number {
  let best = Number.POSITIVE_INFINITY;
  for (let index = 1; index < polygon.length; index += 1) {
    const a = polygon[index - 1];
    const b = polygon[index];
    if (!a || !b) continue;
    const du = b.u - a.u;
    const dv = b.v - a.v;
    const lengthSquared = du * du + dv * dv;
    const t = lengthSquared === 0 ? 0 : Math.min(1, Math.max(0, ((p.u - a.u) * du + (p.v - a.v) * dv) / lengthSquared));
    best = Math.min(best, Math.hypot(p.u - (a.u + t * du), p.v - (a.v + t * dv)));
  }
  return best;
}

interface NormalisedIslands {
  normalise: (point: MapPoint) => NormalisedPoint;
  islands: Array<{ efficiency: number; polygon: NormalisedPoint[] }>;
}

// Maps are plain data and are not changed once loaded, so their normalised islands are worth keeping.
const islandCache = new WeakMap<CompressorMap, NormalisedIslands>();

function normalisedIslands(map: CompressorMap): NormalisedIslands {
  const cached = islandCache.get(map);
  if (cached) return cached;
  const normalise = normaliser(map);
  const built = {
    normalise,
    islands: map.efficiencyIslands.map((island) => ({ efficiency: island.efficiency, polygon: island.points.map(normalise) })),
  };
  islandCache.set(map, built);
  return built;
}

/** Below the lowest island, efficiency is taken to fall 4 points per this normalised distance. */
const OUTER_FALL_DISTANCE = 0.08;
const OUTER_FALL_POINTS = 0.04;

/**
 * Isentropic efficiency at a map point, interpolated between the islands by distance to their contours; null
 * off the map (surge, choke, overspeed or above the maximum pressure ratio). Read through a table per map
 * (efficiencyGrid), since the contour distances are the costly part of a fitment check.
 */
export function efficiencyAt(map: CompressorMap, flowLbMin: number, pr: number): number | null {
  if (mapZoneAt(map, flowLbMin, pr) !== 'inside') return null;
  const grid = efficiencyGrid(map);
  const gu = (flowLbMin / grid.maxFlow) * GRID_STEPS;
  const gv = ((Math.max(pr, 1) - 1) / grid.prSpan) * GRID_STEPS;
  const i = Math.min(GRID_STEPS - 1, Math.max(0, Math.floor(gu)));
  const j = Math.min(GRID_STEPS - 1, Math.max(0, Math.floor(gv)));
  // Corners of the cell in the table (row-major, GRID_STEPS + 1 a side). Plain index arithmetic: this runs hundreds
  // of times per check.
  const c00 = i * (GRID_STEPS + 1) + j;
  const c10 = c00 + GRID_STEPS + 1;
  // Next to the map's edge a cell reaches off the map, where the table means nothing: read the contours directly.
  if (!grid.inside[c00] || !grid.inside[c10] || !grid.inside[c00 + 1] || !grid.inside[c10 + 1]) {
    return contourEfficiency(map, flowLbMin, pr);
  }
  const fu = Math.min(1, Math.max(0, gu - i));
  const fv = Math.min(1, Math.max(0, gv - j));
  const v = grid.values;
  return v[c00]! * (1 - fu) * (1 - fv) + v[c10]! * fu * (1 - fv) + v[c00 + 1]! * (1 - fu) * fv + v[c10 + 1]! * fu * fv;
}

/** 64 steps a side; cells that touch the map's edge are read from the contours (tests/unit/fitment-map.test.ts). */
const GRID_STEPS = 64;
const gridCache = new WeakMap<CompressorMap, { maxFlow: number; prSpan: number; values: Float64Array; inside: Uint8Array }>();

function efficiencyGrid(map: CompressorMap) {
  const cached = gridCache.get(map);
  if (cached) return cached;
  const maxFlow = Math.max(...map.chokeLine.map((point) => point.flowLbMin), 1e-9);
  const prSpan = Math.max(map.maxPressureRatio - 1, 1e-9);
  const values = new Float64Array((GRID_STEPS + 1) * (GRID_STEPS + 1));
  const inside = new Uint8Array((GRID_STEPS + 1) * (GRID_STEPS + 1));
  for (let a = 0; a <= GRID_STEPS; a += 1) {
    for (let b = 0; b <= GRID_STEPS; b += 1) {
      const flow = (a / GRID_STEPS) * maxFlow;
      const ratio = 1 + (b / GRID_STEPS) * prSpan;
      values[a * (GRID_STEPS + 1) + b] = contourEfficiency(map, flow, ratio);
      inside[a * (GRID_STEPS + 1) + b] = mapZoneAt(map, flow, ratio) === 'inside' ? 1 : 0;
    }
  }
  const built = { maxFlow, prSpan, values, inside };
  gridCache.set(map, built);
  return built;
}

/** The contour interpolation itself, defined anywhere on the plane. */
export function contourEfficiency(map: CompressorMap, flowLbMin: number, pr: number): number {
  const { normalise, islands } = normalisedIslands(map);
  const p = normalise({ flowLbMin, pressureRatio: Math.max(pr, 1) });
  let innermost = -1;
  for (let index = 0; index < islands.length; index += 1) {
    if (isInside(islands[index]!.polygon, p)) innermost = index;
  }
  const outer = islands[0];
  if (!outer) return map.peakEfficiency ?? 0.7;
  if (innermost < 0) {
    const distance = distanceToBoundary(outer.polygon, p);
    return outer.efficiency - OUTER_FALL_POINTS * Math.min(1, distance / OUTER_FALL_DISTANCE);
  }
  const containing = islands[innermost];
  if (!containing) return outer.efficiency;
  const inner = islands[innermost + 1];
  const toOwn = distanceToBoundary(containing.polygon, p);
  if (inner) {
    const toInner = distanceToBoundary(inner.polygon, p);
    return containing.efficiency + ((inner.efficiency - containing.efficiency) * toOwn) / (toOwn + toInner || 1);
  }
  const peak = map.peakEfficiency ?? containing.efficiency + 0.01;
  const centre = containing.polygon.reduce(
    (sum, point) => ({ u: sum.u + point.u / containing.polygon.length, v: sum.v + point.v / containing.polygon.length }),
    { u: 0, v: 0 },
  );
  const toCentre = Math.hypot(p.u - centre.u, p.v - centre.v);
  return containing.efficiency + ((peak - containing.efficiency) * toOwn) / (toOwn + toCentre || 1);
}
