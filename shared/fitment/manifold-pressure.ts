import { absoluteKpa, litresToCubicMetres, type AbsoluteKpa } from '../units';
import { R_AIR_J_PER_KG_K } from './gas';

export interface ManifoldPressureInput {
  airflowKgS: number;
  manifoldTempK: number;
  /** Volumetric efficiency referred to manifold conditions (Heywood §2.10). */
  volumetricEfficiency: number;
  displacementL: number;
  rpm: number;
}

/** Four-stroke: each cylinder breathes once per two revolutions, so MAP = 2·ṁ·R·T / (VE·V_d·N/60). */
export function manifoldPressureKpaFourStroke(input: ManifoldPressureInput): AbsoluteKpa {
  const { airflowKgS, manifoldTempK, volumetricEfficiency, displacementL, rpm } = input;
  const sweptM3PerS = volumetricEfficiency * litresToCubicMetres(displacementL) * (rpm / 60);
  return absoluteKpa((2 * airflowKgS * R_AIR_J_PER_KG_K * manifoldTempK) / sweptM3PerS / 1000);
}
