import type { CompressorMap } from '../schemas/compressor-map';
import type { FitmentAssumptions } from '../schemas/fitment';
import type {
  ExcursionKind,
  ShaftLogExcursion,
  ShaftLogPoint,
  ShaftLogRow,
  ShaftLogSummary,
  SpeedState,
  SurgeState,
} from '../schemas/shaft-logs';
import { absoluteKpa, celsiusToKelvin, kgPerSToLbPerMin, type AbsoluteKpa } from '../units';
import { isaPressureKpa } from './atmosphere';
import { correctedFlowLbMin } from './corrected-flow';
import { manifoldPressureKpaFourStroke } from './manifold-pressure';
import { surgeFlowLbMinAt } from './map-query';
import { compressorInletKpa, pressureRatio } from './pressure-ratio';

/**
 * A logged row is near surge when its corrected flow is within this share of the surge line's flow at the same
 * pressure ratio, measured as (W − W_surge)/W like a check's surge margin. 10 % is the least margin a street or
 * circuit check asks for, so a log that dips inside it has run where the check would not have placed the engine.
 */
export const NEAR_SURGE_MARGIN_PCT = 10;
/** Shaft speed above this share of the frame's limit is near the limit. */
export const NEAR_LIMIT_PCT = 95;
/**
 * A row stands for the time halfway to each neighbour, at most this much either side, so a pause in logging is
 * not counted as time spent in a state.
 */
export const MAX_HALF_GAP_S = 1;
/** Excursions listed in a summary; the rest are counted. */
export const EXCURSIONS_LISTED = 50;

/** What the computation needs of the engine: the resolved assumptions of the saved check. */
export type ShaftLogEngine = Pick<
  FitmentAssumptions,
  'displacementL' | 'volumetricEfficiency' | 'altitudeM' | 'ambientC' | 'chargeLossPsi' | 'inletLossPsi'
>;

/** What it needs of the frame the log was taken on. */
export interface ShaftLogFrame {
  maxShaftRpm: number;
  map: CompressorMap;
}

interface Conditions {
  ambient: AbsoluteKpa;
  inlet: AbsoluteKpa;
  inletTempK: number;
}

function conditionsOf(engine: ShaftLogEngine): Conditions {
  const ambient = isaPressureKpa(engine.altitudeM);
  return { ambient, inlet: compressorInletKpa(ambient, engine.inletLossPsi), inletTempK: celsiusToKelvin(engine.ambientC) };
}

/**
 * Speed-density: the four-stroke relation MAP = 2·ṁ·R·T / (VE·V_d·N/60) is linear in ṁ, so the flow is the
 * measured MAP over the MAP that 1 kg/s would give at the same rpm and temperature.
 */
function speedDensityKgS(manifold: AbsoluteKpa, manifoldTempK: number, engine: ShaftLogEngine, rpm: number): number {
  if (rpm <= 0) return 0;
  const perKgS = manifoldPressureKpaFourStroke({
    airflowKgS: 1,
    manifoldTempK,
    volumetricEfficiency: engine.volumetricEfficiency,
    displacementL: engine.displacementL,
    rpm,
  });
  return manifold / perKgS;
}

function speedState(shaftSpeedPct: number): SpeedState {
  if (shaftSpeedPct > 100) return 'overspeed';
  if (shaftSpeedPct > NEAR_LIMIT_PCT) return 'near-limit';
  return 'ok';
}

