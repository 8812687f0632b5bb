import type {
  Application,
  CandidatePoint,
  FitmentCandidate,
  Layout,
  MapZone,
  TurbineHousing,
  Verdict,
} from '../schemas/fitment';
import { absoluteKpa, absoluteKpaToGaugePsi, kelvinToCelsius, lbPerMinToKgPerS } from '../units';
import { APPLICATION_DEFAULTS } from './defaults';
import { correctedFlowLbMin } from './corrected-flow';
import type { EngineModel, EngineState } from './engine';
import { engineStateAt, volumetricEfficiencyAt } from './engine';
import type { FitmentFrame } from './frame';
import { CP_AIR_J_PER_KG_K, ISENTROPIC_EXPONENT, REFERENCE_TEMPERATURE_K } from './gas';
import { correctedShaftRpmAt, efficiencyAt, flowLimitAt, mapZoneAt, surgeFlowLbMinAt } from './map-query';
import { DEFAULT_WORK_COEFFICIENT, eulerShaftRpm, tipSpeedMs } from './shaft-speed';
import { balanceTurbine, exhaustToDriveKgS, expansionRatioFor, turbinePowerW, turbineThroatAreaM2, MECHANICAL_EFFICIENCY } from './turbine';

/** Below this pressure ratio the engine barely needs a compressor at all. */
export const LITTLE_BOOST_PR = 1.1;
/** Outside the rated power band by more than this share, a frame is ruled too small or too large. */
export const BAND_TOLERANCE = 0.15;
/**
 * Graded margins: a point a little past a limit is marginal, not a cliff. Past surge by up to 4 % of flow on the
 * boost segment (8 % while spooling, where the wastegate is shut and the excursion is brief), past choke by up to
 * 3 % (choke is soft: efficiency falls away) — common practice for reading a map drawn from tests with scatter.
 */
const SURGE_GRACE = 0.04;
const SPOOL_SURGE_GRACE = 0.08;
/**
 * Flow reversal is weak at low pressure ratio: near the boost threshold a point left of the surge line is harmless
 * (common practice), so the spool allowance widens by a point of flow per 0.01 of pressure ratio below 1.4.
 */
const spoolSurgeGrace = (pr: number) => SPOOL_SURGE_GRACE + Math.max(0, 1.4 - pr);
/** Below this ratio, a spool-up point left of the surge line is noted, not held against the frame (common practice). */
const WEAK_SURGE_PR = 1.3;
const CHOKE_GRACE = 0.03;
/** Beyond the map's lowest contour, efficiency is taken as this (the map's own lowest island is 60 %). */
const OFF_MAP_EFFICIENCY = 0.55;
/** Below this at peak power the charge runs hot and the shaft works hard for little (common practice). */
const LOW_EFFICIENCY = 0.6;

const flowText = (lbMin: number) => (lbMin >= 20 ? Math.round(lbMin).toString() : (Math.round(lbMin * 10) / 10).toFixed(1));
const prText = (pr: number) => pr.toFixed(2);
const pctText = (share: number) => Math.round(share * 100).toString();
// One formatter, made once: toLocaleString builds a new one on every call, which dominated the check's time.
const WHOLE = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const rpmText = (rpm: number) => WHOLE.format(Math.round(rpm));
const shaftText = (rpm: number) => WHOLE.format(Math.round(rpm / 500) * 500);
const clamp = (value: number, low: number, high: number) => Math.min(high, Math.max(low, value));
const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;
// Helpers of assessFrame live out here: a closure made per call costs a name-keeping wrapper each time under tsx.
const atText = (p: { rpm: number }) => `at ${rpmText(p.rpm)} rpm`;
const needText = (p: { rpm: number; correctedFlowLbMin: number; pressureRatio: number }, units: number) =>
  `${atText(p)} the engine needs ${flowText(p.correctedFlowLbMin)} lb/min${units === 2 ? ' per unit' : ''} at a pressure ratio of ${prText(p.pressureRatio)}`;
function worst<T>(list: readonly T[], key: (p: T) => number): T | null {
  let found: T | null = null;
  for (const p of list) if (found === null || key(p) < key(found)) found = p;
  return found;
}

