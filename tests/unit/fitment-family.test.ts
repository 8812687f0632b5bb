import { describe, expect, it } from 'vitest';
import { FRAMES } from '../../catalog-seed/frames';
import { buildCompressorMap } from '../../shared/fitment/compressor-map';
import {
  CHOKE_INDUCER_MACH,
  INDUCER_HUB_TIP_RATIO,
  TIP_SPEED_LIMIT_MS,
  WORK_COEFFICIENT_BAND,
  chokeMassFluxKgSM2,
  efficiencyOnMap,
  inducerAreaM2,
} from '../../shared/fitment/frame-family';
import { CP_AIR_J_PER_KG_K, ISENTROPIC_EXPONENT } from '../../shared/fitment/gas';
import { tipSpeedMs } from '../../shared/fitment/shaft-speed';

const KG_S_PER_LB_MIN = 0.45359237 / 60;

describe('the frame family follows one physical model', () => {
  it('choked mass flux from the isentropic flow relations (Anderson, Modern Compressible Flow, ch. 5; worked by hand)', () => {
    // ρ₀ = 101325 / (287.05 · 288.15) = 1.2250 kg/m³; a₀ = √(1.4 · 287.05 · 288.15) = 340.29 m/s;
    // M = 0.55: M·(1 + 0.2·M²)^−3 = 0.55 · 1.0605^−3 = 0.46112; × (1 − 0.3²) = 0.91 → 174.9 kg/(s·m²).
    expect(CHOKE_INDUCER_MACH).toBe(0.55);
    expect(INDUCER_HUB_TIP_RATIO).toBe(0.3);
    expect(chokeMassFluxKgSM2()).toBeCloseTo(174.9, 0);
  });

  it('choke flow per inducer area is the same across the family (within ±10 %)', () => {
    const perArea = FRAMES.map((f) => (buildCompressorMap(f).chokeLine.at(-1)!.flowLbMin * KG_S_PER_LB_MIN) / inducerAreaM2(f.inducerMm));
    const mean = perArea.reduce((a, b) => a + b, 0) / perArea.length;
    for (const [i, value] of perArea.entries()) expect(Math.abs(value / mean - 1), FRAMES[i]!.code).toBeLessThan(0.1);
  });

  it('each frame reaches its maximum pressure ratio with a work coefficient Δh₀/U² inside 0.6–0.75 (Dixon & Hall, centrifugal compressors; from memory)', () => {
    for (const f of FRAMES) {
      const map = buildCompressorMap(f);
      const topSurge = map.speedLines.at(-1)!.points[0]!;
      const u = tipSpeedMs(f.exducerMm, map.maxShaftRpm);
      // Euler: actual work = cp·T₁·(PR^((γ−1)/γ) − 1)/η = μ·U², at the map's own efficiency there.
      const work = (CP_AIR_J_PER_KG_K * 288.15 * (topSurge.pressureRatio ** ISENTROPIC_EXPONENT - 1)) / efficiencyOnMap(f, 0, 1);
      const mu = work / (u * u);
      expect(mu, f.code).toBeGreaterThanOrEqual(WORK_COEFFICIENT_BAND[0]);
      expect(mu, f.code).toBeLessThanOrEqual(WORK_COEFFICIENT_BAND[1]);
      expect(map.workCoefficient).toBeCloseTo(mu, 3);
    }
  });

  it('limits tip speed by wheel material: cast aluminium about 520 m/s, milled about 590 m/s (common practice)', () => {
    expect(TIP_SPEED_LIMIT_MS).toEqual({ cast: 520, milled: 590 });
    for (const f of FRAMES) {
      const tip = tipSpeedMs(f.exducerMm, f.maxShaftRpm);
      expect(Math.abs(tip - TIP_SPEED_LIMIT_MS[f.wheel]), f.code).toBeLessThan(5);
    }
  });

  it('states the reference conditions of every map (288.15 K, 101.325 kPa)', () => {
    for (const f of FRAMES) expect(buildCompressorMap(f)).toMatchObject({ referenceTemperatureK: 288.15, referencePressureKpa: 101.325 });
  });

  it('bands overlap, so no build falls between two frames', () => {
    for (let i = 1; i < FRAMES.length; i++) {
      expect(FRAMES[i]!.powerBandHp[0], FRAMES[i]!.code).toBeLessThan(FRAMES[i - 1]!.powerBandHp[1]);
    }
  });
});
