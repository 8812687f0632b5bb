import { R_AIR_J_PER_KG_K, GAMMA_AIR, REFERENCE_PRESSURE_KPA, REFERENCE_TEMPERATURE_K } from './gas';
import { eulerPressureRatio, shaftRpmForTipSpeed } from './shaft-speed';

/**
 * One physical model for the whole frame family, so that every frame's ratings follow from its wheel sizes and
 * wheel material rather than from numbers picked one by one:
 * - flow capacity from the inducer area (choke at a fixed inducer Mach number, isentropic flow relations);
 * - shaft-speed limit from the compressor wheel's material (a tip-speed limit);
 * - pressure ratio from tip speed through the Euler work equation, Δh₀ = μ·U², with one work coefficient μ for
 *   the family and the efficiency the frame's own map gives at that point (Dixon & Hall, "Fluid Mechanics and
 *   Thermodynamics of Turbomachinery", ch. 7, centrifugal compressors; the relation is standard, values from memory).
 */

export const WHEEL_MATERIALS = ['cast', 'milled'] as const;
export type WheelMaterial = (typeof WHEEL_MATERIALS)[number];

/**
 * Compressor-wheel tip-speed limits for a long fatigue life, m/s: cast aluminium about 500–540, forged and machined
 * ("milled", billet) aluminium about 560–600 (common practice, figures from memory; cast wheels carry porosity and
 * lower fatigue strength). The family takes 520 and 590.
 */
export const TIP_SPEED_LIMIT_MS: Record<WheelMaterial, number> = { cast: 520, milled: 590 };

/**
 * Work coefficient μ = Δh₀/U² at the surge end of a speed line, for a backswept wheel including slip. Dixon & Hall
 * (from memory) put σ·(1 − φ₂·tan β₂) at about 0.6–0.75 for turbocharger wheels; the family uses 0.74.
 */
export const SURGE_WORK_COEFFICIENT = 0.74;
export const WORK_COEFFICIENT_BAND = [0.6, 0.75] as const;

/** Hub diameter as a share of the inducer (tip) diameter (common practice 0.25–0.35). */
export const INDUCER_HUB_TIP_RATIO = 0.3;
/** Axial Mach number at the inducer when the wheel chokes (common practice, about 0.5–0.6; from memory). */
export const CHOKE_INDUCER_MACH = 0.55;
/** The catalogue rates a frame's flow a little inside choke, where the map's efficiency has not yet collapsed. */
export const CHOKE_OVER_RATED_FLOW = 1.1;
/** About 10 hp per lb/min of air on petrol (common practice), the basis of every power band. */
export const HP_PER_LB_MIN = 10;
/** The bottom of a band, as a share of its top: the frame still spools usefully there (common practice). */
export const BAND_BOTTOM_SHARE = 0.5;

const KG_S_TO_LB_MIN = 60 / 0.45359237;

/**
 * Choked mass flux through the inducer's annulus at reference inlet conditions, kg/(s·m²) of the inducer's full
 * disc: ρ₀·a₀·M·(1 + (γ−1)/2·M²)^(−(γ+1)/(2(γ−1)))·(1 − ν²), the isentropic mass-flow relation (any gas
 * dynamics text, e.g. Anderson, "Modern Compressible Flow", ch. 5).
 */
export function chokeMassFluxKgSM2(): number {
  const rho0 = (REFERENCE_PRESSURE_KPA * 1000) / (R_AIR_J_PER_KG_K * REFERENCE_TEMPERATURE_K);
  const a0 = Math.sqrt(GAMMA_AIR * R_AIR_J_PER_KG_K * REFERENCE_TEMPERATURE_K);
  const m = CHOKE_INDUCER_MACH;
  const flowFunction = m * (1 + ((GAMMA_AIR - 1) / 2) * m * m) ** (-(GAMMA_AIR + 1) / (2 * (GAMMA_AIR - 1)));
  return rho0 * a0 * flowFunction * (1 - INDUCER_HUB_TIP_RATIO ** 2);
}

export const inducerAreaM2 = (inducerMm: number) => (Math.PI / 4) * (inducerMm / 1000) ** 2;