export interface AssessmentContext {
  application: Application;
  engine: EngineModel;
  /** The engine's demand at full boost: rpm and total airflow, full-boost rpm first, peak power last. */
  demand: ReadonlyArray<{ rpm: number; airflowLbMin: number; pressureRatio: number }>;
  /** A compressor efficiency the buyer stated; replaces the map's own. */
  statedEfficiency: number | null;
  fullBoostRpm: number;
}

interface Judged extends CandidatePoint {
  surgeFlowLbMin: number | null;
  limitFlowLbMin: number | null;
  state: EngineState;
}

/** A point on one unit's map: zone, margins, shaft speed and efficiency. */
function judgePoint(frame: FitmentFrame, rpm: number, state: EngineState, units: number, segment: 'spool' | 'boost', context: AssessmentContext): Judged {
  const { map } = frame;
  const { engine } = context;
  const flow = correctedFlowLbMin(state.airflowLbMin / units, engine.inletTempK, absoluteKpa(engine.inletKpa));
  const pr = Math.max(state.pressureRatio, 1);
  const lowest = map.surgeLine[0]?.pressureRatio ?? 1;
  const onMapZone = mapZoneAt(map, flow, pr);
  // Below the lowest speed line the map has no data; left of an extrapolated surge line there is nothing to judge.
  const zone: MapZone = onMapZone === 'surge' && pr < lowest ? 'below-map' : onMapZone;
  const surge = surgeFlowLbMinAt(map, pr);
  const limit = flowLimitAt(map, pr);
  const efficiency = efficiencyAt(map, flow, pr);
  const correctedRpm =
    correctedShaftRpmAt(map, flow, pr) ??
    eulerShaftRpm(pr, REFERENCE_TEMPERATURE_K, efficiency ?? OFF_MAP_EFFICIENCY, map.workCoefficient ?? DEFAULT_WORK_COEFFICIENT, frame.exducerMm);
  // Map speed lines are corrected speeds: the real shaft turns faster on a warm day.
  const estimate = correctedRpm * Math.sqrt(engine.inletTempK / (map.referenceTemperatureK ?? REFERENCE_TEMPERATURE_K));
  const shaftRpm = zone === 'choke' || (zone === 'overspeed' && estimate > 1.2 * frame.maxShaftRpm) ? null : estimate;
  return {
    rpm,
    segment,
    correctedFlowLbMin: flow,
    pressureRatio: state.pressureRatio,
    boostPsi: absoluteKpaToGaugePsi(absoluteKpa(state.manifoldKpa), engine.ambient),
    compressorOutletC: kelvinToCelsius(state.compressorOutletK),
    zone,
    surgeMarginPct: surge === null ? null : (100 * (flow - surge)) / flow,
    chokeMarginPct: limit === null ? null : (100 * (limit.flowLbMin - flow)) / limit.flowLbMin,
    shaftRpm,
    shaftSpeedPct: shaftRpm === null ? null : (100 * shaftRpm) / frame.maxShaftRpm,
    efficiency,
    surgeFlowLbMin: surge,
    limitFlowLbMin: limit?.flowLbMin ?? null,
    state,
  };
}

/**
 * The engine at full boost on this frame: its own map's efficiency sets the outlet and manifold temperatures, which
 * set the pressure ratio the engine needs, which moves the point on the map: iterate to consistency.
 */
function boostPoint(frame: FitmentFrame, units: number, demand: { rpm: number; airflowLbMin: number; pressureRatio: number }, context: AssessmentContext): EngineState {
  const { engine } = context;
  let efficiency = context.statedEfficiency ?? engine.assumedEfficiency;
  // The demand line was worked out at the assumed efficiency: start from its pressure ratio.
  let state = engineStateForFlow(engine, demand.rpm, demand.airflowLbMin, efficiency, demand.pressureRatio);
  if (context.statedEfficiency !== null) return state;
  const flow = correctedFlowLbMin(demand.airflowLbMin / units, engine.inletTempK, absoluteKpa(engine.inletKpa));
  for (let i = 0; i < 4; i += 1) {
    const next = efficiencyAt(frame.map, flow, Math.max(state.pressureRatio, 1)) ?? OFF_MAP_EFFICIENCY;
    if (Math.abs(next - efficiency) < 0.002) break;
    efficiency = next;
    state = engineStateForFlow(engine, demand.rpm, demand.airflowLbMin, efficiency, state.pressureRatio);
  }
  return state;
}

