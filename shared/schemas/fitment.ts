import { z } from 'zod';

export const FUELS = ['petrol', 'e85', 'methanol', 'diesel'] as const;
export const APPLICATIONS = ['street', 'circuit', 'drag', 'offroad', 'marine'] as const;
export const VERDICTS = ['fits', 'marginal', 'too-small', 'too-large'] as const;

export type Fuel = (typeof FUELS)[number];
export type Application = (typeof APPLICATIONS)[number];
export type Verdict = (typeof VERDICTS)[number];

/** Input limits: wide enough for any road, race or marine engine the catalogue serves, narrow enough to catch typos. */
export const FITMENT_LIMITS = {
  displacementL: { min: 0.1, max: 20 },
  powerHp: { min: 10, max: 3000 },
  powerKw: { min: 7.5, max: 2237 },
  rpm: { min: 1000, max: 20000 },
  altitudeM: { min: -500, max: 5000 },
  ambientC: { min: -40, max: 60 },
  bsfc: { min: 0.25, max: 1.6 },
  afr: { min: 4, max: 30 },
  volumetricEfficiency: { min: 0.5, max: 1.3 },
  manifoldTempC: { min: -20, max: 200 },
  chargeLossPsi: { min: 0, max: 10 },
  inletLossPsi: { min: 0, max: 5 },
  compressorEfficiency: { min: 0.5, max: 0.85 },
} as const;

type LimitKey = keyof typeof FITMENT_LIMITS;

function ranged(key: LimitKey, label: string, unit: string) {
  const { min, max } = FITMENT_LIMITS[key];
  const range = `${label} must be between ${min} and ${max}${unit}`;
  return z
    .number({ error: (issue) => (issue.input === undefined ? `${label} is required` : `${range}`) })
    .min(min, { error: range })
    .max(max, { error: range });
}

const listOf = (values: readonly string[]) =>
  `${values.slice(0, -1).join(', ')} or ${values[values.length - 1] ?? ''}`;

export const FitmentAssumptionsInputSchema = z.object({
  bsfc: ranged('bsfc', 'BSFC', ' lb/(hp·h)').optional(),
  afr: ranged('afr', 'air-fuel ratio', ':1').optional(),
  volumetricEfficiency: ranged('volumetricEfficiency', 'volumetric efficiency', ' (as a fraction, 0.9 = 90 %)').optional(),
  manifoldTempC: ranged('manifoldTempC', 'manifold temperature', ' °C').optional(),
  chargeLossPsi: ranged('chargeLossPsi', 'charge-side pressure loss', ' psi').optional(),
  inletLossPsi: ranged('inletLossPsi', 'inlet pressure loss', ' psi').optional(),
  compressorEfficiency: ranged('compressorEfficiency', 'compressor efficiency', ' (as a fraction, 0.72 = 72 %)').optional(),
});

export const FitmentRequestSchema = z
  .object({
    displacementL: ranged('displacementL', 'displacement', ' L'),
    powerHp: ranged('powerHp', 'power', ' hp').optional(),
    powerKw: ranged('powerKw', 'power', ' kW').optional(),
    rpm: ranged('rpm', 'peak-power rpm', ' rpm'),
    fuel: z.enum(FUELS, { error: `fuel must be one of ${listOf(FUELS)}` }),
    application: z.enum(APPLICATIONS, { error: `application must be one of ${listOf(APPLICATIONS)}` }),
    altitudeM: ranged('altitudeM', 'altitude', ' m').optional(),
    ambientC: ranged('ambientC', 'inlet air temperature', ' °C').optional(),
    intercooled: z.boolean({ error: 'intercooled must be true or false' }).optional(),
    assumptions: FitmentAssumptionsInputSchema.optional(),
  })
  .superRefine((value, ctx) => {
    if (value.powerHp === undefined && value.powerKw === undefined) {
      ctx.addIssue({ code: 'custom', path: ['powerHp'], message: 'power is required, in hp or kW' });
    }
    if (value.powerHp !== undefined && value.powerKw !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['powerKw'], message: 'give power in hp or in kW, not both' });
    }
  });

export type FitmentRequest = z.infer<typeof FitmentRequestSchema>;
export type FitmentRequestInput = z.input<typeof FitmentRequestSchema>;

