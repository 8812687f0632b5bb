import type { AbsoluteKpa } from '../units';
import { REFERENCE_PRESSURE_KPA, REFERENCE_TEMPERATURE_K } from './gas';

/** Wc = W·√(T1/288.15 K) / (p1/101.325 kPa): the flow the same compressor point would pass at reference inlet. */
export function correctedFlowLbMin(airflowLbMin: number, inletTempK: number, inletPressure: AbsoluteKpa): number {
  return (airflowLbMin * Math.sqrt(inletTempK / REFERENCE_TEMPERATURE_K)) / (inletPressure / REFERENCE_PRESSURE_KPA);
}