/**
 * The engine state that passes a given airflow at an rpm. Airflow is manifold pressure over manifold temperature
 * times a constant, and the temperature moves only a little with the pressure ratio: the first step scales the
 * manifold pressure by the flow still missing (fixed-point substitution, as in intercooler.ts), the later ones are
 * secant steps on the airflow error, which settle in three or four steps where substitution takes a dozen without
 * a charge cooler.
 */
function engineStateForFlow(engine: EngineModel, rpm: number, airflowLbMin: number, efficiency: number, guess = 2): EngineState {
  let pr = guess;
  let state = engineStateAt(engine, rpm, pr, efficiency);
  let previousPr = Number.NaN;
  let previousError = 0;
  for (let i = 0; i < 30; i += 1) {
    const error = state.airflowLbMin - airflowLbMin;
    let next: number;
    if (Number.isNaN(previousPr) || error === previousError) {
      const manifold = (state.manifoldKpa * airflowLbMin) / state.airflowLbMin;
      next = (manifold + engine.chargeLossKpa) / engine.inletKpa;
    } else {
      next = pr - (error * (pr - previousPr)) / (error - previousError);
    }
    next = Math.max(1, next);
    if (Math.abs(next - pr) < 1e-5) break;
    previousPr = pr;
    previousError = error;
    pr = next;
    state = engineStateAt(engine, rpm, pr, efficiency);
  }
  return state;
}

function compressorPowerW(state: EngineState, units: number, inletTempK: number): number {
  const m = lbPerMinToKgPerS(state.airflowLbMin / units);
  return (m * CP_AIR_J_PER_KG_K * inletTempK * (Math.max(state.pressureRatio, 1) ** ISENTROPIC_EXPONENT - 1)) / state.efficiency;
}

function exhaustKgS(state: EngineState, units: number, afr: number): number {
  return lbPerMinToKgPerS(state.airflowLbMin / units) * (1 + 1 / afr);
}

/** Turbine surplus power with the wastegate shut at a state, W. */
function shutSurplusW(state: EngineState, units: number, areaM2: number, engine: EngineModel): number {
  const m = exhaustKgS(state, units, engine.afr);
  const er = expansionRatioFor(m, areaM2, engine.p4Kpa, engine.t3K) ?? 8;
  return turbinePowerW(m, engine.t3K, er, engine.turbineEfficiency) * MECHANICAL_EFFICIENCY - compressorPowerW(state, units, engine.inletTempK);
}

/**
 * Lowest engine rpm at which a housing holds the target pressure ratio with the wastegate shut; null if not by peak.
 * At a fixed pressure ratio and efficiency the compressor's work per kilogram of air is fixed, and so is the
 * expansion ratio the turbine needs to match it; the housing reaches that ratio once the exhaust flow reaches what
 * it swallows there (exhaustToDriveKgS). Only the airflow changes with rpm, so the search runs on airflow alone.
 */
function fullBoostRpmFor(areaM2: number, units: number, targetPr: number, efficiency: number, engine: EngineModel): number | null {
  const atPeak = engineStateAt(engine, engine.peakRpm, targetPr, efficiency);
  const airPerExhaust = 1 / (1 + 1 / engine.afr);
  const workPerKgAir = (CP_AIR_J_PER_KG_K * engine.inletTempK * (Math.max(targetPr, 1) ** ISENTROPIC_EXPONENT - 1)) / efficiency;
  const needed = exhaustToDriveKgS((workPerKgAir * airPerExhaust) / MECHANICAL_EFFICIENCY, {
    areaM2,
    p4Kpa: engine.p4Kpa,
    t3K: engine.t3K,
    efficiency: engine.turbineEfficiency,
  });
  if (needed === null) return null;
  // Airflow at the same charge state scales with volumetric efficiency × rpm (speed density): the housing holds the
  // target from the rpm where that product reaches its share of the peak's.
  const peakExhaust = exhaustKgS(atPeak, units, engine.afr);
  if (peakExhaust < needed) return null;
  const threshold = (volumetricEfficiencyAt(engine, engine.peakRpm) * engine.peakRpm * needed) / peakExhaust;
  let lo = engine.peakRpm * 0.15;
  let hi = engine.peakRpm;
  if (volumetricEfficiencyAt(engine, lo) * lo >= threshold) return Math.round(lo);
  for (let i = 0; i < 12; i += 1) {
    const mid = (lo + hi) / 2;
    if (volumetricEfficiencyAt(engine, mid) * mid >= threshold) hi = mid;
    else lo = mid;
  }
  return Math.round(hi / 10) * 10;
}

