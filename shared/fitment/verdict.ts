import type { Application, CandidatePoint, FitmentCandidate, OperatingPoint, Verdict } from '../schemas/fitment';
import { APPLICATION_DEFAULTS } from './defaults';
import type { FitmentFrame } from './frame';
import { REFERENCE_TEMPERATURE_K } from './gas';
import { correctedShaftRpmAt, efficiencyAt, flowLimitAt, mapZoneAt, surgeFlowLbMinAt } from './map-query';
import { DEFAULT_WORK_COEFFICIENT, eulerShaftRpm, tipSpeedMs } from './shaft-speed';

export interface AssessmentContext {
  application: Application;
  inletTempK: number;
  /** Used for the Euler relation where the map's speed lines cannot place a point. */
  compressorEfficiency: number;
  petrolEquivalentHp: number;
}

/** Below this pressure ratio the engine barely needs a compressor at all. */
const LITTLE_BOOST_PR = 1.1;
/** Outside the rated power band by more than this share, a frame is ruled too small or too large. */
const BAND_TOLERANCE = 0.15;

const flowText = (lbMin: number) => (lbMin >= 20 ? Math.round(lbMin).toString() : (Math.round(lbMin * 10) / 10).toFixed(1));
const prText = (pr: number) => pr.toFixed(2);
const pctText = (share: number) => Math.round(share * 100).toString();
const engineRpmText = (rpm: number) => Math.round(rpm).toString();
function shaftRpmText(rpm: number): string {
  const rounded = Math.round(rpm / 500) * 500;
  return rounded.toString().replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

interface PointAssessment extends CandidatePoint {
  correctedFlowLbMin: number;
  pressureRatio: number;
  surgeFlowLbMin: number | null;
  limitFlowLbMin: number | null;
}

function assessPoint(frame: FitmentFrame, point: OperatingPoint, context: AssessmentContext): PointAssessment {
  const { map } = frame;
  const flow = point.correctedFlowLbMin;
  const pr = Math.max(point.pressureRatio, 1);
  const zone = mapZoneAt(map, flow, pr);
  const surge = surgeFlowLbMinAt(map, pr);
  const limit = flowLimitAt(map, pr);
  const efficiency = efficiencyAt(map, flow, pr);
  const speedCorrection = Math.sqrt(context.inletTempK / REFERENCE_TEMPERATURE_K);
  // Map speed lines are corrected speeds: the real shaft turns faster on a warm day.
  const correctedRpm =
    correctedShaftRpmAt(map, flow, pr) ??
    eulerShaftRpm(
      pr,
      REFERENCE_TEMPERATURE_K,
      efficiency ?? context.compressorEfficiency,
      map.workCoefficient ?? DEFAULT_WORK_COEFFICIENT,
      frame.exducerMm,
    );
  // Past choke no shaft speed delivers the flow, and far past the top speed line the extrapolation means
  // nothing; a number there would only mislead.
  const estimate = correctedRpm * speedCorrection;
  const shaftRpm = zone === 'choke' || (zone === 'overspeed' && estimate > 1.2 * frame.maxShaftRpm) ? null : estimate;
  return {
    rpm: point.rpm,
    zone,
    surgeMarginPct: surge === null ? null : (100 * (flow - surge)) / flow,
    chokeMarginPct: limit === null ? null : (100 * (limit.flowLbMin - flow)) / limit.flowLbMin,
    shaftRpm,
    shaftSpeedPct: shaftRpm === null ? null : (100 * shaftRpm) / frame.maxShaftRpm,
    efficiency,
    correctedFlowLbMin: flow,
    pressureRatio: point.pressureRatio,
    surgeFlowLbMin: surge,
    limitFlowLbMin: limit?.flowLbMin ?? null,
  };
}

function offMapReason(frame: FitmentFrame, point: PointAssessment): string | null {
  const at = `at ${engineRpmText(point.rpm)} rpm the engine needs ${flowText(point.correctedFlowLbMin)} lb/min at a pressure ratio of ${prText(point.pressureRatio)}`;
  switch (point.zone) {
    case 'above-max-pr':
      return `at ${engineRpmText(point.rpm)} rpm the engine needs a pressure ratio of ${prText(point.pressureRatio)}, above this frame's maximum of ${prText(frame.map.maxPressureRatio)}`;
    case 'choke':
      return `${at}, past this frame's choke limit of ${flowText(point.limitFlowLbMin ?? 0)} lb/min`;
    case 'overspeed':
      return `${at}; at that ratio this frame reaches its ${shaftRpmText(frame.maxShaftRpm)} rpm shaft-speed limit at ${flowText(point.limitFlowLbMin ?? 0)} lb/min`;
    case 'surge':
      return `at ${engineRpmText(point.rpm)} rpm the engine flows only ${flowText(point.correctedFlowLbMin)} lb/min at a pressure ratio of ${prText(point.pressureRatio)}, left of this frame's surge line at ${flowText(point.surgeFlowLbMin ?? 0)} lb/min: the compressor would surge`;
    default:
      return null;
  }
}

function bearingNote(frame: FitmentFrame, application: Application): string | null {
  if (!frame.bearingOptions.includes('ball')) return null;
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

const OFF_MAP_ZONES = ['above-max-pr', 'overspeed', 'choke', 'surge'] as const;

const clamp = (value: number, low: number, high: number) => Math.min(high, Math.max(low, value));

/** A frame's verdict, reasons and ranking score against the engine's operating line. */
export function assessFrame(
  frame: FitmentFrame,
  line: readonly OperatingPoint[],
  context: AssessmentContext,
): Omit<FitmentCandidate, 'rank'> {
  const rules = APPLICATION_DEFAULTS[context.application];
  const points = line.map((point) => assessPoint(frame, point, context));
  const peak = points[points.length - 1];
  const first = points[0];
  if (!peak || !first) throw new Error('the operating line has no points');

  const tooSmall: string[] = [];
  const tooLarge: string[] = [];
  const marginal: string[] = [];
  const notes: string[] = [];

  const highestPr = Math.max(...points.map((point) => point.pressureRatio));
  if (highestPr < LITTLE_BOOST_PR) {
    tooLarge.push(
      `the engine makes this power with hardly any boost (pressure ratio ${prText(highestPr)}), so any turbocharger here would be larger than it needs`,
    );
  }

  // One reason per way off the map, told at its worst point, so the list stays readable.
  for (const zone of OFF_MAP_ZONES) {
    const inZone = points.filter((point) => point.zone === zone);
    const worst = inZone.reduce<PointAssessment | null>((found, point) => {
      if (found === null) return point;
      if (zone === 'above-max-pr') return point.pressureRatio > found.pressureRatio ? point : found;
      const key = (candidate: PointAssessment) =>
        (zone === 'surge' ? candidate.surgeMarginPct : candidate.chokeMarginPct) ?? Number.NEGATIVE_INFINITY;
      return key(point) < key(found) ? point : found;
    }, null);
    const reason = worst ? offMapReason(frame, worst) : null;
    if (!worst || reason === null) continue;
    const rpms = inZone.map((point) => point.rpm);
    const spread =
      inZone.length > 1
        ? ` (${inZone.length} of the ${points.length} points on the line, ${engineRpmText(Math.min(...rpms))}–${engineRpmText(Math.max(...rpms))} rpm)`
        : '';
    (zone === 'surge' ? tooLarge : tooSmall).push(reason + spread);
  }

  const fastest = points.reduce<(PointAssessment & { shaftRpm: number }) | null>(
    (best, point) =>
      point.shaftRpm !== null && (best === null || point.shaftRpm > best.shaftRpm) ? { ...point, shaftRpm: point.shaftRpm } : best,
    null,
  );
  const speedMargin = fastest === null ? -0.5 : 1 - fastest.shaftRpm / frame.maxShaftRpm;
  if (fastest !== null && fastest.shaftRpm > frame.maxShaftRpm && tooSmall.length === 0) {
    tooSmall.push(
      `at ${engineRpmText(fastest.rpm)} rpm the turbo shaft would have to turn ${shaftRpmText(fastest.shaftRpm)} rpm, past this frame's ${shaftRpmText(frame.maxShaftRpm)} rpm limit`,
    );
  }

  const [bandLow, bandHigh] = frame.powerBandHp;
  const equivalent = context.petrolEquivalentHp;
  const bandText = `the engine's airflow matches about ${Math.round(equivalent)} hp on petrol`;
  let bandMiss = 0;
  if (equivalent > bandHigh) {
    bandMiss = equivalent / bandHigh - 1;
    const text = `${bandText}, above this frame's rated ${bandLow}–${bandHigh} hp`;
    (bandMiss > BAND_TOLERANCE ? tooSmall : marginal).push(text);
  } else if (equivalent < bandLow) {
    bandMiss = 1 - equivalent / bandLow;
    const text = `${bandText}, below this frame's rated ${bandLow}–${bandHigh} hp, so it will be slower to spool than a smaller frame`;
    (bandMiss > BAND_TOLERANCE ? tooLarge : marginal).push(text);
  } else {
    notes.push(`${bandText}, inside this frame's rated ${bandLow}–${bandHigh} hp`);
  }

  const onMap = points.filter((point) => point.zone === 'inside');
  const surgeLimited = onMap.reduce<PointAssessment | null>(
    (worst, point) => (worst === null || (point.surgeMarginPct ?? 0) < (worst.surgeMarginPct ?? 0) ? point : worst),
    null,
  );
  const chokeLimited = onMap.reduce<PointAssessment | null>(
    (worst, point) => (worst === null || (point.chokeMarginPct ?? 0) < (worst.chokeMarginPct ?? 0) ? point : worst),
    null,
  );
  const surgeMargin = (surgeLimited?.surgeMarginPct ?? 0) / 100;
  const chokeMargin = (chokeLimited?.chokeMarginPct ?? 0) / 100;

  if (tooSmall.length === 0 && tooLarge.length === 0) {
    if (surgeLimited && surgeMargin < rules.minSurgeMargin) {
      const why = context.application === 'street' || context.application === 'offroad' ? ' for clean response as boost builds' : '';
      marginal.push(
        `at ${engineRpmText(surgeLimited.rpm)} rpm it runs ${pctText(surgeMargin)} % from the surge line; ${rules.label} use wants at least ${pctText(rules.minSurgeMargin)} %${why}`,
      );
    }
    if (chokeLimited && chokeMargin < rules.minChokeMargin) {
      marginal.push(
        `at ${engineRpmText(chokeLimited.rpm)} rpm it runs within ${pctText(chokeMargin)} % of its flow limit; ${rules.label} use wants at least ${pctText(rules.minChokeMargin)} % in hand`,
      );
    }
    // Every point is on the map here, so each has a shaft speed.
    if (fastest && speedMargin < rules.minShaftSpeedMargin) {
      marginal.push(
        `at ${engineRpmText(fastest.rpm)} rpm the turbo shaft turns ${shaftRpmText(fastest.shaftRpm)} rpm, ${pctText(1 - speedMargin)} % of this frame's ${shaftRpmText(frame.maxShaftRpm)} rpm limit; ${rules.label} use keeps at least ${pctText(rules.minShaftSpeedMargin)} % in hand`,
      );
    } else if (fastest) {
      notes.push(
        `the turbo shaft peaks at ${shaftRpmText(fastest.shaftRpm)} rpm, at ${engineRpmText(fastest.rpm)} engine rpm (${pctText(1 - speedMargin)} % of this frame's limit; tip speed ${Math.round(tipSpeedMs(frame.exducerMm, fastest.shaftRpm))} m/s)`,
      );
    }
    if (surgeLimited && surgeMargin >= rules.minSurgeMargin) {
      notes.push(`at ${engineRpmText(first.rpm)} rpm, where full boost arrives, it keeps ${pctText((first.surgeMarginPct ?? 0) / 100)} % from surge`);
    }
    if (peak.efficiency !== null) {
      notes.push(`at peak power (${engineRpmText(peak.rpm)} rpm) it works at about ${pctText(peak.efficiency)} % efficiency`);
    }
    const bearing = bearingNote(frame, context.application);
    if (bearing) notes.push(bearing);
  }

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

  // Ranking within a verdict: efficiency at peak power plus the margins the application cares about, capped so
  // that a frame far too large does not win on margins alone; response favours the frame working hardest.
  const weights = rules.weights;
  const worstSurge = Math.min(...points.map((point) => (point.surgeMarginPct ?? -50) / 100));
  const worstChoke = Math.min(...points.map((point) => (point.chokeMarginPct ?? -50) / 100));
  const flowUse = peak.limitFlowLbMin ? peak.correctedFlowLbMin / peak.limitFlowLbMin : 1;
  const score =
    100 * weights.efficiency * (peak.efficiency ?? 0.5) +
    100 * weights.surge * clamp(worstSurge, -0.5, 0.3) +
    100 * weights.choke * clamp(worstChoke, -0.5, 0.2) +
    100 * weights.shaftSpeed * clamp(speedMargin, -0.5, 0.2) +
    30 * weights.response * clamp(flowUse, 0, 0.95) -
    50 * bandMiss;

  return {
    frameCode: frame.code,
    frameName: frame.name,
    verdict,
    reasons,
    shaftRpm: fastest === null ? null : Math.round(fastest.shaftRpm),
    tipSpeedMs: fastest === null ? null : Math.round(tipSpeedMs(frame.exducerMm, fastest.shaftRpm) * 10) / 10,
    efficiency: peak.efficiency === null ? null : Math.round(peak.efficiency * 1000) / 1000,
    maxShaftRpm: frame.maxShaftRpm,
    score: Math.round(score * 100) / 100,
    points: points.map((point) => ({
      rpm: point.rpm,
      zone: point.zone,
      surgeMarginPct: point.surgeMarginPct === null ? null : Math.round(point.surgeMarginPct * 10) / 10,
      chokeMarginPct: point.chokeMarginPct === null ? null : Math.round(point.chokeMarginPct * 10) / 10,
      shaftRpm: point.shaftRpm === null ? null : Math.round(point.shaftRpm),
      shaftSpeedPct: point.shaftSpeedPct === null ? null : Math.round(point.shaftSpeedPct * 10) / 10,
      efficiency: point.efficiency === null ? null : Math.round(point.efficiency * 1000) / 1000,
    })),
  };
}

const VERDICT_ORDER: Record<Verdict, number> = { fits: 0, marginal: 1, 'too-small': 2, 'too-large': 2 };

/** Best first: fits, then marginal, then the rest; within each, by score; ties by frame code for stability. */
export function rankCandidates<T extends Omit<FitmentCandidate, 'rank'>>(candidates: readonly T[]): Array<T & { rank: number }> {
  return [...candidates]
    .sort(
      (a, b) =>
        VERDICT_ORDER[a.verdict] - VERDICT_ORDER[b.verdict] || b.score - a.score || a.frameCode.localeCompare(b.frameCode),
    )
    .map((candidate, index) => ({ ...candidate, rank: index + 1 }));
}
