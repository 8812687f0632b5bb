import { z } from 'zod';
import { PART_CONDITIONS } from '../allowed-values';
import { CATEGORY_SLUGS, PART_STATUSES } from '../catalog';
import { GtinSchema, SpecsSchema } from './parts';

/** A part as the office edits it: the form's fields plus photos, links and what supersedes it. Read leniently: old rows may predate today's form rules. */
export const AdminPartSchema = z.object({
  partNumber: z.string(),
  /** Given by the shop (shared/gtin.ts), shown read-only. */
  gtin: GtinSchema,
  title: z.string(),
  category: z.enum(CATEGORY_SLUGS),
  frameCode: z.string().nullable(),
  condition: z.enum(PART_CONDITIONS),
  status: z.enum(PART_STATUSES),
  priceCents: z.number().int(),
  coreDepositCents: z.number().int(),
  weightGrams: z.number().int(),
  minStock: z.number().int(),
  description: z.string(),
  specs: SpecsSchema.partial(),
  images: z.array(z.string()),
  goesWith: z.array(z.string()),
  supersededBy: z.string().nullable(),
});
export type AdminPart = z.infer<typeof AdminPartSchema>;

export const CreatedPartSchema = z.object({ partNumber: z.string() });
export const PartPhotosSchema = z.object({ images: z.array(z.string()) });
/** Replies whose body the client does not read. */
export const AnyReplySchema = z.unknown();