/** Every value the computation used, given or defaulted, so the answer can be reproduced. */
export const FitmentAssumptionsSchema = z.object({
  powerHp: z.number(),
  rpm: z.number(),
  displacementL: z.number(),
  fuel: z.enum(FUELS),
  application: z.enum(APPLICATIONS),
  altitudeM: z.number(),
  ambientC: z.number(),
  intercooled: z.boolean(),
  bsfc: z.number(),
  afr: z.number(),
  volumetricEfficiency: z.number(),
  /** The given manifold temperature, or the one the intercooler iteration settled on at peak power. */
  manifoldTempC: z.number(),
  manifoldTempGiven: z.boolean(),
  intercoolerEffectiveness: z.number(),
  chargeLossPsi: z.number(),
  inletLossPsi: z.number(),
  compressorEfficiency: z.number(),
  fullBoostRpm: z.number(),
  /** Names of the values above that came from defaults rather than the request. */
  defaulted: z.array(z.string()),
});

export const FitmentRequiredSchema = z.object({
  airflowLbMin: z.number(),
  airflowKgS: z.number(),
  /** Absolute. */
  manifoldPressureKpa: z.number(),
  /** Gauge, relative to the ambient pressure at the given altitude. */
  boostPsi: z.number(),
  pressureRatio: z.number(),
  correctedFlowLbMin: z.number(),
  compressorOutletC: z.number(),
  manifoldTempC: z.number(),
  ambientPressureKpa: z.number(),
  compressorInletKpa: z.number(),
  /** Power a petrol engine at 1 lb/min per 10 hp would make on this airflow; frames are rated on that basis. */
  petrolEquivalentHp: z.number(),
});

export const OperatingPointSchema = z.object({
  rpm: z.number(),
  correctedFlowLbMin: z.number(),
  pressureRatio: z.number(),
  powerHp: z.number(),
  airflowLbMin: z.number(),
  manifoldPressureKpa: z.number(),
  boostPsi: z.number(),
  manifoldTempC: z.number(),
  compressorOutletC: z.number(),
});

export const MAP_ZONES = ['surge', 'inside', 'choke', 'overspeed', 'above-max-pr'] as const;

export const CandidatePointSchema = z.object({
  rpm: z.number(),
  zone: z.enum(MAP_ZONES),
  /** (W − W_surge)/W at the same pressure ratio; negative means left of the surge line. */
  surgeMarginPct: z.number().nullable(),
  /** (W_limit − W)/W_limit at the same pressure ratio; negative means past choke or the top speed line. */
  chokeMarginPct: z.number().nullable(),
  /** Null past choke, where no shaft speed delivers the flow. */
  shaftRpm: z.number().nullable(),
  shaftSpeedPct: z.number().nullable(),
  efficiency: z.number().nullable(),
});

export const FitmentCandidateSchema = z.object({
  rank: z.number().int(),
  frameCode: z.string(),
  frameName: z.string(),
  verdict: z.enum(VERDICTS),
  reasons: z.array(z.string()),
  /** Highest shaft speed the operating line needs; null when every point is past choke. */
  shaftRpm: z.number().nullable(),
  /** Compressor tip speed at that shaft speed. */
  tipSpeedMs: z.number().nullable(),
  /** Map efficiency at the peak-power point; null where that point is off the map. */
  efficiency: z.number().nullable(),
  maxShaftRpm: z.number(),
  score: z.number(),
  points: z.array(CandidatePointSchema),
});

export const FitmentResponseSchema = z.object({
  assumptions: FitmentAssumptionsSchema,
  required: FitmentRequiredSchema,
  operatingLine: z.array(OperatingPointSchema),
  candidates: z.array(FitmentCandidateSchema),
  cautions: z.array(z.string()),
});

export type FitmentAssumptions = z.infer<typeof FitmentAssumptionsSchema>;
export type FitmentRequired = z.infer<typeof FitmentRequiredSchema>;
export type OperatingPoint = z.infer<typeof OperatingPointSchema>;
export type MapZone = (typeof MAP_ZONES)[number];
export type CandidatePoint = z.infer<typeof CandidatePointSchema>;
export type FitmentCandidate = z.infer<typeof FitmentCandidateSchema>;
export type FitmentResponse = z.infer<typeof FitmentResponseSchema>;
