import { ISENTROPIC_EXPONENT } from './gas';

/** T2 = T1 + T1·(PR^((γ−1)/γ) − 1)/η: the isentropic rise divided by the compressor's isentropic efficiency. */
export function compressorOutletTempK(inletTempK: number, pressureRatio: number, isentropicEfficiency: number): number {
  return inletTempK + (inletTempK * (pressureRatio ** ISENTROPIC_EXPONENT - 1)) / isentropicEfficiency;
}
