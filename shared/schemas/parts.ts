import { FRAME_CODE_EXAMPLE, FRAME_CODE_PATTERN } from '../part-number';
import { z } from 'zod';
import { isValidGtin13 } from '../gtin';
import { PART_CONDITIONS } from '../allowed-values';
import { BEARINGS, CATEGORY_SLUGS, PART_STATUSES } from '../catalog';
import { HP_FILTER_MAX, PAGE_MAX, PAGE_SIZE_MAX, PART_SORTS, QUERY_MAX_LENGTH } from '../parts-query';

export { PAGE_SIZE_DEFAULT, PAGE_SIZE_MAX, PART_SORTS, QUERY_MAX_LENGTH } from '../parts-query';

const optionalNumber = (label: string, min: number, max: number) =>
  z.coerce
    .number({ error: `${label} must be a number` })
    .int(`${label} must be a whole number`)
    .min(min, `${label} must be at least ${min}`)
    .max(max, `${label} must be at most ${max}`)
    .optional();

export const PartsQuerySchema = z
  .object({
    q: z.string().trim().max(QUERY_MAX_LENGTH, `search must be at most ${QUERY_MAX_LENGTH} characters`).optional(),
    category: z.enum(CATEGORY_SLUGS, { error: `category must be one of ${CATEGORY_SLUGS.join(', ')}` }).optional(),
    frame: z.string().trim().regex(FRAME_CODE_PATTERN, `frame must be a frame code of three letters, such as ${FRAME_CODE_EXAMPLE}`).optional(),
    bearing: z.enum(BEARINGS, { error: 'bearing must be journal or ball' }).optional(),
    minHp: optionalNumber('minimum power', 0, HP_FILTER_MAX),
    maxHp: optionalNumber('maximum power', 0, HP_FILTER_MAX),
    inStock: z.enum(['true', 'false'], { error: 'inStock must be true or false' }).transform((v) => v === 'true').optional(),
    sort: z.enum(PART_SORTS, { error: `sort must be one of ${PART_SORTS.join(', ')}` }).optional(),
    page: optionalNumber('page', 1, PAGE_MAX),
    pageSize: optionalNumber('page size', 1, PAGE_SIZE_MAX),
  })
  .refine((v) => v.minHp === undefined || v.maxHp === undefined || v.minHp <= v.maxHp, {
    message: 'minimum power must not be above maximum power',
    path: ['minHp'],
  });
export type PartsQuery = z.infer<typeof PartsQuerySchema>;

export const SpecsSchema = z.object({
  compressorAr: z.number().nullable(),
  turbineAr: z.number().nullable(),
  trimPct: z.number().nullable(),
  inducerMm: z.number().nullable(),
  exducerMm: z.number().nullable(),
  flangePattern: z.string().nullable(),
  inletMm: z.number().nullable(),
  outletMm: z.number().nullable(),
  material: z.string().nullable(),
  bearing: z.enum(BEARINGS).nullable(),
  wastegate: z.string().nullable(),
  cooling: z.string().nullable(),
  gaugeType: z.string().nullable(),
  rangeText: z.string().nullable(),
  mounting: z.string().nullable(),
  connection: z.string().nullable(),
});
export type Specs = z.infer<typeof SpecsSchema>;

/** The specs a line needs for its drawing (shared/part-illustration.ts), sent where lines carry no full specs. */
export const IllustrationSpecsSchema = SpecsSchema.pick({ mounting: true });

/** Stored name of a part's first uploaded photo (served at /api/parts/photos/:name), or null for none. */
export const PhotoNameSchema = z.string().nullable();

export const StockStateSchema = z.enum(['in-stock', 'low', 'out-of-stock', 'discontinued']);

export const MatchReasonSchema = z.object({ kind: z.string(), text: z.string() });

/** A part's GTIN-13: 13 digits, the last the GS1 check digit (shared/gtin.ts). */
export const GtinSchema = z.string().refine(isValidGtin13, 'a GTIN is 13 digits ending in its check digit');

