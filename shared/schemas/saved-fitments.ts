import { z } from 'zod';
import { BEARINGS } from '../catalog';
import { CompressorMapSchema } from './compressor-map';
import { FitmentRequestSchema } from './fitment';

export const SAVED_FITMENT_NAME_MAX = 80;
/** Enough for a busy dealer's quotes; past it the oldest should be tidied away rather than kept for ever. */
export const SAVED_FITMENTS_PER_USER_MAX = 200;

export const SaveFitmentSchema = z.object({
  name: z
    .string({ error: 'name is required' })
    .trim()
    .min(1, 'give the check a name, such as “customer’s 2.0 L street car”')
    .max(SAVED_FITMENT_NAME_MAX, `name must be at most ${SAVED_FITMENT_NAME_MAX} characters`),
  input: FitmentRequestSchema,
});
export type SaveFitment = z.infer<typeof SaveFitmentSchema>;
export type SaveFitmentInput = z.input<typeof SaveFitmentSchema>;

export const SavedFitmentSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  /** The request as it was checked, in the API's own units. */
  input: FitmentRequestSchema,
  summary: z.string(),
  bestFrameCode: z.string().nullable(),
  createdAt: z.string(),
});
export type SavedFitment = z.infer<typeof SavedFitmentSchema>;

export const SavedFitmentsResponseSchema = z.object({ items: z.array(SavedFitmentSchema) });
export type SavedFitmentsResponse = z.infer<typeof SavedFitmentsResponseSchema>;

/** A frame's compressor map as the results chart draws it (GET /api/fitment/frames). */
export const FitmentFrameMapSchema = z.object({
  code: z.string(),
  name: z.string(),
  powerBandHp: z.tuple([z.number(), z.number()]),
  maxShaftRpm: z.number(),
  bearingOptions: z.array(z.enum(BEARINGS)),
  map: CompressorMapSchema,
});
export type FitmentFrameMap = z.infer<typeof FitmentFrameMapSchema>;

export const FitmentFrameMapsResponseSchema = z.object({ items: z.array(FitmentFrameMapSchema) });
export type FitmentFrameMapsResponse = z.infer<typeof FitmentFrameMapsResponseSchema>;