function pointAt(row: ShaftLogRow, engine: ShaftLogEngine, frame: ShaftLogFrame, at: Conditions): ShaftLogPoint {
  const manifold = absoluteKpa(at.ambient + row.boostKpa);
  const pr = pressureRatio(manifold, at.ambient, engine.chargeLossPsi, engine.inletLossPsi);
  // The logged intake temperature is the charge air in the manifold, where speed-density reads it; the
  // compressor's own inlet sees the ambient air of the check.
  const airflowLbMin = kgPerSToLbPerMin(speedDensityKgS(manifold, celsiusToKelvin(row.intakeC), engine, row.engineRpm));
  const corrected = correctedFlowLbMin(airflowLbMin, at.inletTempK, at.inlet);
  const shaftSpeedPct = (100 * row.shaftRpm) / frame.maxShaftRpm;

  let surgeFlow: number | null = null;
  let surgeMarginPct: number | null = null;
  let surge: SurgeState = 'clear';
  // Off boost (vacuum or none in the manifold) the throttle, not the compressor, sets the flow: nothing to surge.
  // The check's charge-side loss would otherwise put a ratio above 1 on a row with no boost at all.
  if (pr > 1 && row.boostKpa > 0) {
    surgeFlow = surgeFlowLbMinAt(frame.map, pr);
    if (surgeFlow === null) {
      surge = 'above-map';
    } else if (corrected > 0) {
      surgeMarginPct = (100 * (corrected - surgeFlow)) / corrected;
      surge = surgeMarginPct < 0 ? 'surge' : surgeMarginPct < NEAR_SURGE_MARGIN_PCT ? 'near-surge' : 'clear';
    } else if (surgeFlow > 0) {
      // Boost with no engine flow at all: the compressor is dead-headed.
      surge = 'surge';
    }
  }

  return {
    ...row,
    manifoldKpa: manifold,
    pressureRatio: pr,
    airflowLbMin,
    correctedFlowLbMin: corrected,
    shaftSpeedPct,
    surgeFlowLbMin: surgeFlow,
    surgeMarginPct,
    speed: speedState(shaftSpeedPct),
    surge,
  };
}

/** One logged row on the frame's map. */
export function shaftLogPoint(row: ShaftLogRow, engine: ShaftLogEngine, frame: ShaftLogFrame): ShaftLogPoint {
  return pointAt(row, engine, frame, conditionsOf(engine));
}

/** Every logged row on the frame's map, in log order. */
export function shaftLogPoints(rows: readonly ShaftLogRow[], engine: ShaftLogEngine, frame: ShaftLogFrame): ShaftLogPoint[] {
  const at = conditionsOf(engine);
  return rows.map((row) => pointAt(row, engine, frame, at));
}

/** The time each row stands for (see MAX_HALF_GAP_S); together they make the logged time. */
export function rowDurationsS(times: readonly number[]): number[] {
  return times.map((t, i) => {
    const before = i > 0 ? Math.min((t - (times[i - 1] ?? t)) / 2, MAX_HALF_GAP_S) : 0;
    const after = i < times.length - 1 ? Math.min(((times[i + 1] ?? t) - t) / 2, MAX_HALF_GAP_S) : 0;
    return before + after;
  });
}

type Dimension = 'speed' | 'surge' | 'above-map';

function dimensionKind(point: ShaftLogPoint, dimension: Dimension): ExcursionKind | null {
  if (dimension === 'speed') return point.speed === 'ok' ? null : point.speed;
  if (dimension === 'surge') return point.surge === 'surge' || point.surge === 'near-surge' ? point.surge : null;
  return point.surge === 'above-map' ? 'above-map' : null;
}

const SEVERITY: Record<ExcursionKind, number> = { overspeed: 2, 'near-limit': 1, surge: 2, 'near-surge': 1, 'above-map': 1 };

/** How bad a row is within its dimension; larger is worse. */
function badness(point: ShaftLogPoint, dimension: Dimension): number {
  if (dimension === 'speed') return point.shaftSpeedPct;
  if (dimension === 'surge') return point.surgeMarginPct === null ? Number.POSITIVE_INFINITY : -point.surgeMarginPct;
  return point.pressureRatio;
}

