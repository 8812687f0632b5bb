import { z } from 'zod';
import { GtinSchema } from './parts';

/** At most this many labels in one request (20 sheets of part labels). */
export const LABELS_MAX = 480;
export const LABEL_COPIES_MAX = 50;

/** Part labels per A4 sheet (3 × 8 of 70 × 37 mm, a common A4 label stock) and bin labels (2 × 8 of 105 × 37 mm). */
export const PART_LABELS_PER_SHEET = { columns: 3, rows: 8 } as const;
export const BIN_LABELS_PER_SHEET = { columns: 2, rows: 8 } as const;

const list = (what: string, max: number) =>
  z
    .string()
    .max(2000)
    .optional()
    .transform((v) => (v ?? '').split(/[\s,;]+/).map((s) => s.trim()).filter(Boolean))
    .refine((v) => v.length <= max, `at most ${max} ${what}`);

/**
 * GET /api/warehouse/labels — what to print. `parts` is a list of part numbers (or GTINs), each optionally with its
 * own count as "FUL-20-0203*3"; `receipts` goods-in receipt numbers (GI-123 or 123); `binFrom`/`binTo` a range of bins
 * in walk order; `copies` how many of each label.
 */
export const LabelQuerySchema = z.object({
  parts: list('part numbers', 100),
  receipts: list('receipts', 50),
  binFrom: z.string().trim().max(12).optional(),
  binTo: z.string().trim().max(12).optional(),
  copies: z.coerce.number({ error: 'copies must be a number' }).int('copies must be a whole number').min(1, 'at least 1 copy').max(LABEL_COPIES_MAX, `at most ${LABEL_COPIES_MAX} copies`).optional(),
});
export type LabelQuery = z.infer<typeof LabelQuerySchema>;

export const PartLabelSchema = z.object({
  partNumber: z.string(),
  shortName: z.string(),
  gtin: GtinSchema,
  binCode: z.string().nullable(),
  copies: z.number().int(),
  /** EAN-13 of the GTIN with its digits, drawn by the server. */
  barcodeSvg: z.string(),
});
export type PartLabel = z.infer<typeof PartLabelSchema>;

export const BinLabelSchema = z.object({
  code: z.string(),
  zone: z.string(),
  copies: z.number().int(),
  /** Code 128 of the bin code, drawn by the server. */
  barcodeSvg: z.string(),
});
export type BinLabel = z.infer<typeof BinLabelSchema>;

export const LabelSheetSchema = z.object({
  parts: z.array(PartLabelSchema),
  bins: z.array(BinLabelSchema),
  /** Labels in all, copies counted. */
  total: z.number().int(),
  /** Problems with what was asked for, one per item (unknown part, receipt not found); the rest is still printed. */
  problems: z.array(z.string()),
});
export type LabelSheet = z.infer<typeof LabelSheetSchema>;

/** "GI-123", "gi 123" and "123" are the same goods-in receipt. */
export function normalizeReceipt(raw: string): number | null {
  const m = /^\s*(?:GI[\s-]*)?(\d{1,9})\s*$/i.exec(raw);
  return m ? Number(m[1]) : null;
}
export const formatReceipt = (id: number) => `GI-${id}`;

/** A title cut to fit a label's line at a word, with an ellipsis where it was cut. */
export function shortName(title: string, max = 44): string {
  if (title.length <= max) return title;
  const cut = title.slice(0, max - 1);
  const at = cut.lastIndexOf(' ');
  return `${(at > max / 2 ? cut.slice(0, at) : cut).replace(/[\s,;:(-]+$/, '')}…`;
}
