import { FRAME_CODE_EXAMPLE, FRAME_CODE_PATTERN, PART_NUMBER_EXAMPLE, PART_NUMBER_PATTERN } from '../part-number';
import { z } from 'zod';
import { AUDIT_ACTIONS, EDITABLE_PART_STATUSES, PART_CONDITIONS, PRICE_IMPORT_STATUSES } from '../allowed-values';
import { MAX_MAX_CHANGE_PCT, MIN_MAX_CHANGE_PCT, PRICE_FLAGS } from '../price-import-flags';
import { BEARINGS, CATEGORY_SLUGS } from '../catalog';

export const PART_PHOTO_MAX_BYTES = 3_000_000;
export const PRICE_IMPORT_MAX_BYTES = 5_000_000;
export const PRICE_IMPORT_MAX_ROWS = 60_000;

const optionalNumber = (label: string, min: number, max: number) =>
  z.number({ error: `${label} must be a number` }).min(min, `${label} must be at least ${min}`).max(max, `${label} must be at most ${max}`).nullable().optional();
const optionalText = (max = 80) => z.string().trim().max(max).nullable().optional();

export const PartSpecsFormSchema = z.object({
  compressorAr: optionalNumber('compressor A/R', 0.2, 2),
  turbineAr: optionalNumber('turbine A/R', 0.2, 2.5),
  trimPct: optionalNumber('trim', 20, 80),
  inducerMm: optionalNumber('inducer', 10, 200),
  exducerMm: optionalNumber('exducer', 10, 250),
  flangePattern: optionalText(),
  inletMm: optionalNumber('inlet', 5, 300),
  outletMm: optionalNumber('outlet', 5, 300),
  material: optionalText(),
  bearing: z.enum(BEARINGS).nullable().optional(),
  wastegate: optionalText(),
  cooling: optionalText(),
  gaugeType: optionalText(),
  rangeText: optionalText(),
  mounting: optionalText(),
  connection: optionalText(),
});

export const PartFormSchema = z
  .object({
    partNumber: z
      .string()
      .trim()
      .toUpperCase()
      .regex(PART_NUMBER_PATTERN, `part number in our numbering: frame code, category group and line, serial, e.g. ${PART_NUMBER_EXAMPLE} (add -XCH for an exchange unit)`),
    title: z.string().trim().min(5, 'title is too short').max(140, 'title is too long'),
    category: z.enum(CATEGORY_SLUGS, { error: 'choose a category' }),
    frameCode: z.string().trim().regex(FRAME_CODE_PATTERN, `frame code of three letters, such as ${FRAME_CODE_EXAMPLE}`).nullable(),
    condition: z.enum(PART_CONDITIONS),
    status: z.enum(EDITABLE_PART_STATUSES),
    priceCents: z.number().int('price must be whole cents').min(1, 'price must be above 0').max(100_000_000),
    coreDepositCents: z.number().int().min(0).max(10_000_000),
    weightGrams: z.number().int('weight must be whole grams').min(1, 'weight must be above 0').max(200_000, 'weight must be at most 200 kg'),
    minStock: z.number().int().min(0).max(10_000),
    description: z.string().trim().max(2000),
    specs: PartSpecsFormSchema,
  })
  .refine((p) => p.condition === 'exchange' || p.coreDepositCents === 0, { message: 'only exchange units carry a core deposit', path: ['coreDepositCents'] })
  .refine((p) => p.condition === 'new' || p.coreDepositCents > 0, { message: 'an exchange unit needs a core deposit', path: ['coreDepositCents'] })
  .refine((p) => !(p.specs.inducerMm && p.specs.exducerMm) || p.specs.inducerMm < p.specs.exducerMm, {
    message: 'the inducer is smaller than the exducer',
    path: ['specs', 'inducerMm'],
  });
export type PartForm = z.infer<typeof PartFormSchema>;

export const SupersedeSchema = z.object({ replacedBy: z.string().trim().min(2, 'enter the part number that replaces it').max(40) });
export const PartLinksSchema = z.object({ partNumbers: z.array(z.string().trim().min(2).max(40)).max(30, 'at most 30 parts go with one part') });

export const PriceImportRowSchema = z.object({
  row: z.number().int(),
  partNumber: z.string(),
  status: z.enum(['new', 'changed', 'unchanged', 'error']),
  oldPriceCents: z.number().int().nullable(),
  newPriceCents: z.number().int().nullable(),
  title: z.string().nullable(),
  message: z.string().nullable(),
  input: z.record(z.string(), z.string()),
  /** The core deposit before, and the one the file sets (null where it leaves it as it is). */
  oldCoreCents: z.number().int().nullable().optional(),
  newCoreCents: z.number().int().nullable().optional(),
  /** What looks wrong enough to need a person's look before applying, and what each flag saw. */
  flags: z.array(z.enum(PRICE_FLAGS)).optional(),
  flagNotes: z.array(z.string()).optional(),
});
export type PriceImportRow = z.infer<typeof PriceImportRowSchema>;

