import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { airDensityKgM3, isaDensityKgM3, isaPressureKpa, isaTemperatureK } from '../../shared/fitment/atmosphere';

// psychrolib ships as a CommonJS singleton without type declarations.
interface Psychrolib {
  SI: number;
  SetUnitSystem(system: number): void;
  GetStandardAtmPressure(altitudeM: number): number;
  GetStandardAtmTemperature(altitudeM: number): number;
  GetDryAirDensity(dryBulbC: number, pressurePa: number): number;
}
const psychrolib = createRequire(import.meta.url)('psychrolib') as Psychrolib;
psychrolib.SetUnitSystem(psychrolib.SI);

describe('ISA troposphere against ISO 2533 / ICAO Doc 7488 tables', () => {
  // Table values at geopotential altitude (from memory): T in K, p in kPa, ρ in kg/m³.
  const table: Array<[number, number, number, number]> = [
    [0, 288.15, 101.325, 1.225],
    [1500, 278.4, 84.556, 1.0581],
    [3000, 268.65, 70.108, 0.90913],
  ];
  it.each(table)('at %i m: T %f K, p %f kPa, ρ %f kg/m³', (altitude, temperature, pressure, density) => {
    expect(isaTemperatureK(altitude)).toBeCloseTo(temperature, 6);
    expect(Math.abs(isaPressureKpa(altitude) - pressure)).toBeLessThan(0.002);
    expect(Math.abs(isaDensityKgM3(altitude) / density - 1)).toBeLessThan(2e-4);
  });
});

describe('ISA troposphere against psychrolib (ASHRAE Handbook Fundamentals 2017, ch. 1 eqs. 3–4)', () => {
  it.each([0, 500, 1500, 2250, 3000, 4500])('at %i m', (altitude) => {
    const referencePa = psychrolib.GetStandardAtmPressure(altitude);
    const referenceC = psychrolib.GetStandardAtmTemperature(altitude);
    expect(Math.abs((isaPressureKpa(altitude) * 1000) / referencePa - 1)).toBeLessThan(1e-4);
    expect(isaTemperatureK(altitude) - 273.15).toBeCloseTo(referenceC, 9);
    // psychrolib's dry-air gas constant is 287.042 J/(kg·K), ours 287.05: agreement to 5e-5.
    const referenceDensity = psychrolib.GetDryAirDensity(referenceC, referencePa);
    expect(Math.abs(isaDensityKgM3(altitude) / referenceDensity - 1)).toBeLessThan(2e-4);
  });

  it('dry-air density off the standard day matches too', () => {
    const density = airDensityKgM3(isaPressureKpa(0), 273.15 + 35);
    expect(Math.abs(density / psychrolib.GetDryAirDensity(35, 101325) - 1)).toBeLessThan(1e-4);
  });
});
