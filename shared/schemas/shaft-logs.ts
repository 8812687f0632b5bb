import { z } from 'zod';
import { FitmentCandidateSchema, OperatingPointSchema } from './fitment';
import { FitmentFrameMapSchema } from './saved-fitments';

/** A logger file may be at most this large; a 10 Hz log of a long session stays well inside it. */
export const SHAFT_LOG_MAX_BYTES = 1_000_000;
/** Data rows per file: about 16 minutes at 10 Hz, more than one session of pulls needs. */
export const SHAFT_LOG_MAX_ROWS = 10_000;
export const SHAFT_LOG_NAME_MAX = 80;
/** Enough to compare sessions on one engine; past it, old logs should be tidied away. */
export const SHAFT_LOGS_PER_CHECK_MAX = 20;
/** Row errors listed back; the count of the rest is still given. */
export const SHAFT_LOG_ERRORS_SHOWN = 50;

/** Boost (gauge) may be logged in any of these; the column's name says which (boost_kpa, boost_psi, boost_bar). */
export const BOOST_UNITS = ['kpa', 'psi', 'bar'] as const;
export type BoostUnit = (typeof BOOST_UNITS)[number];

/**
 * What a row may hold before it is taken as a mistake rather than a measurement. Wide enough for any engine the
 * catalogue serves (fitment limits: up to 20,000 engine rpm; the smallest frame's shaft limit is near 250,000 rpm),
 * narrow enough to catch a wrong column or unit.
 */
export const SHAFT_LOG_LIMITS = {
  /** Seconds since the logger started: at most a day. */
  timeS: { min: 0, max: 86_400 },
  engineRpm: { min: 0, max: 20_000 },
  /** Gauge: full vacuum at sea level to about 65 psi of boost. */
  boostKpa: { min: -100, max: 450 },
  shaftRpm: { min: 0, max: 400_000 },
  /** Charge air in the manifold; without a charge cooler it can pass 150 °C. */
  intakeC: { min: -40, max: 200 },
} as const;

/** One row of a log, with boost converted to kPa gauge whatever unit the file used. */
export const ShaftLogRowSchema = z.object({
  t: z.number().min(SHAFT_LOG_LIMITS.timeS.min).max(SHAFT_LOG_LIMITS.timeS.max),
  engineRpm: z.number().min(SHAFT_LOG_LIMITS.engineRpm.min).max(SHAFT_LOG_LIMITS.engineRpm.max),
  boostKpa: z.number().min(SHAFT_LOG_LIMITS.boostKpa.min).max(SHAFT_LOG_LIMITS.boostKpa.max),
  shaftRpm: z.number().min(SHAFT_LOG_LIMITS.shaftRpm.min).max(SHAFT_LOG_LIMITS.shaftRpm.max),
  intakeC: z.number().min(SHAFT_LOG_LIMITS.intakeC.min).max(SHAFT_LOG_LIMITS.intakeC.max),
});
export type ShaftLogRow = z.infer<typeof ShaftLogRowSchema>;

/** A problem in an uploaded file: `line` is the file's own line number (the header is line 1 unless comments come first). */
export const ShaftLogRowErrorSchema = z.object({
  line: z.number().int().nullable(),
  column: z.string().nullable(),
  message: z.string(),
});
export type ShaftLogRowError = z.infer<typeof ShaftLogRowErrorSchema>;

/** The form fields sent beside the file. */
export const ShaftLogUploadSchema = z.object({
  frameCode: z
    .string({ error: 'choose the frame the log was taken on' })
    .trim()
    .toUpperCase()
    .regex(/^[A-Z0-9]{2,8}$/, 'choose the frame the log was taken on'),
  name: z
    .string()
    .trim()
    .max(SHAFT_LOG_NAME_MAX, `name must be at most ${SHAFT_LOG_NAME_MAX} characters`)
    .optional()
    .transform((v) => (v ? v : undefined)),
});
export type ShaftLogUpload = z.infer<typeof ShaftLogUploadSchema>;

export const ShaftLogSchema = z.object({
  id: z.number().int(),
  savedFitmentId: z.number().int(),
  name: z.string(),
  frameCode: z.string(),
  /** The unit boost was logged in, so it is shown back in the same unit. */
  boostUnit: z.enum(BOOST_UNITS),
  rowCount: z.number().int(),
  durationS: z.number(),
  createdAt: z.string(),
});
export type ShaftLog = z.infer<typeof ShaftLogSchema>;