export const PriceImportSchema = z.object({
  id: z.number().int(),
  fileName: z.string(),
  status: z.enum(PRICE_IMPORT_STATUSES),
  counts: z.object({ new: z.number().int(), changed: z.number().int(), unchanged: z.number().int(), error: z.number().int() }),
  /** Flagged rows, and of those how many still wait for an acknowledgement. */
  flagged: z.number().int(),
  unacknowledged: z.number().int(),
  maxChangePct: z.number().int(),
  rows: z.array(PriceImportRowSchema.extend({ acknowledged: z.boolean() })),
  totalRows: z.number().int(),
  createdAt: z.string(),
  createdBy: z.string(),
  appliedAt: z.string().nullable(),
  appliedBy: z.string().nullable(),
});
export type PriceImport = z.infer<typeof PriceImportSchema>;

/** A corrected row: the same columns as the file. */
export const PriceImportFixSchema = z.object({ input: z.record(z.string(), z.string().max(200)) });

export const PriceImportSettingsSchema = z.object({
  maxChangePct: z
    .number({ error: 'enter a percentage' })
    .int('a whole percentage')
    .min(MIN_MAX_CHANGE_PCT, `at least ${MIN_MAX_CHANGE_PCT} %`)
    .max(MAX_MAX_CHANGE_PCT, `at most ${MAX_MAX_CHANGE_PCT} %`),
});
export type PriceImportSettings = z.infer<typeof PriceImportSettingsSchema>;

/** Acknowledge (or take back) flagged rows: some by row number, or every flagged row at once. */
export const PriceImportAcknowledgeSchema = z.union([
  z.object({ rows: z.array(z.number().int()).min(1).max(60_000), acknowledged: z.boolean() }),
  z.object({ allFlagged: z.literal(true), acknowledged: z.boolean() }),
]);
export type PriceImportAcknowledge = z.infer<typeof PriceImportAcknowledgeSchema>;

/** Applying says what the person confirmed, so a list that changed meanwhile is not applied on an old look. */
export const PriceImportApplySchema = z.object({ expectChanges: z.number().int().min(0).optional() });

export const PriceImportSummarySchema = z.object({
  id: z.number().int(),
  fileName: z.string(),
  status: z.enum(PRICE_IMPORT_STATUSES),
  createdAt: z.string(),
  createdBy: z.string(),
  appliedAt: z.string().nullable(),
  appliedBy: z.string().nullable(),
  totalRows: z.number().int(),
  changedCount: z.number().int(),
  newCount: z.number().int(),
  flaggedCount: z.number().int(),
});
export type PriceImportSummary = z.infer<typeof PriceImportSummarySchema>;
export const PRICE_IMPORT_HISTORY_PAGE = 20;
export const PriceImportHistorySchema = z.object({ items: z.array(PriceImportSummarySchema), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });
export type PriceImportHistory = z.infer<typeof PriceImportHistorySchema>;

export const AUDIT_PAGE_SIZE = 50;
const isoDay = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'a date as YYYY-MM-DD')
  .optional();
export const AuditQuerySchema = z.object({
  part: z.string().trim().max(40).optional(),
  user: z.string().trim().max(120).optional(),
  from: isoDay,
  to: isoDay,
  /** One price import's entries. */
  import: z.coerce.number().int().min(1).optional(),
  page: z.coerce.number().int().min(1).max(100_000).default(1),
});
export type AuditQuery = z.infer<typeof AuditQuerySchema>;
export const AuditEntrySchema = z.object({
  id: z.number().int(),
  createdAt: z.string(),
  user: z.string(),
  userEmail: z.string(),
  action: z.enum(AUDIT_ACTIONS),
  partNumber: z.string().nullable(),
  priceImportId: z.number().int().nullable(),
  priceImportFile: z.string().nullable(),
  changes: z.record(z.string(), z.object({ from: z.unknown(), to: z.unknown() })),
});
export type AuditEntry = z.infer<typeof AuditEntrySchema>;
export const AuditPageSchema = z.object({ items: z.array(AuditEntrySchema), total: z.number().int(), page: z.number().int(), pageSize: z.number().int() });
export type AuditPage = z.infer<typeof AuditPageSchema>;
