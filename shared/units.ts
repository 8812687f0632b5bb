/**
 * Unit conversions for the fitment check. Every function carries its units in its name; gauge and absolute
 * pressure are branded types so one cannot be passed where the other is meant.
 * Exact factors follow NIST SP 811 (2008), appendix B.
 */

declare const unitBrand: unique symbol;
type Branded<T, B extends string> = T & { readonly [unitBrand]: B };

/** Absolute pressure in kPa (measured from vacuum). */
export type AbsoluteKpa = Branded<number, 'kPa absolute'>;
/** Gauge pressure in psi (measured from the surrounding air, as a boost gauge reads). */
export type GaugePsi = Branded<number, 'psi gauge'>;
/** Gauge pressure in bar. */
export type GaugeBar = Branded<number, 'bar gauge'>;

export const absoluteKpa = (value: number): AbsoluteKpa => value as AbsoluteKpa;
export const gaugePsi = (value: number): GaugePsi => value as GaugePsi;
export const gaugeBar = (value: number): GaugeBar => value as GaugeBar;

// Exact by definition: international pound (0.45359237 kg), foot (0.3048 m), inch, standard gravity.
export const KG_PER_LB = 0.45359237;
const M_PER_FT = 0.3048;
const M_PER_IN = 0.0254;
const STANDARD_GRAVITY_MS2 = 9.80665;

/** Mechanical horsepower, 550 ft·lbf/s (NIST SP 811: 7.456 999 E+02 W). */
export const WATTS_PER_HP = 550 * M_PER_FT * KG_PER_LB * STANDARD_GRAVITY_MS2;
/** Pound-force per square inch (NIST SP 811: 6.894 757 E+03 Pa). */
export const PA_PER_PSI = (KG_PER_LB * STANDARD_GRAVITY_MS2) / (M_PER_IN * M_PER_IN);
export const PA_PER_BAR = 100_000;
export const CUBIC_METRES_PER_CUBIC_INCH = M_PER_IN ** 3;
export const ZERO_CELSIUS_K = 273.15;

export const hpToWatts = (hp: number): number => hp * WATTS_PER_HP;
export const wattsToHp = (watts: number): number => watts / WATTS_PER_HP;
export const hpToKw = (hp: number): number => (hp * WATTS_PER_HP) / 1000;
export const kwToHp = (kw: number): number => (kw * 1000) / WATTS_PER_HP;

export const litresToCubicMetres = (litres: number): number => litres / 1000;
export const litresToCc = (litres: number): number => litres * 1000;
export const ccToLitres = (cc: number): number => cc / 1000;
export const cubicInchesToLitres = (cubicInches: number): number => cubicInches * CUBIC_METRES_PER_CUBIC_INCH * 1000;
export const litresToCubicInches = (litres: number): number => litres / 1000 / CUBIC_METRES_PER_CUBIC_INCH;

export const psiToKpa = (psi: number): number => (psi * PA_PER_PSI) / 1000;
export const kpaToPsi = (kpa: number): number => (kpa * 1000) / PA_PER_PSI;
export const barToKpa = (bar: number): number => (bar * PA_PER_BAR) / 1000;
export const kpaToBar = (kpa: number): number => (kpa * 1000) / PA_PER_BAR;
export const psiToBar = (psi: number): number => (psi * PA_PER_PSI) / PA_PER_BAR;
export const barToPsi = (bar: number): number => (bar * PA_PER_BAR) / PA_PER_PSI;

/** Boost as a gauge reads it: absolute pressure less the surrounding (ambient) pressure. */
export const absoluteKpaToGaugePsi = (pressure: AbsoluteKpa, ambient: AbsoluteKpa): GaugePsi =>
  gaugePsi(kpaToPsi(pressure - ambient));
export const gaugePsiToAbsoluteKpa = (boost: GaugePsi, ambient: AbsoluteKpa): AbsoluteKpa =>
  absoluteKpa(ambient + psiToKpa(boost));
export const absoluteKpaToGaugeBar = (pressure: AbsoluteKpa, ambient: AbsoluteKpa): GaugeBar =>
  gaugeBar(kpaToBar(pressure - ambient));
export const gaugeBarToAbsoluteKpa = (boost: GaugeBar, ambient: AbsoluteKpa): AbsoluteKpa =>
  absoluteKpa(ambient + barToKpa(boost));

export const lbPerMinToKgPerS = (lbPerMin: number): number => (lbPerMin * KG_PER_LB) / 60;
export const kgPerSToLbPerMin = (kgPerS: number): number => (kgPerS * 60) / KG_PER_LB;

export const celsiusToKelvin = (celsius: number): number => celsius + ZERO_CELSIUS_K;
export const kelvinToCelsius = (kelvin: number): number => kelvin - ZERO_CELSIUS_K;
export const fahrenheitToKelvin = (fahrenheit: number): number => (fahrenheit + 459.67) / 1.8;
export const kelvinToFahrenheit = (kelvin: number): number => kelvin * 1.8 - 459.67;
export const celsiusToFahrenheit = (celsius: number): number => celsius * 1.8 + 32;
export const fahrenheitToCelsius = (fahrenheit: number): number => (fahrenheit - 32) / 1.8;
