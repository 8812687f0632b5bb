import { lbPerMinToKgPerS, type AbsoluteKpa } from '../units';
import { compressorOutletTempK } from './compressor-outlet';
import { manifoldPressureKpaFourStroke } from './manifold-pressure';
import { pressureRatio } from './pressure-ratio';

/** ε = (T_hot,in − T_hot,out)/(T_hot,in − T_coolant,in), so T_out = T2 − ε·(T2 − T_coolant). */
export function intercoolerOutletTempK(compressorOutletK: number, coolantK: number, effectiveness: number): number {
  return compressorOutletK - effectiveness * (compressorOutletK - coolantK);
}

export interface ChargeStateInput {
  airflowLbMin: number;
  displacementL: number;
  rpm: number;
  volumetricEfficiency: number;
  ambient: AbsoluteKpa;
  inletTempK: number;
  chargeLossPsi: number;
  inletLossPsi: number;
  compressorEfficiency: number;
  /** A manifold temperature the user gave; skips the iteration. */
  manifoldTempK?: number;
  /** 0 without a charge cooler: the manifold then sees the compressor outlet temperature. */
  intercoolerEffectiveness: number;
}

export interface ChargeState {
  manifold: AbsoluteKpa;
  pressureRatio: number;
  compressorOutletK: number;
  manifoldTempK: number;
  iterations: number;
}

const MAX_ITERATIONS = 100;
const TOLERANCE_K = 1e-9;

/** Manifold pressure, pressure ratio and compressor outlet at a manifold temperature. */
function chargeStateAt(input: ChargeStateInput, airflowKgS: number, manifoldTempK: number) {
  const manifold = manifoldPressureKpaFourStroke({
    airflowKgS,
    manifoldTempK,
    volumetricEfficiency: input.volumetricEfficiency,
    displacementL: input.displacementL,
    rpm: input.rpm,
  });
  const pr = pressureRatio(manifold, input.ambient, input.chargeLossPsi, input.inletLossPsi);
  // Below a ratio of 1 the compressor is not compressing; do not let the formula cool the charge.
  const compressorOutletK = compressorOutletTempK(input.inletTempK, Math.max(pr, 1), input.compressorEfficiency);
  return { manifold, pressureRatio: pr, compressorOutletK };
}

/**
 * Manifold temperature sets MAP, MAP sets the pressure ratio, the pressure ratio sets the compressor outlet and
 * so the manifold temperature: iterate to the fixed point. The map is a contraction (factor ≈ 0.1 with a cooler,
 * ≈ 0.4 without), so plain substitution settles in a handful of steps.
 */
export function solveChargeState(input: ChargeStateInput): ChargeState {
  const airflowKgS = lbPerMinToKgPerS(input.airflowLbMin);

  if (input.manifoldTempK !== undefined) {
    return { ...chargeStateAt(input, airflowKgS, input.manifoldTempK), manifoldTempK: input.manifoldTempK, iterations: 0 };
  }

  let manifoldTempK = input.inletTempK;
  for (let iteration = 1; iteration <= MAX_ITERATIONS; iteration += 1) {
    const state = chargeStateAt(input, airflowKgS, manifoldTempK);
    const next = intercoolerOutletTempK(state.compressorOutletK, input.inletTempK, input.intercoolerEffectiveness);
    const converged = Math.abs(next - manifoldTempK) < TOLERANCE_K;
    manifoldTempK = next;
    if (converged) return { ...chargeStateAt(input, airflowKgS, manifoldTempK), manifoldTempK, iterations: iteration };
  }
  return { ...chargeStateAt(input, airflowKgS, manifoldTempK), manifoldTempK, iterations: MAX_ITERATIONS };
}
