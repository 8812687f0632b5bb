import type { OperatingPoint } from '../schemas/fitment';
import {
  absoluteKpaToGaugePsi,
  absoluteKpa,
  kelvinToCelsius,
  type AbsoluteKpa,
} from '../units';
import { airflowLbMinFromPower } from './airflow';
import { correctedFlowLbMin } from './corrected-flow';
import { solveChargeState } from './intercooler';
import { compressorInletKpa } from './pressure-ratio';

/**
 * Torque-curve model for a wastegated turbocharged engine (common practice): once full boost arrives the wastegate
 * holds it, and torque follows the engine's breathing: flat from the full-boost rpm to halfway to peak-power rpm,
 * then easing off linearly to 90 % of the plateau at peak power. Power therefore rises all the way to peak-power
 * rpm. The stated VE belongs to the peak-power point; along the line VE scales with torque (the mid-range
 * breathes about 11 % better), so boost, and the pressure ratio, stay level across the line, as a wastegate keeps
 * them.
 */
export const TORQUE_AT_PEAK_POWER_SHARE = 0.9;
export const OPERATING_LINE_POINTS = 7;

/** Torque relative to the plateau. */
export function relativeTorqueAt(rpm: number, fullBoostRpm: number, peakPowerRpm: number): number {
  const taperStart = (fullBoostRpm + peakPowerRpm) / 2;
  if (rpm <= taperStart || peakPowerRpm <= taperStart) return 1;
  const t = Math.min(1, (rpm - taperStart) / (peakPowerRpm - taperStart));
  return 1 - (1 - TORQUE_AT_PEAK_POWER_SHARE) * t;
}

/** Power at an rpm on the modelled curve, scaled so the curve passes through the stated peak. */
export function powerHpAt(rpm: number, peakPowerHp: number, fullBoostRpm: number, peakPowerRpm: number): number {
  const torqueShare = relativeTorqueAt(rpm, fullBoostRpm, peakPowerRpm) / TORQUE_AT_PEAK_POWER_SHARE;
  return peakPowerHp * (rpm / peakPowerRpm) * torqueShare;
}

/** Evenly spaced engine speeds from full boost to peak power, both included. */
export function operatingLineRpms(fullBoostRpm: number, peakPowerRpm: number, count = OPERATING_LINE_POINTS): number[] {
  const steps = Math.max(count, 2) - 1;
  return Array.from({ length: steps + 1 }, (_, index) =>
    index === steps ? peakPowerRpm : Math.round(fullBoostRpm + ((peakPowerRpm - fullBoostRpm) * index) / steps),
  );
}

export interface EngineConditions {
  displacementL: number;
  bsfc: number;
  afr: number;
  volumetricEfficiency: number;
  ambient: AbsoluteKpa;
  inletTempK: number;
  chargeLossPsi: number;
  inletLossPsi: number;
  compressorEfficiency: number;
  intercoolerEffectiveness: number;
  manifoldTempK?: number;
}

/** One engine operating point, through the whole chain: power → airflow → MAP ⇄ temperatures → corrected flow. */
export function engineOperatingPoint(conditions: EngineConditions, rpm: number, powerHp: number): OperatingPoint {
  const airflowLbMin = airflowLbMinFromPower(powerHp, conditions.bsfc, conditions.afr);
  const state = solveChargeState({
    airflowLbMin,
    displacementL: conditions.displacementL,
    rpm,
    volumetricEfficiency: conditions.volumetricEfficiency,
    ambient: conditions.ambient,
    inletTempK: conditions.inletTempK,
    chargeLossPsi: conditions.chargeLossPsi,
    inletLossPsi: conditions.inletLossPsi,
    compressorEfficiency: conditions.compressorEfficiency,
    intercoolerEffectiveness: conditions.intercoolerEffectiveness,
    ...(conditions.manifoldTempK === undefined ? {} : { manifoldTempK: conditions.manifoldTempK }),
  });
  const inlet = compressorInletKpa(conditions.ambient, conditions.inletLossPsi);
  return {
    rpm,
    powerHp,
    airflowLbMin,
    correctedFlowLbMin: correctedFlowLbMin(airflowLbMin, conditions.inletTempK, inlet),
    pressureRatio: state.pressureRatio,
    manifoldPressureKpa: state.manifold,
    boostPsi: absoluteKpaToGaugePsi(absoluteKpa(state.manifold), conditions.ambient),
    manifoldTempC: kelvinToCelsius(state.manifoldTempK),
    compressorOutletC: kelvinToCelsius(state.compressorOutletK),
  };
}

/** The engine's line across the rev range, full boost first, peak power last. */
export function operatingLine(
  conditions: EngineConditions,
  peakPowerHp: number,
  peakPowerRpm: number,
  fullBoostRpm: number,
  count = OPERATING_LINE_POINTS,
): OperatingPoint[] {
  return operatingLineRpms(fullBoostRpm, peakPowerRpm, count).map((rpm) => {
    const breathing = relativeTorqueAt(rpm, fullBoostRpm, peakPowerRpm) / TORQUE_AT_PEAK_POWER_SHARE;
    const atRpm = { ...conditions, volumetricEfficiency: conditions.volumetricEfficiency * breathing };
    return engineOperatingPoint(atRpm, rpm, powerHpAt(rpm, peakPowerHp, fullBoostRpm, peakPowerRpm));
  });
}