/** Corrected choke flow at the top speed line, lb/min at 288.15 K and 101.325 kPa. */
export function chokeFlowLbMin(inducerMm: number): number {
  return chokeMassFluxKgSM2() * inducerAreaM2(inducerMm) * KG_S_TO_LB_MIN;
}

export interface WheelShape {
  inducerMm: number;
  exducerMm: number;
  wheel: WheelMaterial;
}

/**
 * The map's efficiency surface in map coordinates: n = N/N_max and x from the surge end (0) to the choke end (1)
 * of a speed line. A paraboloid around the best point; larger wheels are a few points better (Reynolds number and
 * relative clearances), larger trims put the best point nearer choke. Shapes invented, in the usual ranges.
 */
export const EFFICIENCY_FALL_X = 0.4;
export const EFFICIENCY_FALL_N = 0.45;
export const BEST_POINT_N = 0.68;
const BEST_POINT_X = 0.38;

const clamp = (value: number, low: number, high: number) => Math.min(high, Math.max(low, value));

/**
 * Best total-to-total efficiency of a wheel: about 0.75 for a small modern wheel up to 0.78 for a large one (common
 * practice for current backswept designs; from memory).
 */
export function peakEfficiency(exducerMm: number): number {
  return 0.75 + 0.03 * clamp((exducerMm - 40) / 100, 0, 1);
}

export function bestPointX(shape: WheelShape): number {
  const trim = (shape.inducerMm / shape.exducerMm) ** 2;
  return clamp(BEST_POINT_X + (trim - 0.56), 0.25, 0.5);
}

export function efficiencyOnMap(shape: WheelShape, x: number, n: number): number {
  return peakEfficiency(shape.exducerMm) - EFFICIENCY_FALL_X * (x - bestPointX(shape)) ** 2 - EFFICIENCY_FALL_N * (n - BEST_POINT_N) ** 2;
}

export function maxShaftRpmFor(shape: Pick<WheelShape, 'exducerMm' | 'wheel'>): number {
  return Math.round(shaftRpmForTipSpeed(shape.exducerMm, TIP_SPEED_LIMIT_MS[shape.wheel]) / 500) * 500;
}

export function tipSpeedLimitMs(shape: Pick<WheelShape, 'exducerMm' | 'wheel'>): number {
  return (Math.PI * (shape.exducerMm / 1000) * maxShaftRpmFor(shape)) / 60;
}

/** Pressure ratio at the surge end of the speed line at n = N/N_max: Euler work at the map's own efficiency there. */
export function surgePressureRatio(shape: WheelShape, n: number): number {
  return eulerPressureRatio(n * tipSpeedLimitMs(shape), REFERENCE_TEMPERATURE_K, efficiencyOnMap(shape, 0, n), SURGE_WORK_COEFFICIENT);
}

export interface FrameRatings {
  maxShaftRpm: number;
  tipSpeedLimitMs: number;
  chokeFlowLbMin: number;
  /** Rated (catalogue) flow, lb/min: the top of the power band at 10 hp per lb/min. */
  maxFlowLbMin: number;
  maxPressureRatio: number;
  powerBandHp: [number, number];
}

const roundTo = (value: number, step: number) => Math.round(value / step) * step;

/** Everything the catalogue states about a frame's compressor, from its wheel. */
export function frameRatings(shape: WheelShape): FrameRatings {
  const choke = chokeFlowLbMin(shape.inducerMm);
  const rated = Math.round((choke / CHOKE_OVER_RATED_FLOW) * 10) / 10;
  const top = roundTo(rated * HP_PER_LB_MIN, 10);
  return {
    maxShaftRpm: maxShaftRpmFor(shape),
    tipSpeedLimitMs: tipSpeedLimitMs(shape),
    chokeFlowLbMin: choke,
    maxFlowLbMin: rated,
    maxPressureRatio: Math.round(surgePressureRatio(shape, 1) * 100) / 100,
    powerBandHp: [roundTo(top * BAND_BOTTOM_SHARE, 10), top],
  };
}
