import { z } from 'zod';
import { kwToHp, litresToCubicInches } from '../units';

import { ABSURD_HP_PER_LITRE, APPLICATIONS, DISPLACEMENT_UNITS, FITMENT_LIMITS, FUELS, VERDICTS, type Application, type DisplacementUnit, type Fuel, type Verdict } from '../fitment/limits';

export { ABSURD_HP_PER_LITRE, APPLICATIONS, DISPLACEMENT_UNITS, FITMENT_LIMITS, FUELS, VERDICTS };
export type { Application, DisplacementUnit, Fuel, Verdict };

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
  fullBoostRpm: ranged('fullBoostRpm', 'full-boost rpm', ' rpm').optional(),
  intercoolerEffectiveness: ranged('intercoolerEffectiveness', 'intercooler effectiveness', ' (as a fraction, 0.75 = 75 %)').optional(),
  cylinders: ranged('cylinders', 'number of cylinders', '').int('number of cylinders must be a whole number').optional(),
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
    /** The unit the buyer typed the displacement in; only used to word a refusal. */
    displacementUnit: z.enum(DISPLACEMENT_UNITS).optional(),
    assumptions: FitmentAssumptionsInputSchema.optional(),
  })
  .superRefine((value, ctx) => {
    const hp = value.powerHp ?? (value.powerKw === undefined ? undefined : kwToHp(value.powerKw));
    const displacementValid = value.displacementL >= FITMENT_LIMITS.displacementL.min && value.displacementL <= FITMENT_LIMITS.displacementL.max;
    if (hp !== undefined && displacementValid && hp / value.displacementL > ABSURD_HP_PER_LITRE) {
      const typed =
        value.displacementUnit === 'in3'
          ? `${Math.round(litresToCubicInches(value.displacementL) * 10) / 10} cubic inches (${value.displacementL.toFixed(2)} L)`
          : `${value.displacementL} L`;
      ctx.addIssue({
        code: 'custom',
        path: ['displacementL'],
        message: `displacement read as ${typed} gives ${Math.round(hp / value.displacementL).toLocaleString('en-US')} hp per litre, beyond any engine (more than ${ABSURD_HP_PER_LITRE}): check the displacement and its unit`,
      });
    }
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
  cylinders: z.number().nullable(),
  /** Turbine inlet temperature and turbine efficiency used for the turbine side. */
  turbineInletC: z.number(),
  turbineEfficiency: z.number(),
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
  /** Power a petrol engine at 1 lb/min per 10 hp would make on this corrected airflow; frames are rated on that basis. */
  petrolEquivalentHp: z.number(),
  /** Fuel flow at peak power: power × BSFC. */
  fuelFlowLbH: z.number(),
  /** With a cylinder count: per injector at the 80 % duty cycle injectors are sized for (common practice). */
  injectorCcMin: z.number().nullable(),
  specificOutputHpPerL: z.number(),
  /** Which efficiency the temperatures above use: the recommended frame's map, or the stated assumption. */
  temperaturesFrom: z.string(),
});

export const LINE_SEGMENTS = ['spool', 'boost'] as const;

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

export const MAP_ZONES = ['surge', 'inside', 'choke', 'overspeed', 'above-max-pr', 'below-map'] as const;

export const CandidatePointSchema = z.object({
  rpm: z.number(),
  /** Spool: boost still rising, wastegate shut; boost: held by the wastegate. */
  segment: z.enum(LINE_SEGMENTS),
  /** Per unit: a twin layout halves each compressor's flow. */
  correctedFlowLbMin: z.number(),
  pressureRatio: z.number(),
  boostPsi: z.number(),
  compressorOutletC: z.number(),
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

export const LAYOUTS = ['single', 'twin'] as const;
export type Layout = (typeof LAYOUTS)[number];

export const TurbineHousingSchema = z.object({
  housingAr: z.number(),
  /** Engine rpm where full boost arrives with this housing; null if it never does below peak-power rpm. */
  fullBoostRpm: z.number().nullable(),
  expansionRatio: z.number(),
  /** Absolute. */
  exhaustManifoldKpa: z.number(),
  /** Exhaust-manifold over intake-manifold pressure at peak power. */
  backPressureRatio: z.number(),
  /** Share of the exhaust through the wastegate at peak power, 0–1. */
  wastegateShare: z.number(),
  recommended: z.boolean(),
  /** Why it is or is not the one recommended, in words with numbers. */
  note: z.string(),
});

export const FitmentCandidateSchema = z.object({
  rank: z.number().int(),
  frameCode: z.string(),
  frameName: z.string(),
  layout: z.enum(LAYOUTS),
  verdict: z.enum(VERDICTS),
  reasons: z.array(z.string()),
  /** Highest shaft speed the operating line needs; null when every point is past choke. */
  shaftRpm: z.number().nullable(),
  /** Compressor tip speed at that shaft speed. */
  tipSpeedMs: z.number().nullable(),
  /** Map efficiency at the peak-power point; null where that point is off the map. */
  efficiency: z.number().nullable(),
  maxShaftRpm: z.number(),
  /** At peak power, as judged on this frame's own map (its efficiency sets the temperatures). */
  pressureRatio: z.number(),
  compressorOutletC: z.number(),
  manifoldTempC: z.number(),
  /** The recommended turbine housing; null when the frame has no housing data. */
  turbine: TurbineHousingSchema.nullable(),
  housings: z.array(TurbineHousingSchema),
  /** Engine rpm where boost starts to build (pressure ratio 1.1) with the recommended housing. */
  boostThresholdRpm: z.number().nullable(),
  score: z.number(),
  points: z.array(CandidatePointSchema),
});

export const FitmentCautionSchema = z.object({ code: z.string(), message: z.string() });
export type FitmentCaution = z.infer<typeof FitmentCautionSchema>;

export const FitmentResponseSchema = z.object({
  assumptions: FitmentAssumptionsSchema,
  required: FitmentRequiredSchema,
  operatingLine: z.array(OperatingPointSchema),
  candidates: z.array(FitmentCandidateSchema),
  /** When no candidate fits: what to change, each naming a number. */
  nextSteps: z.array(z.string()),
  cautions: z.array(FitmentCautionSchema),
});

export type FitmentAssumptions = z.infer<typeof FitmentAssumptionsSchema>;
export type FitmentRequired = z.infer<typeof FitmentRequiredSchema>;
export type OperatingPoint = z.infer<typeof OperatingPointSchema>;
export type MapZone = (typeof MAP_ZONES)[number];
export type CandidatePoint = z.infer<typeof CandidatePointSchema>;
export type FitmentCandidate = z.infer<typeof FitmentCandidateSchema>;
export type TurbineHousing = z.infer<typeof TurbineHousingSchema>;
export type FitmentResponse = z.infer<typeof FitmentResponseSchema>;
