import { kgPerSToLbPerMin, litresToCubicMetres, type AbsoluteKpa } from '../units';
import { compressorOutletTempK } from './compressor-outlet';
import { R_AIR_J_PER_KG_K } from './gas';
import { intercoolerOutletTempK } from './intercooler';
import { relativeTorqueAt, TORQUE_AT_PEAK_POWER_SHARE } from './operating-line';

/** The engine and its surroundings as the matching needs them, all resolved to SI-ish units. */
export interface EngineModel {
  displacementL: number;
  /** At peak power; the mid-range breathes better along the torque curve (operating-line.ts). */
  volumetricEfficiency: number;
  peakRpm: number;
  fullBoostRpm: number;
  ambient: AbsoluteKpa;
  inletTempK: number;
  /** Compressor inlet: ambient less the intake loss. */
  inletKpa: number;
  chargeLossKpa: number;
  intercoolerEffectiveness: number;
  /** A manifold temperature the buyer stated. */
  manifoldTempK: number | null;
  afr: number;
  t3K: number;
  p4Kpa: number;
  turbineEfficiency: number;
  /** The compressor efficiency assumed before a frame's own map is read. */
  assumedEfficiency: number;
}

export interface EngineState {
  rpm: number;
  pressureRatio: number;
  /** Absolute. */
  manifoldKpa: number;
  compressorOutletK: number;
  manifoldTempK: number;
  airflowLbMin: number;
  efficiency: number;
}

export function volumetricEfficiencyAt(engine: EngineModel, rpm: number): number {
  return (engine.volumetricEfficiency * relativeTorqueAt(rpm, engine.fullBoostRpm, engine.peakRpm)) / TORQUE_AT_PEAK_POWER_SHARE;
}

/**
 * The engine at an rpm with the compressor at a pressure ratio and efficiency: outlet temperature, the charge
 * cooler, manifold pressure and the air the cylinders take by speed density (four-stroke: one intake stroke per
 * two revolutions, Heywood §2.10).
 */
export function engineStateAt(engine: EngineModel, rpm: number, pressureRatio: number, efficiency: number): EngineState {
  const compressorOutletK = compressorOutletTempK(engine.inletTempK, Math.max(pressureRatio, 1), efficiency);
  const manifoldTempK = engine.manifoldTempK ?? intercoolerOutletTempK(compressorOutletK, engine.inletTempK, engine.intercoolerEffectiveness);
  const manifoldKpa = Math.max(pressureRatio * engine.inletKpa - engine.chargeLossKpa, 1);
  const sweptM3PerS = volumetricEfficiencyAt(engine, rpm) * litresToCubicMetres(engine.displacementL) * (rpm / 120);
  const airflowKgS = (manifoldKpa * 1000 * sweptM3PerS) / (R_AIR_J_PER_KG_K * manifoldTempK);
  return { rpm, pressureRatio, manifoldKpa, compressorOutletK, manifoldTempK, airflowLbMin: kgPerSToLbPerMin(airflowKgS), efficiency };
}
