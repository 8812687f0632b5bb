import { CP_AIR_J_PER_KG_K, ISENTROPIC_EXPONENT } from './gas';

/** U = π·D·N/60, m/s. */
export function tipSpeedMs(wheelDiameterMm: number, shaftRpm: number): number {
  return (Math.PI * (wheelDiameterMm / 1000) * shaftRpm) / 60;
}

/** N = 60·U/(π·D), rpm. */
export function shaftRpmForTipSpeed(wheelDiameterMm: number, tipSpeed: number): number {
  return (60 * tipSpeed) / (Math.PI * (wheelDiameterMm / 1000));
}

/**
 * Typical Δh₀/U² for a backswept turbocharger wheel including slip (common practice 0.6–0.75); used when a map
 * carries no speed lines and no coefficient of its own.
 */
export const DEFAULT_WORK_COEFFICIENT = 0.7;

/**
 * Euler work relation: the actual work Δh₀ = μ·U² (μ: slip factor × power-input factor, or an overall work
 * coefficient) must equal cp·T1·(PR^((γ−1)/γ) − 1)/η. Solved for the tip speed a pressure ratio needs.
 */
export function eulerTipSpeedMs(
  pressureRatio: number,
  inletTempK: number,
  isentropicEfficiency: number,
  workCoefficient: number,
): number {
  const actualWorkJPerKg = (CP_AIR_J_PER_KG_K * inletTempK * (pressureRatio ** ISENTROPIC_EXPONENT - 1)) / isentropicEfficiency;
  return Math.sqrt(Math.max(actualWorkJPerKg, 0) / workCoefficient);
}

/** The pressure ratio a tip speed gives by the same relation. */
export function eulerPressureRatio(
  tipSpeed: number,
  inletTempK: number,
  isentropicEfficiency: number,
  workCoefficient: number,
): number {
  const actualWorkJPerKg = workCoefficient * tipSpeed * tipSpeed;
  return (1 + (isentropicEfficiency * actualWorkJPerKg) / (CP_AIR_J_PER_KG_K * inletTempK)) ** (1 / ISENTROPIC_EXPONENT);
}

/** Shaft speed for a pressure ratio by the Euler relation, rpm. */
export function eulerShaftRpm(
  pressureRatio: number,
  inletTempK: number,
  isentropicEfficiency: number,
  workCoefficient: number,
  wheelDiameterMm: number,
): number {
  return shaftRpmForTipSpeed(wheelDiameterMm, eulerTipSpeedMs(pressureRatio, inletTempK, isentropicEfficiency, workCoefficient));
}