export const ShaftLogsResponseSchema = z.object({ items: z.array(ShaftLogSchema) });
export type ShaftLogsResponse = z.infer<typeof ShaftLogsResponseSchema>;

export const SPEED_STATES = ['ok', 'near-limit', 'overspeed'] as const;
export type SpeedState = (typeof SPEED_STATES)[number];
/** `above-map`: a pressure ratio above the map's top, where it has no surge line to compare with. */
export const SURGE_STATES = ['clear', 'near-surge', 'surge', 'above-map'] as const;
export type SurgeState = (typeof SURGE_STATES)[number];

/** A logged row placed on the compressor map. */
export const ShaftLogPointSchema = z.object({
  t: z.number(),
  engineRpm: z.number(),
  boostKpa: z.number(),
  shaftRpm: z.number(),
  intakeC: z.number(),
  /** Absolute: ambient at the check's altitude plus the logged boost. */
  manifoldKpa: z.number(),
  pressureRatio: z.number(),
  /** By speed-density from engine rpm, manifold pressure and the logged intake temperature. */
  airflowLbMin: z.number(),
  correctedFlowLbMin: z.number(),
  shaftSpeedPct: z.number(),
  /** Surge flow at this pressure ratio; null above the map's top ratio. */
  surgeFlowLbMin: z.number().nullable(),
  /** (W − W_surge)/W; negative left of the surge line; null where it cannot be said. */
  surgeMarginPct: z.number().nullable(),
  speed: z.enum(SPEED_STATES),
  surge: z.enum(SURGE_STATES),
});
export type ShaftLogPoint = z.infer<typeof ShaftLogPointSchema>;

export const EXCURSION_KINDS = ['overspeed', 'near-limit', 'surge', 'near-surge', 'above-map'] as const;
export type ExcursionKind = (typeof EXCURSION_KINDS)[number];

/** A run of consecutive rows off the safe part of the map, told at its worst row. */
export const ShaftLogExcursionSchema = z.object({
  kind: z.enum(EXCURSION_KINDS),
  fromS: z.number(),
  toS: z.number(),
  durationS: z.number(),
  points: z.number().int(),
  worstAtS: z.number(),
  shaftSpeedPct: z.number(),
  surgeMarginPct: z.number().nullable(),
});
export type ShaftLogExcursion = z.infer<typeof ShaftLogExcursionSchema>;

export const ShaftLogSummarySchema = z.object({
  points: z.number().int(),
  durationS: z.number(),
  maxShaftRpm: z.number(),
  peakShaftRpm: z.number(),
  peakShaftSpeedPct: z.number(),
  peakAtS: z.number(),
  timeOverSpeedS: z.number(),
  timeNearLimitS: z.number(),
  /** Near or in: the time the compressor spent inside the near-surge margin, surging or not. */
  timeNearOrInSurgeS: z.number(),
  timeInSurgeS: z.number(),
  timeAboveMapS: z.number(),
  /** The least surge margin among rows with boost; null when no row could be compared. */
  leastSurgeMarginPct: z.number().nullable(),
  /** Rows below a pressure ratio of 1 (throttle closed, manifold in vacuum): not on a compressor map. */
  pointsBelowMap: z.number().int(),
  nearSurgeMarginPct: z.number(),
  nearLimitPct: z.number(),
  excursions: z.array(ShaftLogExcursionSchema),
  /** Excursions left out of the list above, which is capped. */
  moreExcursions: z.number().int(),
});
export type ShaftLogSummary = z.infer<typeof ShaftLogSummarySchema>;

/** GET one log: its points on the frame's map, the summary, and the check's predicted line on the same frame. */
export const ShaftLogDetailSchema = z.object({
  log: ShaftLogSchema,
  frame: FitmentFrameMapSchema,
  operatingLine: z.array(OperatingPointSchema),
  /** The saved check's verdict on this frame, for the predicted line's zones; null if the frame is no longer ranked. */
  candidate: FitmentCandidateSchema.nullable(),
  points: z.array(ShaftLogPointSchema),
  summary: ShaftLogSummarySchema,
});
export type ShaftLogDetail = z.infer<typeof ShaftLogDetailSchema>;
