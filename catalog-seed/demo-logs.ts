import { ISENTROPIC_EXPONENT, REFERENCE_TEMPERATURE_K } from '../shared/fitment/gas';
import { correctedShaftRpmAt, surgeFlowLbMinAt } from '../shared/fitment/map-query';
import { shaftLogPoint, type ShaftLogEngine, type ShaftLogFrame } from '../shared/fitment/shaft-log';
import type { OperatingPoint } from '../shared/schemas/fitment';
import type { BoostUnit, ShaftLogRow } from '../shared/schemas/shaft-logs';
import { formatShaftLogCsv } from '../shared/shaft-log-csv';
import { celsiusToKelvin, psiToKpa } from '../shared/units';

/**
 * Invented shaft-speed logs for the demo and the sample download: a part-throttle cruise, full throttle spooling up
 * through a pull, a shift, a second pull, then a lift-off with the clutch in, when the revs fall faster than the
 * charge pipe empties and the compressor runs briefly near its surge line, and back to a cruise. One variant
 * touches past the shaft-speed limit on a boost spike at the top of the second pull.
 *
 * The logs are made to suit the engine and frame they are for: boost follows the check's predicted operating
 * line, shaft speed is read off the frame's own speed lines at each row's map point, and the lift-off is aimed at
 * the frame's surge line. Maps will change; the events stay where they are meant to be. Deterministic for a seed.
 */

export interface DemoLogOptions {
  engine: ShaftLogEngine;
  /** Charge-air temperature the check settled on at full load, °C. */
  chargeAirC: number;
  frame: ShaftLogFrame;
  /** The check's predicted line on this engine, full boost first, peak power last. */
  operatingLine: ReadonlyArray<Pick<OperatingPoint, 'rpm' | 'boostPsi'>>;
  seed?: number;
  /** A boost spike at the top of the second pull takes the shaft just past its limit. */
  overspeedTouch?: boolean;
  /** Samples per second. */
  hz?: number;
}

/** A small seeded generator (mulberry32): the same seed gives the same log on every machine. */
function randomSource(seed: number) {
  let state = seed >>> 0;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let x = state;
    x = Math.imul(x ^ (x >>> 15), x | 1);
    x ^= x + Math.imul(x ^ (x >>> 7), x | 61);
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296;
  };
  /** Roughly normal noise of this spread (the sum of three uniforms). */
  return (spread: number) => ((next() + next() + next()) / 3 - 0.5) * 2 * spread;
}

const clamp = (value: number, low: number, high: number) => Math.min(high, Math.max(low, value));
const lerp = (a: number, b: number, t: number) => a + (b - a) * t;
const smoothstep = (t: number) => {
  const x = clamp(t, 0, 1);
  return x * x * (3 - 2 * x);
};

/** Part-throttle manifold vacuum, kPa gauge. */
const CRUISE_VACUUM_KPA = -45;
/**
 * Surge margins of the lift-off: the revs fall until the first is reached (about 5 %, inside the near-surge band
 * and clear of the line), then one sample each as boost collapses and the point moves away.
 */
const LIFT_MARGINS = [0.05, 0.048, 0.055, 0.09, 0.15, 0.24, 0.35];
/** The least surge margin the spool-up keeps. */
const SPOOL_MARGIN = 0.14;
/** How fast the revs may fall with the clutch in, as a share of peak-power rpm per second. */
const LIFT_RPM_PER_S = 0.7;
const LIFT_MAX_SAMPLES = 14;
/** Shaft speed as a share of the limit during the boost spike, one per sample. */
const SPIKE_SHARES = [0.975, 0.992, 1.006, 1.017, 1.011, 0.99];