/** The pressure ratio a housing can build at an rpm with the wastegate shut, up to the target. */
function availablePr(areaM2: number, units: number, rpm: number, targetPr: number, efficiency: number, engine: EngineModel): number {
  if (shutSurplusW(engineStateAt(engine, rpm, targetPr, efficiency), units, areaM2, engine) >= 0) return targetPr;
  let lo = 1;
  let hi = targetPr;
  for (let i = 0; i < 10; i += 1) {
    const mid = (lo + hi) / 2;
    if (shutSurplusW(engineStateAt(engine, rpm, mid, efficiency), units, areaM2, engine) >= 0) lo = mid;
    else hi = mid;
  }
  return lo;
}

interface HousingResult extends TurbineHousing {
  areaM2: number;
  lateBy: number;
}

function assessHousings(frame: FitmentFrame, units: number, peak: EngineState, targetPr: number, context: AssessmentContext): HousingResult[] {
  const { engine } = context;
  const rules = APPLICATION_DEFAULTS[context.application];
  const exhaust = exhaustKgS(peak, units, engine.afr);
  const power = compressorPowerW(peak, units, engine.inletTempK);
  const results: HousingResult[] = frame.turbineArOptions.map((ar) => {
    const areaM2 = turbineThroatAreaM2(ar, frame.turbineWheelMm);
    const balance = balanceTurbine(exhaust, power, { areaM2, p4Kpa: engine.p4Kpa, t3K: engine.t3K, efficiency: engine.turbineEfficiency });
    const fullBoostRpm = balance.reaches ? fullBoostRpmFor(areaM2, units, targetPr, peak.efficiency, engine) : null;
    const lateBy = fullBoostRpm === null ? Number.POSITIVE_INFINITY : fullBoostRpm / context.fullBoostRpm - 1;
    return {
      housingAr: ar,
      areaM2,
      fullBoostRpm,
      expansionRatio: Math.round(balance.expansionRatio * 100) / 100,
      exhaustManifoldKpa: Math.round(balance.exhaustManifoldKpa),
      backPressureRatio: Math.round((balance.exhaustManifoldKpa / peak.manifoldKpa) * 100) / 100,
      wastegateShare: Math.round(balance.wastegateShare * 100) / 100,
      recommended: false,
      note: '',
      lateBy,
    };
  });
  // The largest housing that reaches full boost by the asked rpm within the application's back-pressure limit; else
  // the one that comes closest (earliest boost, then lowest back pressure).
  const inTime = results.filter((h) => h.lateBy <= 0.02);
  const suitable = inTime.filter((h) => h.backPressureRatio <= rules.maxBackPressureRatio);
  const pick =
    suitable.at(-1) ??
    inTime.reduce<HousingResult | undefined>((best, h) => (!best || h.backPressureRatio < best.backPressureRatio ? h : best), undefined) ??
    results.reduce<HousingResult | undefined>((best, h) => (!best || h.lateBy < best.lateBy ? h : best), undefined);
  for (const h of results) {
    h.recommended = h === pick;
    const boost = h.fullBoostRpm === null ? 'never reaches full boost below peak-power rpm' : `full boost from ${rpmText(h.fullBoostRpm)} rpm`;
    const bp = `exhaust back pressure ${prText(h.backPressureRatio)} × boost pressure at peak power`;
    if (h.recommended) {
      h.note = `${boost}, ${bp}, ${pctText(h.wastegateShare)} % through the wastegate`;
    } else if (h.lateBy > 0.02) {
      h.note = `${boost}: later than the ${rpmText(context.fullBoostRpm)} rpm asked`;
    } else if (h.backPressureRatio > rules.maxBackPressureRatio) {
      h.note = `${bp}, above the ${prText(rules.maxBackPressureRatio)} that ${rules.label} use wants`;
    } else {
      h.note = `${boost}, ${bp}: a larger housing also spools in time and breathes more freely`;
    }
  }
  return results;
}

const publicHousing = ({ areaM2: _a, lateBy: _l, ...h }: HousingResult): TurbineHousing => h;

