import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  absoluteKpa,
  absoluteKpaToGaugeBar,
  absoluteKpaToGaugePsi,
  barToKpa,
  barToPsi,
  ccToLitres,
  celsiusToFahrenheit,
  celsiusToKelvin,
  cubicInchesToLitres,
  fahrenheitToCelsius,
  fahrenheitToKelvin,
  gaugeBar,
  gaugeBarToAbsoluteKpa,
  gaugePsi,
  gaugePsiToAbsoluteKpa,
  hpToKw,
  hpToWatts,
  kelvinToCelsius,
  kelvinToFahrenheit,
  kgPerSToLbPerMin,
  kpaToBar,
  kpaToPsi,
  kwToHp,
  lbPerMinToKgPerS,
  litresToCc,
  litresToCubicInches,
  psiToBar,
  psiToKpa,
  wattsToHp,
} from '../../shared/units';

const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

describe('conversion factors against NIST SP 811 (2008), appendix B.8/B.9', () => {
  it('1 hp (550 ft·lbf/s) = 745.699872 W', () => {
    // NIST SP 811: horsepower (550 ft·lbf/s) → watt, 7.456 999 E+02.
    expect(hpToWatts(1)).toBeCloseTo(745.699872, 6);
    expect(wattsToHp(745.699872)).toBeCloseTo(1, 8);
  });

  it('1 psi = 6894.757 Pa', () => {
    // NIST SP 811: pound-force per square inch → pascal, 6.894 757 E+03.
    expect(psiToKpa(1) * 1000).toBeCloseTo(6894.757, 3);
  });

  it('1 in³ = 16.387064 cm³ and 1 lb = 0.45359237 kg (exact)', () => {
    // NIST SP 811: cubic inch → cubic meter 1.638 706 4 E−05 (exact); pound (avoirdupois) → kilogram 0.453 592 37 (exact).
    expect(cubicInchesToLitres(1) * 1000).toBeCloseTo(16.387064, 9);
    expect(lbPerMinToKgPerS(60)).toBeCloseTo(0.45359237, 12);
  });

  it('1 bar = 100 kPa and the Fahrenheit scale is T/K = (t/°F + 459.67)/1.8', () => {
    // NIST SP 811: bar → pascal 1.0 E+05 (exact); appendix B.9 temperature conversions.
    expect(barToKpa(1)).toBe(100);
    expect(fahrenheitToKelvin(32)).toBeCloseTo(273.15, 10);
    expect(fahrenheitToKelvin(212)).toBeCloseTo(373.15, 10);
  });
});

describe('conversions against mathjs units', () => {
  const cases: Array<[string, number, number]> = [
    ['hp → kW', hpToKw(350), unit(350, 'hp').toNumber('kW')],
    ['kW → hp', kwToHp(200), unit(200, 'kW').toNumber('hp')],
    ['psi → kPa', psiToKpa(22.5), unit(22.5, 'psi').toNumber('kPa')],
    ['kPa → psi', kpaToPsi(250), unit(250, 'kPa').toNumber('psi')],
    ['bar → psi', barToPsi(1.6), unit(1.6, 'bar').toNumber('psi')],
    ['psi → bar', psiToBar(30), unit(30, 'psi').toNumber('bar')],
    ['kPa → bar', kpaToBar(180), unit(180, 'kPa').toNumber('bar')],
    ['in³ → L', cubicInchesToLitres(350), unit(350, 'cuin').toNumber('L')],
    ['L → in³', litresToCubicInches(5.7), unit(5.7, 'L').toNumber('cuin')],
    ['L → cc', litresToCc(1.998), unit(1.998, 'L').toNumber('cm^3')],
    ['cc → L', ccToLitres(649), unit(649, 'cm^3').toNumber('L')],
    ['lb/min → kg/s', lbPerMinToKgPerS(46), unit(46, 'lbm/minute').toNumber('kg/s')],
    ['kg/s → lb/min', kgPerSToLbPerMin(0.35), unit(0.35, 'kg/s').toNumber('lbm/minute')],
    ['°C → K', celsiusToKelvin(25), unit(25, 'degC').toNumber('K')],
    ['K → °C', kelvinToCelsius(410), unit(410, 'K').toNumber('degC')],
    ['°F → K', fahrenheitToKelvin(100), unit(100, 'degF').toNumber('K')],
    ['K → °F', kelvinToFahrenheit(320), unit(320, 'K').toNumber('degF')],
    ['°C → °F', celsiusToFahrenheit(-40), unit(-40, 'degC').toNumber('degF')],
    ['°F → °C', fahrenheitToCelsius(140), unit(140, 'degF').toNumber('degC')],
  ];
  it.each(cases)('%s', (_label, ours, reference) => {
    // mathjs defines hp from its own constants; agreement to 1e-9 relative is far inside any engineering need.
    expect(relative(ours, reference)).toBeLessThan(1e-9);
  });
});

describe('gauge and absolute pressure are kept apart', () => {
  it('boost is absolute pressure less the ambient, not less a standard atmosphere', () => {
    // At 1500 m the ambient is 84.556 kPa (ICAO Doc 7488): 184.556 kPa absolute reads 100 kPa = 14.504 psi of boost.
    const ambient = absoluteKpa(84.556);
    expect(absoluteKpaToGaugePsi(absoluteKpa(184.556), ambient)).toBeCloseTo(unit(100, 'kPa').toNumber('psi'), 6);
    expect(absoluteKpaToGaugeBar(absoluteKpa(184.556), ambient)).toBeCloseTo(1, 12);
  });

  it('round-trips gauge → absolute → gauge', () => {
    const ambient = absoluteKpa(101.325);
    expect(absoluteKpaToGaugePsi(gaugePsiToAbsoluteKpa(gaugePsi(18), ambient), ambient)).toBeCloseTo(18, 12);
    expect(absoluteKpaToGaugeBar(gaugeBarToAbsoluteKpa(gaugeBar(1.2), ambient), ambient)).toBeCloseTo(1.2, 12);
    // 0 psi gauge is the ambient pressure itself.
    expect(gaugePsiToAbsoluteKpa(gaugePsi(0), ambient)).toBe(101.325);
  });
});