export function demoShaftLogRows(options: DemoLogOptions): ShaftLogRow[] {
  const { engine, frame, operatingLine } = options;
  const first = operatingLine[0];
  const last = operatingLine[operatingLine.length - 1];
  if (!first || !last) throw new Error('a demo log needs the check’s operating line');
  const noise = randomSource(options.seed ?? 1);
  const dt = 1 / (options.hz ?? 10);
  const peakRpm = last.rpm;
  const fullBoostRpm = first.rpm;
  const cruiseRpm = Math.round((0.36 * peakRpm) / 10) * 10;
  const inletTempK = celsiusToKelvin(engine.ambientC);
  const lineBoostKpa = (rpm: number) => {
    if (rpm <= first.rpm) return psiToKpa(first.boostPsi);
    for (let i = 1; i < operatingLine.length; i += 1) {
      const a = operatingLine[i - 1];
      const b = operatingLine[i];
      if (a && b && rpm <= b.rpm) return psiToKpa(lerp(a.boostPsi, b.boostPsi, (rpm - a.rpm) / (b.rpm - a.rpm || 1)));
    }
    return psiToKpa(last.boostPsi);
  };
  const peakBoostKpa = Math.max(...operatingLine.map((p) => psiToKpa(p.boostPsi)), 1);

  const rows: ShaftLogRow[] = [];
  let t = 0;
  let intakeC = engine.ambientC + 8;
  let shaft = frame.maxShaftRpm * 0.14;

  /** Below the lowest speed line the head still grows with the square of the wheel speed (Euler): scale from it. */
  const lowest = frame.map.speedLines[0];
  const lowestPr = lowest?.points[0]?.pressureRatio ?? 1;
  const belowLowestLine = (pr: number) =>
    lowest && lowestPr > 1 ? lowest.rpm * Math.sqrt(Math.max(pr ** ISENTROPIC_EXPONENT - 1, 0) / (lowestPr ** ISENTROPIC_EXPONENT - 1)) : null;

  /**
   * The most boost this rpm can carry and keep the given surge margin: a matched turbo builds boost no faster than
   * its compressor flows. Stepped up from vacuum, since the margin need not fall steadily with boost.
   */
  const boostForMargin = (rpm: number, margin: number) => {
    const step = 0.5;
    let boostKpa = CRUISE_VACUUM_KPA;
    while (boostKpa < peakBoostKpa * 1.2) {
      const p = shaftLogPoint({ t, engineRpm: rpm, boostKpa: boostKpa + step, shaftRpm: 0, intakeC }, engine, frame);
      if (p.surgeMarginPct !== null && p.surgeMarginPct / 100 < margin) break;
      boostKpa += step;
    }
    return boostKpa;
  };

  /** Reads the shaft speed off the map at this row's point; the wheel spins up at once but runs down slowly. */
  const shaftFor = (rpm: number, boostKpa: number, iat: number) => {
    const point = shaftLogPoint({ t, engineRpm: rpm, boostKpa, shaftRpm: 0, intakeC: iat }, engine, frame);
    const pr = point.pressureRatio;
    const corrected = pr > 1 ? (correctedShaftRpmAt(frame.map, point.correctedFlowLbMin, pr) ?? belowLowestLine(pr)) : null;
    const fromMap = corrected === null ? 0 : corrected * Math.sqrt(inletTempK / REFERENCE_TEMPERATURE_K);
    // Off boost the exhaust still turns the wheel, more so at higher engine speed.
    const idling = frame.maxShaftRpm * (0.06 + 0.22 * (rpm / peakRpm));
    const wanted = Math.max(fromMap, idling);
    return wanted >= shaft ? wanted : shaft + (wanted - shaft) * (1 - Math.exp(-dt / 0.45));
  };

  const push = (rpm: number, boostKpa: number, shaftOverride?: number) => {
    // Charge air warms towards the check's full-load temperature as boost builds, and cools slowly after.
    const load = clamp(boostKpa / peakBoostKpa, 0, 1);
    intakeC += (lerp(engine.ambientC + 8, options.chargeAirC, load) - intakeC) * (1 - Math.exp(-dt / 3.5));
    const engineRpm = Math.max(0, rpm + noise(12));
    const boost = boostKpa + noise(0.8);
    shaft = shaftOverride ?? shaftFor(engineRpm, boost, intakeC);
    rows.push({
      t: Math.round(t * 100) / 100,
      engineRpm: Math.round(engineRpm),
      boostKpa: Math.round(boost * 10) / 10,
      shaftRpm: Math.round((shaft * (1 + noise(0.002))) / 10) * 10,
      intakeC: Math.round((intakeC + noise(0.2)) * 10) / 10,
    });
    t += dt;
  };
  const steps = (seconds: number) => Math.round(seconds / dt);

  // Cruise at part throttle.
  for (let i = 0; i < steps(2); i += 1) push(cruiseRpm, CRUISE_VACUUM_KPA);

  // First pull: full throttle from cruise revs; boost builds as the engine reaches full-boost rpm.
  const pullTop = peakRpm * 1.02;
  const firstPull = steps(6.5);
  let rpm = cruiseRpm;
  for (let i = 1; i <= firstPull; i += 1) {
    rpm = lerp(cruiseRpm, pullTop, i / firstPull);
    const spool = smoothstep((rpm - cruiseRpm) / Math.max(fullBoostRpm - cruiseRpm, 1));
    // The wastegate opens a little late: boost creeps past its setting just as it arrives.
    const creep = 0.06 * Math.exp(-(((rpm - fullBoostRpm) / (0.06 * peakRpm)) ** 2));
    push(rpm, Math.min(lerp(CRUISE_VACUUM_KPA, lineBoostKpa(rpm) * (1 + creep), spool), boostForMargin(rpm, SPOOL_MARGIN)));
  }

  // The shift: clutch in, revs drop to the next gear, the blow-off valve vents most of the boost.
  const shiftRpm = peakRpm * 0.72;
  const held = lineBoostKpa(pullTop);
  const shift = steps(0.4);
  for (let i = 1; i <= shift; i += 1) {
    rpm = lerp(pullTop, shiftRpm, smoothstep(i / shift));
    push(rpm, held * (0.3 + 0.7 * Math.exp(-(i * dt) / 0.12)));
  }

  // Second pull: the wheel is still spinning, so boost comes back at once.
  const secondPull = steps(4.5);
  const spikeFrom = options.overspeedTouch ? Math.round(secondPull * 0.82) : Number.POSITIVE_INFINITY;
  for (let i = 1; i <= secondPull; i += 1) {
    rpm = lerp(shiftRpm, peakRpm * 1.03, i / secondPull);
    const recovered = 0.3 + 0.7 * (1 - Math.exp(-(i * dt) / 0.35));
    const spike = i - spikeFrom;
    const share = spike >= 0 ? SPIKE_SHARES[spike] : undefined;
    if (share !== undefined) {
      // A boost spike (a sticking wastegate) at the top of the pull.
      push(rpm, lineBoostKpa(rpm) * (1 + 0.1 * Math.sin((Math.PI * (spike + 1)) / (SPIKE_SHARES.length + 1))), frame.maxShaftRpm * share);
    } else {
      push(rpm, lineBoostKpa(rpm) * recovered);
    }
  }

  // Lift-off with the clutch in: the revs fall fast while the charge pipe holds its pressure for a moment, so the
  // flow through the compressor falls towards its surge line at nearly the same pressure ratio. Then the blow-off
  // valve opens, boost collapses and the clutch comes back in, which carries the point away from the line.
  let boost = lineBoostKpa(rpm);
  const maxStep = LIFT_RPM_PER_S * peakRpm * dt;
  /** The engine speed that puts this row at the given surge margin (flow is proportional to rpm at a given boost). */
  const rpmForMargin = (margin: number) => {
    const probe = shaftLogPoint({ t, engineRpm: rpm, boostKpa: boost, shaftRpm: 0, intakeC }, engine, frame);
    const surge = surgeFlowLbMinAt(frame.map, probe.pressureRatio);
    if (surge === null || probe.correctedFlowLbMin <= 0 || probe.pressureRatio <= 1) return rpm;
    return (rpm * surge) / (1 - margin) / probe.correctedFlowLbMin;
  };
  for (let k = 0; k < LIFT_MAX_SAMPLES; k += 1) {
    boost *= 0.985;
    const wanted = rpmForMargin(LIFT_MARGINS[0] ?? 0.05);
    const next = Math.max(wanted, rpm - maxStep, 0.28 * peakRpm);
    const reached = next <= wanted + 1;
    rpm = next;
    push(rpm, boost);
    if (reached) break;
  }
  for (const margin of LIFT_MARGINS.slice(1)) {
    boost = margin < 0.08 ? boost * 0.985 : lerp(CRUISE_VACUUM_KPA, boost, Math.exp(-dt / 0.15));
    rpm = clamp(rpmForMargin(margin), rpm, rpm + maxStep);
    push(rpm, boost);
  }

  // The throttle stays shut: boost falls to vacuum and the revs settle back to a cruise.
  const settle = steps(3.5);
  const fromRpm = rpm;
  for (let i = 1; i <= settle; i += 1) {
    boost = lerp(CRUISE_VACUUM_KPA, boost, Math.exp(-dt / 0.15));
    rpm = lerp(cruiseRpm, fromRpm, Math.exp(-(i * dt) / 0.6));
    push(rpm, boost);
  }
  return rows;
}

/** A demo log as the file a logger would give, boost in the unit asked for. */
export function demoShaftLogCsv(options: DemoLogOptions & { boostUnit?: BoostUnit; comments?: string[] }): string {
  return formatShaftLogCsv(demoShaftLogRows(options), options.boostUnit ?? 'kpa', options.comments ?? []);
}