/** A frame's verdict, reasons and ranking score against the engine, as a single unit or a twin layout. */
export function assessFrame(
  frame: FitmentFrame,
  layout: Layout,
  context: AssessmentContext,
  options: { turbine?: boolean } = {},
): Omit<FitmentCandidate, 'rank'> {
  const rules = APPLICATION_DEFAULTS[context.application];
  const units = layout === 'twin' ? 2 : 1;
  const { engine } = context;
  const boostStates = context.demand.map((d) => ({ rpm: d.rpm, state: boostPoint(frame, units, d, context) }));
  const peakEntry = boostStates[boostStates.length - 1];
  const firstEntry = boostStates[0];
  if (!peakEntry || !firstEntry) throw new Error('the operating line has no points');
  const peakState = peakEntry.state;
  const targetPr = firstEntry.state.pressureRatio;

  // The turbine side only for frames whose compressor can serve: a frame ruled out on its map needs no housing.
  const [bandLow, bandHigh] = frame.powerBandHp;
  const peakFlow = correctedFlowLbMin(peakState.airflowLbMin / units, engine.inletTempK, absoluteKpa(engine.inletKpa));
  const peakEquivalent = (peakFlow * 60) / 6;
  const boostJudged = new Map(boostStates.map((b) => [b, judgePoint(frame, b.rpm, b.state, units, 'boost', context)]));
  const ruledOut =
    targetPr < LITTLE_BOOST_PR ||
    peakEquivalent > bandHigh * (1 + BAND_TOLERANCE) ||
    peakEquivalent < bandLow * (1 - BAND_TOLERANCE) ||
    [...boostJudged.values()].some((p) => {
      return (
        p.zone === 'above-max-pr' ||
        p.zone === 'overspeed' ||
        (p.zone === 'choke' && (p.chokeMarginPct ?? -100) < -100 * CHOKE_GRACE) ||
        (p.zone === 'surge' && (p.surgeMarginPct ?? -100) < -100 * SURGE_GRACE)
      );
    });
  const housings =
    frame.turbineArOptions.length > 0 && !ruledOut && options.turbine !== false ? assessHousings(frame, units, peakState, targetPr, context) : [];
  const chosen = housings.find((h) => h.recommended) ?? null;

  // The spool segment with the chosen housing: boost builds with the wastegate shut until it reaches the target.
  const spool: Array<{ rpm: number; state: EngineState }> = [];
  let boostThresholdRpm: number | null = null;
  let boostFrom = context.fullBoostRpm;
  if (chosen && chosen.fullBoostRpm !== null) {
    const area = chosen.areaM2;
    const eff = firstEntry.state.efficiency;
    const reach = chosen.fullBoostRpm;
    // Boost starts where the housing, wastegate shut, just holds a pressure ratio of 1.1.
    const hi = fullBoostRpmFor(area, units, LITTLE_BOOST_PR, eff, engine) ?? reach;
    boostThresholdRpm = Math.min(Math.round(hi / 10) * 10, reach);
    boostFrom = Math.max(reach, Math.min(context.fullBoostRpm, reach));
    for (let i = 0; i < 3; i += 1) {
      const rpm = Math.round(boostThresholdRpm + ((reach - boostThresholdRpm) * i) / 3);
      if (rpm >= reach) continue;
      spool.push({ rpm, state: engineStateAt(engine, rpm, availablePr(area, units, rpm, targetPr, eff, engine), eff) });
    }
    // Full boost arrives with this housing: from there the wastegate holds it.
    if (reach < context.fullBoostRpm - 50) spool.push({ rpm: reach, state: engineStateAt(engine, reach, targetPr, eff) });
  }
  const boostLine = boostStates.filter((b) => b.rpm >= boostFrom - 1 || b === peakEntry);
  const judged = [
    ...spool.map((s) => judgePoint(frame, s.rpm, s.state, units, s.state.pressureRatio >= targetPr - 1e-6 ? 'boost' : 'spool', context)),
    ...boostLine.map((b) => boostJudged.get(b)!),
  ];
  const peak = judged[judged.length - 1]!;

  const tooSmall: string[] = [];
  const tooLarge: string[] = [];
  const marginal: string[] = [];
  const notes: string[] = [];
  const lastNotes: string[] = [];

  if (targetPr < LITTLE_BOOST_PR) {
    tooLarge.push(`the engine makes this power with hardly any boost (pressure ratio ${prText(targetPr)}), so any turbocharger here would be larger than it needs`);
  }

  const boostPoints = judged.filter((p) => p.segment === 'boost');
  const abovePr = boostPoints.filter((p) => p.zone === 'above-max-pr');
  if (abovePr.length > 0) {
    const p = abovePr.reduce((a, b) => (b.pressureRatio > a.pressureRatio ? b : a));
    tooSmall.push(`${atText(p)} the engine needs a pressure ratio of ${prText(p.pressureRatio)}, above this frame's maximum of ${prText(frame.map.maxPressureRatio)}`);
  }
  const choke = worst(boostPoints.filter((p) => p.zone === 'choke' || p.zone === 'overspeed'), (p) => p.chokeMarginPct ?? -100);
  if (choke) {
    const past = -(choke.chokeMarginPct ?? -100) / 100;
    const limitText =
      choke.zone === 'choke'
        ? `past this frame's choke limit of ${flowText(choke.limitFlowLbMin ?? 0)} lb/min`
        : `past the ${flowText(choke.limitFlowLbMin ?? 0)} lb/min where this frame reaches its ${shaftText(frame.maxShaftRpm)} rpm shaft-speed limit`;
    (choke.zone === 'choke' && past <= CHOKE_GRACE ? marginal : tooSmall).push(`${needText(choke, units)}, ${pctText(past)} % ${limitText}`);
  }
  const surged = worst(judged.filter((p) => p.zone === 'surge'), (p) => p.surgeMarginPct ?? -100);
  if (surged) {
    const past = -(surged.surgeMarginPct ?? -100) / 100;
    const spooling = surged.segment === 'spool';
    const text = `${atText(surged)}${spooling ? ', while boost builds,' : ''} the engine flows only ${flowText(surged.correctedFlowLbMin)} lb/min${units === 2 ? ' per unit' : ''} at a pressure ratio of ${prText(surged.pressureRatio)}, ${pctText(past)} % left of this frame's surge line at ${flowText(surged.surgeFlowLbMin ?? 0)} lb/min`;
    if (spooling && surged.pressureRatio < WEAK_SURGE_PR) lastNotes.push(`${text}: brief, and weak at so low a ratio`);
    else if (past <= (spooling ? spoolSurgeGrace(surged.pressureRatio) : SURGE_GRACE)) marginal.push(`${text}: it touches surge`);
    else tooLarge.push(`${text}: the compressor would surge`);
  }

  const fastest = judged.reduce<(Judged & { shaftRpm: number }) | null>(
    (best, p) => (p.shaftRpm !== null && (best === null || p.shaftRpm > best.shaftRpm) ? { ...p, shaftRpm: p.shaftRpm } : best),
    null,
  );
  const speedMargin = fastest === null ? -0.5 : 1 - fastest.shaftRpm / frame.maxShaftRpm;
  if (fastest !== null && fastest.shaftRpm > frame.maxShaftRpm && tooSmall.length === 0) {
    const over = ((fastest.shaftRpm / frame.maxShaftRpm - 1) * 100).toFixed(1);
    tooSmall.push(`${atText(fastest)} the turbo shaft would have to turn ${rpmText(fastest.shaftRpm)} rpm, ${over} % past this frame's ${shaftText(frame.maxShaftRpm)} rpm limit`);
  }

  // The band is rated on corrected flow, as the map is read.
  const equivalent = (peak.correctedFlowLbMin * 60) / 6;
  const bandText = `the engine's corrected airflow${units === 2 ? ' per unit' : ''} matches about ${Math.round(equivalent)} hp on petrol`;
  let bandMiss = 0;
  if (equivalent > bandHigh) {
    bandMiss = equivalent / bandHigh - 1;
    (bandMiss > BAND_TOLERANCE ? tooSmall : marginal).push(`${bandText}, above this frame's rated ${bandLow}–${bandHigh} hp`);
  } else if (equivalent < bandLow) {
    bandMiss = 1 - equivalent / bandLow;
    (bandMiss > BAND_TOLERANCE ? tooLarge : marginal).push(`${bandText}, below this frame's rated ${bandLow}–${bandHigh} hp, so it will be slower to spool than a smaller frame`);
  } else {
    notes.push(`${bandText}, inside this frame's rated ${bandLow}–${bandHigh} hp`);
  }

  if (chosen && chosen.fullBoostRpm === null && targetPr >= LITTLE_BOOST_PR) {
    tooLarge.push(`even its smallest turbine housing (A/R ${chosen.housingAr.toFixed(2)}) cannot drive the compressor to full boost below ${rpmText(engine.peakRpm)} rpm`);
  }

  const inside = judged.filter((p) => p.zone === 'inside');
  const surgeLimited = worst(inside.filter((p) => p.segment === 'boost'), (p) => p.surgeMarginPct ?? 0);
  const chokeLimited = worst(inside, (p) => p.chokeMarginPct ?? 0);
  const surgeMargin = (surgeLimited?.surgeMarginPct ?? 0) / 100;
  const chokeMargin = (chokeLimited?.chokeMarginPct ?? 0) / 100;

  if (tooSmall.length === 0 && tooLarge.length === 0) {
    if (surgeLimited && surgeMargin < rules.minSurgeMargin) {
      const why = context.application === 'street' || context.application === 'offroad' ? ' for clean response as boost builds' : '';
      marginal.push(`${atText(surgeLimited)} it runs ${pctText(surgeMargin)} % from the surge line; ${rules.label} use wants at least ${pctText(rules.minSurgeMargin)} %${why}`);
    }
    if (chokeLimited && chokeMargin < rules.minChokeMargin) {
      marginal.push(`${atText(chokeLimited)} it runs within ${pctText(chokeMargin)} % of its flow limit; ${rules.label} use wants at least ${pctText(rules.minChokeMargin)} % in hand`);
    }
    if (fastest && speedMargin < rules.minShaftSpeedMargin) {
      marginal.push(
        `${atText(fastest)} the turbo shaft turns ${shaftText(fastest.shaftRpm)} rpm, ${pctText(1 - speedMargin)} % of this frame's ${shaftText(frame.maxShaftRpm)} rpm limit; ${rules.label} use keeps at least ${pctText(rules.minShaftSpeedMargin)} % in hand`,
      );
    } else if (fastest) {
      notes.push(
        `the turbo shaft peaks at ${shaftText(fastest.shaftRpm)} rpm, ${atText(fastest)} (${pctText(1 - speedMargin)} % of this frame's limit; tip speed ${Math.round(tipSpeedMs(frame.exducerMm, fastest.shaftRpm))} m/s)`,
      );
    }
    if (peak.efficiency !== null && peak.efficiency < LOW_EFFICIENCY) {
      marginal.push(`at peak power it works at only ${pctText(peak.efficiency)} % efficiency, so the charge leaves the compressor at ${Math.round(peak.compressorOutletC)} °C`);
    } else if (peak.efficiency !== null) {
      notes.push(`at peak power (${rpmText(peak.rpm)} rpm) it works at about ${pctText(peak.efficiency)} % efficiency, the charge leaving the compressor at ${Math.round(peak.compressorOutletC)} °C`);
    }
    if (chosen) {
      if (chosen.fullBoostRpm !== null && chosen.lateBy > 0.02) {
        marginal.push(
          `with its smallest suitable turbine housing (A/R ${chosen.housingAr.toFixed(2)}) full boost arrives at ${rpmText(chosen.fullBoostRpm)} rpm, later than the ${rpmText(context.fullBoostRpm)} rpm asked`,
        );
      } else if (chosen.backPressureRatio > rules.maxBackPressureRatio) {
        marginal.push(
          `with the A/R ${chosen.housingAr.toFixed(2)} turbine housing the exhaust manifold runs at ${prText(chosen.backPressureRatio)} × boost pressure at peak power; ${rules.label} use wants at most ${prText(rules.maxBackPressureRatio)}`,
        );
      } else {
        notes.push(`turbine housing A/R ${chosen.housingAr.toFixed(2)}: ${chosen.note}`);
      }
    }
    if (frame.bearingOptions.includes('ball')) notes.push(bearingNote(context.application));
    if (layout === 'twin') notes.push('two units, each taking half the engine’s air: twice the parts, and each bank needs its own oil feed and drain');
  }

  notes.push(...lastNotes);
  let verdict: Verdict;
  let reasons: string[];
  if (tooSmall.length > 0) {
    verdict = 'too-small';
    reasons = [...tooSmall, ...tooLarge];
  } else if (tooLarge.length > 0) {
    verdict = 'too-large';
    reasons = tooLarge;
  } else if (marginal.length > 0) {
    verdict = 'marginal';
    reasons = [...marginal, ...notes];
  } else {
    verdict = 'fits';
    reasons = notes;
  }

  // Ranking within a verdict: efficiency at peak power plus the margins the application cares about, capped so that a
  // frame far too large does not win on margins alone; response favours the frame working hardest; a twin costs more.
  const weights = rules.weights;
  const worstSurge = Math.min(...boostPoints.map((p) => (p.surgeMarginPct ?? -50) / 100));
  const worstChoke = Math.min(...judged.map((p) => (p.chokeMarginPct ?? -50) / 100));
  const flowUse = peak.limitFlowLbMin ? peak.correctedFlowLbMin / peak.limitFlowLbMin : 1;
  const lateness = chosen ? clamp(chosen.lateBy, 0, 0.5) : 0.5;
  const score =
    100 * weights.efficiency * (peak.efficiency ?? 0.5) +
    100 * weights.surge * clamp(worstSurge, -0.5, 0.3) +
    100 * weights.choke * clamp(worstChoke, -0.5, 0.2) +
    100 * weights.shaftSpeed * clamp(speedMargin, -0.5, 0.2) +
    30 * weights.response * clamp(flowUse, 0, 0.95) -
    40 * weights.response * lateness -
    50 * bandMiss -
    (layout === 'twin' ? 12 : 0);

  return {
    frameCode: frame.code,
    frameName: frame.name,
    layout,
    verdict,
    reasons,
    shaftRpm: fastest === null ? null : Math.round(fastest.shaftRpm),
    tipSpeedMs: fastest === null ? null : round(tipSpeedMs(frame.exducerMm, fastest.shaftRpm), 1),
    efficiency: peak.efficiency === null ? null : round(peak.efficiency, 3),
    maxShaftRpm: frame.maxShaftRpm,
    pressureRatio: round(peak.pressureRatio, 3),
    compressorOutletC: round(peak.compressorOutletC, 1),
    manifoldTempC: round(kelvinToCelsius(peak.state.manifoldTempK), 1),
    turbine: chosen ? publicHousing(chosen) : null,
    housings: housings.map(publicHousing),
    boostThresholdRpm,
    score: round(score, 2),
    points: judged.map((p) => ({
      rpm: p.rpm,
      segment: p.segment,
      correctedFlowLbMin: round(p.correctedFlowLbMin, 2),
      pressureRatio: round(p.pressureRatio, 3),
      boostPsi: round(p.boostPsi, 1),
      compressorOutletC: round(p.compressorOutletC, 1),
      zone: p.zone as MapZone,
      surgeMarginPct: p.surgeMarginPct === null ? null : round(p.surgeMarginPct, 1),
      chokeMarginPct: p.chokeMarginPct === null ? null : round(p.chokeMarginPct, 1),
      shaftRpm: p.shaftRpm === null ? null : Math.round(p.shaftRpm),
      shaftSpeedPct: p.shaftSpeedPct === null ? null : round(p.shaftSpeedPct, 1),
      efficiency: p.efficiency === null ? null : round(p.efficiency, 3),
    })),
  };
}

