import { describe, expect, it } from 'vitest';
import { compressorOutletTempK } from '../../shared/fitment/compressor-outlet';
import { correctedFlowLbMin } from '../../shared/fitment/corrected-flow';
import { intercoolerOutletTempK, solveChargeState } from '../../shared/fitment/intercooler';
import { manifoldPressureKpaFourStroke } from '../../shared/fitment/manifold-pressure';
import { pressureRatio } from '../../shared/fitment/pressure-ratio';
import { eulerPressureRatio, eulerShaftRpm, eulerTipSpeedMs, tipSpeedMs } from '../../shared/fitment/shaft-speed';
import { airflowLbMinFromPower } from '../../shared/fitment/airflow';
import { absoluteKpa } from '../../shared/units';

/*
 * Saravanamuttoo, Rogers & Cohen, "Gas Turbine Theory", Example 4.1 (centrifugal compressor design), from memory:
 * impeller tip diameter 0.5 m at 290 rev/s, slip factor σ = 0.9, power input factor ψ = 1.04, inlet stagnation
 * temperature 295 K, isentropic efficiency 0.78, cp = 1.005 kJ/(kg·K), γ = 1.4.
 * Worked: U = π·0.5·290 = 455.5 m/s; T03 − T01 = ψσU²/cp = 193 K; p03/p01 = (1 + 0.78·193/295)^3.5 = 4.23.
 */
describe('textbook worked example: Gas Turbine Theory, Example 4.1 (from memory)', () => {
  const workCoefficient = 1.04 * 0.9;

  it('tip speed U = π·D·N is 455.5 m/s', () => {
    expect(tipSpeedMs(500, 290 * 60)).toBeCloseTo(455.5, 1);
  });

  it('the isentropic outlet relation gives T03 − T01 = 193 K at PR 4.23, η 0.78, T01 295 K', () => {
    expect(compressorOutletTempK(295, 4.23, 0.78) - 295).toBeCloseTo(193, 0);
  });

  it('the Euler work relation gives PR 4.23 from the tip speed, and the shaft speed back from PR', () => {
    const u = tipSpeedMs(500, 290 * 60);
    // The book rounds the temperature rise to 193 K before raising to the power 3.5; unrounded it is 4.24.
    expect(Math.abs(eulerPressureRatio(u, 295, 0.78, workCoefficient) / 4.23 - 1)).toBeLessThan(0.005);
    expect(Math.abs(eulerTipSpeedMs(4.23, 295, 0.78, workCoefficient) / 455.5 - 1)).toBeLessThan(0.005);
    expect(Math.abs(eulerShaftRpm(4.23, 295, 0.78, workCoefficient, 500) / 17_400 - 1)).toBeLessThan(0.005);
  });
});

describe('single steps', () => {
  it('Wa = hp·BSFC·AFR/60: 400 hp at 0.5 lb/(hp·h) and 12:1 is 40 lb/min (the trade\'s 10 hp per lb/min, common practice)', () => {
    expect(airflowLbMinFromPower(400, 0.5, 12)).toBe(40);
  });

  it('MAP from the ideal gas law for a four-stroke', () => {
    // By hand: 0.1 kg/s, 320 K, VE 0.9, 2.0 L at 6000 rpm: 2·0.1·287.05·320/(0.9·0.002·100) = 102 062 Pa.
    const map = manifoldPressureKpaFourStroke({ airflowKgS: 0.1, manifoldTempK: 320, volumetricEfficiency: 0.9, displacementL: 2, rpm: 6000 });
    expect(map).toBeCloseTo(102.062, 2);
  });

  it('pressure ratio includes the charge and inlet losses', () => {
    // By hand: (200 + 13.7895)/(101.325 − 3.4474) = 2.1843.
    expect(pressureRatio(absoluteKpa(200), absoluteKpa(101.325), 2, 0.5)).toBeCloseTo(2.1843, 3);
  });

  it('corrected flow at 288.15 K and 101.325 kPa', () => {
    // By hand: 30·√(303.15/288.15)/(95/101.325) = 30·1.02569/0.93758 = 32.819.
    expect(correctedFlowLbMin(30, 303.15, absoluteKpa(95))).toBeCloseTo(32.819, 2);
  });

  it('intercooler effectiveness: 0.75 takes 150 °C down to 56.25 °C with 25 °C coolant', () => {
    // By hand: 150 − 0.75·(150 − 25) = 56.25 °C.
    expect(intercoolerOutletTempK(423.15, 298.15, 0.75)).toBeCloseTo(329.4, 9);
  });

  it('the manifold temperature iteration reaches a fixed point', () => {
    const state = solveChargeState({
      airflowLbMin: 30,
      displacementL: 2,
      rpm: 6500,
      volumetricEfficiency: 0.9,
      ambient: absoluteKpa(101.325),
      inletTempK: 298.15,
      chargeLossPsi: 2,
      inletLossPsi: 0.5,
      compressorEfficiency: 0.72,
      intercoolerEffectiveness: 0.75,
    });
    const again = intercoolerOutletTempK(compressorOutletTempK(298.15, state.pressureRatio, 0.72), 298.15, 0.75);
    expect(Math.abs(again - state.manifoldTempK)).toBeLessThan(1e-6);
    expect(state.iterations).toBeLessThan(20);
  });
});
