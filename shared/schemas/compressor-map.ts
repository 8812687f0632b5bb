import { z } from 'zod';

/** A point on a compressor map: corrected flow (288.15 K, 101.325 kPa) and total pressure ratio. */
export const MapPointSchema = z.object({
  flowLbMin: z.number().nonnegative(),
  pressureRatio: z.number().min(1),
});

export const SpeedLineSchema = z.object({
  rpm: z.number().positive(),
  /** Ordered from the surge end to the choke end (flow rising, pressure ratio falling). */
  points: z.array(MapPointSchema).min(2),
});

export const EfficiencyIslandSchema = z.object({
  /** Isentropic efficiency as a fraction (0.72 = 72 %). */
  efficiency: z.number().gt(0).lt(1),
  /** A closed contour: the last point repeats the first. */
  points: z.array(MapPointSchema).min(4),
});

export const CompressorMapSchema = z.object({
  /** Ordered by rising pressure ratio. */
  surgeLine: z.array(MapPointSchema).min(2),
  /** Ordered by rising pressure ratio; ends where it meets the top speed line. */
  chokeLine: z.array(MapPointSchema).min(2),
  /** Ordered by rising rpm; may be empty, in which case shaft speed comes from the Euler work relation. */
  speedLines: z.array(SpeedLineSchema),
  /** Ordered by rising efficiency, so each island lies inside the one before. */
  efficiencyIslands: z.array(EfficiencyIslandSchema),
  maxPressureRatio: z.number().min(1),
  maxShaftRpm: z.number().positive(),
  peakEfficiency: z.number().gt(0).lt(1).optional(),
  /** Δh₀/U² (slip and backsweep together), used for the Euler relation off the speed lines. */
  workCoefficient: z.number().gt(0).lt(1.2).optional(),
  /** The inlet conditions the corrected flows and speeds refer to. */
  referenceTemperatureK: z.number().positive().default(288.15),
  referencePressureKpa: z.number().positive().default(101.325),
  /** Compressor-wheel material, which sets the tip-speed limit. */
  wheel: z.enum(['cast', 'milled']).optional(),
  tipSpeedLimitMs: z.number().positive().optional(),
});

export type MapPoint = z.infer<typeof MapPointSchema>;
export type SpeedLine = z.infer<typeof SpeedLineSchema>;
export type EfficiencyIsland = z.infer<typeof EfficiencyIslandSchema>;
export type CompressorMap = z.infer<typeof CompressorMapSchema>;