export const PartSummarySchema = z.object({
  partNumber: z.string(),
  gtin: GtinSchema,
  title: z.string(),
  category: z.enum(CATEGORY_SLUGS),
  frameCode: z.string().nullable(),
  status: z.enum(PART_STATUSES),
  condition: z.enum(PART_CONDITIONS),
  priceCents: z.number().int(),
  coreDepositCents: z.number().int(),
  weightGrams: z.number().int(),
  supersededBy: z.string().nullable(),
  stock: z.object({ available: z.number().int(), state: StockStateSchema }),
  specs: SpecsSchema,
  photo: PhotoNameSchema,
  matched: z.array(MatchReasonSchema).optional(),
});
export type PartSummary = z.infer<typeof PartSummarySchema>;

const FacetSchema = z.array(z.object({ value: z.string(), label: z.string(), count: z.number().int() }));
export const PartsListResponseSchema = z.object({
  items: z.array(PartSummarySchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  facets: z.object({ category: FacetSchema, frame: FacetSchema, bearing: FacetSchema, stock: FacetSchema }),
});
export type PartsListResponse = z.infer<typeof PartsListResponseSchema>;

export const PartDetailSchema = PartSummarySchema.extend({
  description: z.string(),
  images: z.array(z.string()),
  frame: z
    .object({ code: z.string(), name: z.string(), powerBandHp: z.tuple([z.number(), z.number()]), maxShaftRpm: z.number(), flangePattern: z.string() })
    .nullable(),
  crossReferences: z.array(z.object({ number: z.string(), source: z.string().nullable() })),
  earlierNumbers: z.array(z.string()),
  replacement: PartSummarySchema.omit({ matched: true }).nullable(),
  goesWith: z.array(PartSummarySchema.omit({ matched: true })),
  stockByBin: z.array(z.object({ binCode: z.string(), onHand: z.number().int(), reserved: z.number().int() })).optional(),
});
export type PartDetail = z.infer<typeof PartDetailSchema>;

export const FrameSummarySchema = z.object({
  code: z.string(),
  name: z.string(),
  powerBandHp: z.tuple([z.number(), z.number()]),
  maxFlowLbMin: z.number(),
  flowReference: z.object({ temperatureK: z.number(), pressureKpa: z.number() }),
  maxPressureRatio: z.number(),
  maxShaftRpm: z.number(),
  inducerMm: z.number(),
  exducerMm: z.number(),
  trimPct: z.number(),
  weightKg: z.number(),
  flangePattern: z.string(),
  bearingOptions: z.array(z.enum(BEARINGS)),
});
export type FrameSummary = z.infer<typeof FrameSummarySchema>;
export const FramesResponseSchema = z.object({ items: z.array(FrameSummarySchema) });
export type FramesResponse = z.infer<typeof FramesResponseSchema>;

/** A frame's page (GET /api/frames/:code): its data, what the catalogue sells for it, and the parts themselves. */
export const FrameDetailSchema = FrameSummarySchema.extend({
  turbineWheelMm: z.number(),
  /** The A/Rs of the housings on sale for the frame, smallest first. */
  compressorArOptions: z.array(z.number()),
  turbineArOptions: z.array(z.number()),
  /** The frame's parts on sale, superseded numbers left out, in the catalogue's order. */
  parts: z.array(PartSummarySchema.omit({ matched: true })),
});
export type FrameDetail = z.infer<typeof FrameDetailSchema>;

/** Search as you type: a few parts for what is typed so far (GET /api/parts/suggest?q=). */
export const SUGGEST_LIMIT = 8;
export const SuggestQuerySchema = z.object({ q: z.string().trim().min(1, 'type something to search for').max(QUERY_MAX_LENGTH) });
export const PartSuggestionSchema = z.object({
  partNumber: z.string(),
  title: z.string(),
  status: z.enum(PART_STATUSES),
  supersededBy: z.string().nullable(),
  /** Why it came up, in words ("Cross-reference IX 354-3110"). */
  reason: z.string(),
  /** The number typed, when it is exactly this part's number or one of its aliases. */
  exact: z.boolean(),
});
export type PartSuggestion = z.infer<typeof PartSuggestionSchema>;
export const PartSuggestionsSchema = z.object({ q: z.string(), items: z.array(PartSuggestionSchema), total: z.number().int() });
export type PartSuggestions = z.infer<typeof PartSuggestionsSchema>;