function excursionsOf(points: readonly ShaftLogPoint[], durations: readonly number[]): ShaftLogExcursion[] {
  const found: ShaftLogExcursion[] = [];
  for (const dimension of ['speed', 'surge', 'above-map'] as const) {
    let run: { kind: ExcursionKind; first: number; last: number; worst: number; durationS: number } | null = null;
    const close = () => {
      if (!run) return;
      const first = points[run.first];
      const last = points[run.last];
      const worst = points[run.worst];
      if (first && last && worst) {
        found.push({
          kind: run.kind,
          fromS: first.t,
          toS: last.t,
          durationS: run.durationS,
          points: run.last - run.first + 1,
          worstAtS: worst.t,
          shaftSpeedPct: worst.shaftSpeedPct,
          surgeMarginPct: worst.surgeMarginPct,
        });
      }
      run = null;
    };
    points.forEach((point, index) => {
      const kind = dimensionKind(point, dimension);
      if (kind === null) {
        close();
        return;
      }
      const duration = durations[index] ?? 0;
      if (!run) {
        run = { kind, first: index, last: index, worst: index, durationS: duration };
        return;
      }
      run.last = index;
      run.durationS += duration;
      if (SEVERITY[kind] > SEVERITY[run.kind]) run.kind = kind;
      const worst = points[run.worst];
      if (worst && badness(point, dimension) > badness(worst, dimension)) run.worst = index;
    });
    close();
  }
  return found.sort((a, b) => a.fromS - b.fromS || SEVERITY[b.kind] - SEVERITY[a.kind]);
}

/** Peak shaft speed against the limit, time near or past each limit, and the excursions, for a log's points. */
export function summariseShaftLog(points: readonly ShaftLogPoint[], frame: ShaftLogFrame): ShaftLogSummary {
  const durations = rowDurationsS(points.map((p) => p.t));
  const timeWhere = (test: (p: ShaftLogPoint) => boolean) => points.reduce((sum, p, i) => (test(p) ? sum + (durations[i] ?? 0) : sum), 0);
  const peak = points.reduce<ShaftLogPoint | null>((best, p) => (best === null || p.shaftRpm > best.shaftRpm ? p : best), null);
  const margins = points.map((p) => p.surgeMarginPct).filter((m): m is number => m !== null);
  const excursions = excursionsOf(points, durations);
  const first = points[0];
  const last = points[points.length - 1];
  return {
    points: points.length,
    durationS: first && last ? last.t - first.t : 0,
    maxShaftRpm: frame.maxShaftRpm,
    peakShaftRpm: peak?.shaftRpm ?? 0,
    peakShaftSpeedPct: peak?.shaftSpeedPct ?? 0,
    peakAtS: peak?.t ?? 0,
    timeOverSpeedS: timeWhere((p) => p.speed === 'overspeed'),
    timeNearLimitS: timeWhere((p) => p.speed === 'near-limit'),
    timeNearOrInSurgeS: timeWhere((p) => p.surge === 'near-surge' || p.surge === 'surge'),
    timeInSurgeS: timeWhere((p) => p.surge === 'surge'),
    timeAboveMapS: timeWhere((p) => p.surge === 'above-map'),
    leastSurgeMarginPct: margins.length > 0 ? Math.min(...margins) : null,
    pointsBelowMap: points.filter((p) => p.pressureRatio < 1).length,
    nearSurgeMarginPct: NEAR_SURGE_MARGIN_PCT,
    nearLimitPct: NEAR_LIMIT_PCT,
    excursions: excursions.slice(0, EXCURSIONS_LISTED),
    moreExcursions: Math.max(0, excursions.length - EXCURSIONS_LISTED),
  };
}

/** A log on a frame's map: every point flagged, and the summary. */
export function analyseShaftLog(
  rows: readonly ShaftLogRow[],
  engine: ShaftLogEngine,
  frame: ShaftLogFrame,
): { points: ShaftLogPoint[]; summary: ShaftLogSummary } {
  const points = shaftLogPoints(rows, engine, frame);
  return { points, summary: summariseShaftLog(points, frame) };
}
