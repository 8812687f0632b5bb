import { absoluteKpa, type AbsoluteKpa } from '../units';
import { R_AIR_J_PER_KG_K } from './gas';

// ICAO Doc 7488 / ISO 2533 troposphere constants.
const SEA_LEVEL_TEMPERATURE_K = 288.15;
const SEA_LEVEL_PRESSURE_PA = 101_325;
const LAPSE_RATE_K_PER_M = 0.0065;
const PRESSURE_EXPONENT = 5.25588;

/** ISA temperature at an altitude (m) in the troposphere (valid to 11 km; requests stop at 5 km), K. */
export function isaTemperatureK(altitudeM: number): number {
  return SEA_LEVEL_TEMPERATURE_K - LAPSE_RATE_K_PER_M * altitudeM;
}

/** ISA static pressure at an altitude (m) in the troposphere, absolute kPa. */
export function isaPressureKpa(altitudeM: number): AbsoluteKpa {
  const ratio = isaTemperatureK(altitudeM) / SEA_LEVEL_TEMPERATURE_K;
  return absoluteKpa((SEA_LEVEL_PRESSURE_PA * ratio ** PRESSURE_EXPONENT) / 1000);
}

/** Dry-air density from the ideal gas law, kg/m³. */
export function airDensityKgM3(pressure: AbsoluteKpa, temperatureK: number): number {
  return (pressure * 1000) / (R_AIR_J_PER_KG_K * temperatureK);
}

/** ISA density at an altitude, kg/m³. */
export function isaDensityKgM3(altitudeM: number): number {
  return airDensityKgM3(isaPressureKpa(altitudeM), isaTemperatureK(altitudeM));
}
