import { describe, expect, it } from 'vitest';
import { runFitmentCheck } from '../../shared/fitment/check';
import { FitmentRequestSchema } from '../../shared/schemas/fitment';

const within = (actual: number, expected: number, share: number) =>
  expect(Math.abs(actual / expected - 1), `${actual} vs ${expected}`).toBeLessThanOrEqual(share);
const withinKelvin = (actual: number, expected: number, kelvin: number) =>
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(kelvin);

/*
 * Whole-chain worked examples, computed by hand (calculator) from the formulas in the issue. Tolerances: ±0.5 % on
 * flows and pressures, ±1.5 K on temperatures.
 */
describe('worked example A: 2.0 L petrol street, 300 hp at 6500 rpm, given manifold temperature', () => {
  /*
   * Inputs: sea level, inlet 25 °C (298.15 K), BSFC 0.50, AFR 12.0, VE 0.90, manifold 45 °C (318.15 K),
   * charge loss 2.0 psi, inlet loss 0.5 psi, compressor efficiency 0.72.
   *  Wa  = 300·0.50·12/60                      = 30.0 lb/min = 30·0.45359237/60 = 0.226796 kg/s
   *  MAP = 2·0.226796·287.05·318.15/(0.90·0.0020·6500/60) = 41 424/0.19500 = 212 432 Pa = 212.43 kPa
   *  boost = (212.43 − 101.325)/6.894757        = 16.11 psi
   *  p1  = 101.325 − 0.5·6.894757               = 97.878 kPa
   *  p2  = 212.43 + 2·6.894757                  = 226.22 kPa
   *  PR  = 226.22/97.878                        = 2.3113
   *  PR^0.285714 = 1.27045 → T2 = 298.15·(1 + 0.27045/0.72) = 410.14 K = 137.0 °C
   *  Wc  = 30·√(298.15/288.15)/(97.878/101.325) = 30·1.01720/0.96598 = 31.59 lb/min
   */
  const result = runFitmentCheck(
    FitmentRequestSchema.parse({
      displacementL: 2.0,
      powerHp: 300,
      rpm: 6500,
      fuel: 'petrol',
      application: 'street',
      altitudeM: 0,
      ambientC: 25,
      assumptions: { bsfc: 0.5, afr: 12, volumetricEfficiency: 0.9, manifoldTempC: 45, chargeLossPsi: 2, inletLossPsi: 0.5, compressorEfficiency: 0.72 },
    }),
    [],
  );
  const { required } = result;

  it('airflow', () => {
    within(required.airflowLbMin, 30.0, 0.005);
    within(required.airflowKgS, 0.226796, 0.005);
  });
  it('manifold pressure, boost and pressure ratio', () => {
    within(required.manifoldPressureKpa, 212.43, 0.005);
    within(required.boostPsi, 16.11, 0.005);
    within(required.pressureRatio, 2.3113, 0.005);
  });
  it('compressor outlet temperature', () => {
    withinKelvin(required.compressorOutletC, 137.0, 1.5);
  });
  it('corrected flow', () => {
    within(required.correctedFlowLbMin, 31.59, 0.005);
  });
  it('echoes the given assumptions and marks nothing it was given as defaulted', () => {
    expect(result.assumptions.manifoldTempC).toBe(45);
    expect(result.assumptions.manifoldTempGiven).toBe(true);
    expect(result.assumptions.defaulted).not.toContain('bsfc');
    expect(result.assumptions.defaulted).toContain('intercooled');
  });
});

describe('worked example B: 3.0 L diesel off-road at 1500 m, 250 hp at 4000 rpm, intercooler iteration', () => {
  /*
   * Inputs: 1500 m, inlet 20 °C (293.15 K), BSFC 0.40, AFR 22, VE 0.92, intercooled with the off-road default
   * effectiveness 0.70 and the coolant (ambient air) at the inlet temperature, charge loss 1.5 psi, inlet loss
   * 0.6 psi, compressor efficiency 0.74.
   *  Wa  = 250·0.40·22/60 = 36.667 lb/min = 0.277195 kg/s
   *  p_amb (ISA 1500 m)  = 84.556 kPa; p1 = 84.556 − 0.6·6.894757 = 80.419 kPa
   *  MAP = 2·0.277195·287.05·T_man/(0.92·0.0030·4000/60) = 864.98·T_man Pa
   *  Iteration on T_man, from the inlet temperature:
   *    T_man 293.15 → MAP 253.54 → PR (253.54 + 10.342)/80.419 = 3.2813 → T2 453.29 → T_man 341.19
   *    T_man 341.19 → MAP 295.09 → PR 3.7980 → T2 477.02 → T_man 348.31
   *    T_man 348.31 → MAP 301.25 → PR 3.8746 → T2 480.34 → T_man 349.31
   *    … settles at T_man 349.47 K (76.3 °C), MAP 302.25 kPa, PR 3.8870, T2 480.88 K (207.7 °C)
   *  (T2 = T1·(1 + (PR^0.285714 − 1)/0.74); T_man = T2 − 0.70·(T2 − 293.15).)
   *  boost = (302.25 − 84.556)/6.894757 = 31.57 psi
   *  Wc  = 36.667·√(293.15/288.15)/(80.419/101.325) = 36.667·1.008640/0.793675 = 46.60 lb/min
   */
  const result = runFitmentCheck(
    FitmentRequestSchema.parse({
      displacementL: 3.0,
      powerHp: 250,
      rpm: 4000,
      fuel: 'diesel',
      application: 'offroad',
      altitudeM: 1500,
      ambientC: 20,
      intercooled: true,
      assumptions: { bsfc: 0.4, afr: 22, volumetricEfficiency: 0.92, chargeLossPsi: 1.5, inletLossPsi: 0.6, compressorEfficiency: 0.74 },
    }),
    [],
  );
  const { required } = result;

  it('airflow and corrected flow', () => {
    within(required.airflowLbMin, 36.667, 0.005);
    within(required.airflowKgS, 0.277195, 0.005);
    within(required.correctedFlowLbMin, 46.6, 0.005);
  });
  it('ambient, manifold pressure, boost and pressure ratio', () => {
    within(required.ambientPressureKpa, 84.556, 0.005);
    within(required.manifoldPressureKpa, 302.25, 0.005);
    within(required.boostPsi, 31.57, 0.005);
    within(required.pressureRatio, 3.887, 0.005);
  });
  it('compressor outlet and manifold temperatures', () => {
    withinKelvin(required.compressorOutletC, 207.7, 1.5);
    withinKelvin(required.manifoldTempC, 76.3, 1.5);
    withinKelvin(result.assumptions.manifoldTempC, 76.3, 1.5);
    expect(result.assumptions.intercoolerEffectiveness).toBe(0.7);
  });
  it('the operating line holds the boost level from full boost to peak power', () => {
    const line = result.operatingLine;
    expect(line.length).toBeGreaterThanOrEqual(6);
    expect(line[0]?.rpm).toBe(2200); // off-road full boost at 55 % of 4000 rpm
    expect(line[line.length - 1]?.rpm).toBe(4000);
    for (const point of line) within(point.pressureRatio, 3.887, 0.005);
  });
});
