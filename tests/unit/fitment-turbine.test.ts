import { describe, expect, it } from 'vitest';
import {
  EXHAUST_GAMMA,
  MECHANICAL_EFFICIENCY,
  balanceTurbine,
  exhaustToDriveKgS,
  expansionRatioFor,
  swallowedKgS,
  turbinePowerW,
  turbineThroatAreaM2,
} from '../../shared/fitment/turbine';

/**
 * A textbook-style case, worked by hand from the power balance (the method of Watson & Janota, "Turbocharging the
 * Internal Combustion Engine", ch. 4; the gas properties c_p,exh = 1150 J/(kg·K), γ = 1.33 as the module states):
 *   air 0.200 kg/s at PR 2.0 from 298 K, η_c = 0.72:
 *     P_c = 0.200 · 1004.7 · 298 · (2^0.2857 − 1) / 0.72 = 0.200 · 1004.7 · 298 · 0.21901 / 0.72 = 18 215 W
 *   exhaust 0.200 · (1 + 1/12) = 0.21667 kg/s at 1223 K, η_t = 0.68, η_m = 0.95, all through the wheel:
 *     1 − ER^−0.24812 = 18 215 / 0.95 / (0.21667 · 1150 · 1223 · 0.68) = 19 174 / 207 222 = 0.092529
 *     ER = 0.907471^(−1/0.24812) = 1.4795
 */
describe('turbine power balance (hand-worked)', () => {
  const compressorW = 18_215;
  const exhaust = 0.2 * (1 + 1 / 12);

  it('a turbine at ER 1.4795 with all the flow drives that compressor', () => {
    const power = turbinePowerW(exhaust, 1223, 1.4795, 0.68) * MECHANICAL_EFFICIENCY;
    expect(power / compressorW).toBeCloseTo(1, 2);
  });

  it('a housing that swallows the flow at exactly that expansion ratio needs no wastegate', () => {
    // Choose the throat area that passes 0.21667 kg/s at ER 1.4795 from p₄ = 108 kPa.
    const areaAtOne = swallowedKgS(1.4795, 1, 108, 1223);
    const area = exhaust / areaAtOne;
    expect(expansionRatioFor(exhaust, area, 108, 1223)).toBeCloseTo(1.4795, 2);
    const balance = balanceTurbine(exhaust, compressorW, { areaM2: area, p4Kpa: 108, t3K: 1223, efficiency: 0.68 });
    expect(balance.reaches).toBe(true);
    expect(balance.wastegateShare).toBeLessThan(0.01);
    expect(balance.exhaustManifoldKpa).toBeCloseTo(1.4795 * 108, 0);
  });

  it('a smaller housing builds more pressure than needed, so the wastegate bleeds the surplus', () => {
    const area = exhaust / swallowedKgS(1.4795, 1, 108, 1223) / 1.6;
    const balance = balanceTurbine(exhaust, compressorW, { areaM2: area, p4Kpa: 108, t3K: 1223, efficiency: 0.68 });
    expect(balance.reaches).toBe(true);
    expect(balance.wastegateShare).toBeGreaterThan(0.05);
    // What passes the wheel makes exactly the power needed.
    const through = exhaust * (1 - balance.wastegateShare);
    expect((turbinePowerW(through, 1223, balance.expansionRatio, 0.68) * MECHANICAL_EFFICIENCY) / compressorW).toBeCloseTo(1, 2);
  });

  it('the least exhaust flow that holds the boost is the one the housing swallows at ER 1.4795 (same case)', () => {
    // Work per kg of exhaust at the shaft: 18 215 / 0.95 / 0.21667 = 88 494 J/kg, the ER of 1.4795 worked above.
    const area = exhaust / swallowedKgS(1.4795, 1, 108, 1223) / 1.6;
    const setting = { areaM2: area, p4Kpa: 108, t3K: 1223, efficiency: 0.68 };
    const needed = exhaustToDriveKgS(compressorW / MECHANICAL_EFFICIENCY / exhaust, setting);
    expect(needed! / swallowedKgS(1.4795, area, 108, 1223)).toBeCloseTo(1, 2);
    // Just below that flow the shut housing falls short; at it, the balance is met with nothing to bleed.
    const below = balanceTurbine(needed! * 0.99, (compressorW * needed! * 0.99) / exhaust, setting);
    expect(below.reaches).toBe(false);
    expect(exhaustToDriveKgS(1e9, setting)).toBeNull();
  });

  it('a larger housing cannot drive the compressor: boost is not reached', () => {
    const area = (exhaust / swallowedKgS(1.4795, 1, 108, 1223)) * 1.6;
    expect(balanceTurbine(exhaust, compressorW, { areaM2: area, p4Kpa: 108, t3K: 1223, efficiency: 0.68 }).reaches).toBe(false);
  });

  it('passes the choked nozzle flow above the critical expansion ratio (gas dynamics: ψ* = √γ·(2/(γ+1))^((γ+1)/(2(γ−1))))', () => {
    const g = EXHAUST_GAMMA;
    const psiStar = Math.sqrt(g) * (2 / (g + 1)) ** ((g + 1) / (2 * (g - 1)));
    // ṁ = A·p₃·ψ*/√(R·T₃) with p₃ = ER·p₄; R = c_p·(γ−1)/γ = 285.3 J/(kg·K).
    const expected = (1e-3 * 3 * 100_000 * psiStar) / Math.sqrt(((1150 * (g - 1)) / g) * 1100);
    expect(swallowedKgS(3, 1e-3, 100, 1100) / expected).toBeCloseTo(1, 6);
  });

  it('reads A/R as inches: a larger A/R or wheel passes proportionally more', () => {
    expect(turbineThroatAreaM2(0.82, 60) / turbineThroatAreaM2(0.41, 60)).toBeCloseTo(2, 9);
    expect(turbineThroatAreaM2(0.82, 60) / turbineThroatAreaM2(0.82, 30)).toBeCloseTo(2, 9);
  });
});