function bearingNote(application: Application): string {
  switch (application) {
    case 'street':
    case 'offroad':
      return 'a ball-bearing cartridge is offered: it spools sooner and answers the throttle more quickly';
    case 'drag':
      return 'a ball-bearing cartridge is offered: quicker to spool on the launch and it carries thrust loads better';
    default:
      return 'a ball-bearing cartridge is offered: it carries thrust loads better over long full-load running, given the oil supply its maker specifies';
  }
}

const VERDICT_ORDER: Record<Verdict, number> = { fits: 0, marginal: 1, 'too-small': 2, 'too-large': 2 };

/** Best first: fits, then marginal, then the rest; within each, by score; ties by frame code for stability. */
export function rankCandidates<T extends Omit<FitmentCandidate, 'rank'>>(candidates: readonly T[]): Array<T & { rank: number }> {
  return [...candidates]
    .sort((a, b) => VERDICT_ORDER[a.verdict] - VERDICT_ORDER[b.verdict] || b.score - a.score || a.frameCode.localeCompare(b.frameCode) || a.layout.localeCompare(b.layout))
    .map((candidate, index) => ({ ...candidate, rank: index + 1 }));
}

export const isUsable = (c: Pick<FitmentCandidate, 'verdict'>) => c.verdict === 'fits' || c.verdict === 'marginal';

