import { z } from 'zod';
import { SCAN_KINDS } from '../scan-code';
import { GtinSchema } from './parts';

/** GET /api/warehouse/scan?code=&accepts=part,bin — what a scan field sends: the code as typed and the kinds it takes. */
export const ScanQuerySchema = z.object({
  code: z.string().max(60, 'that is too long for any of our labels'),
  accepts: z
    .string()
    .optional()
    .transform((v, ctx) => {
      const kinds = (v ?? SCAN_KINDS.join(',')).split(',').map((k) => k.trim()).filter(Boolean);
      const unknown = kinds.filter((k) => !(SCAN_KINDS as readonly string[]).includes(k));
      if (unknown.length > 0 || kinds.length === 0) {
        ctx.addIssue({ code: 'custom', message: `accepts is a list of ${SCAN_KINDS.join(', ')}` });
        return z.NEVER;
      }
      return [...new Set(kinds)] as Array<(typeof SCAN_KINDS)[number]>;
    }),
});

export const ScannedPartSchema = z.object({ partNumber: z.string(), title: z.string(), gtin: GtinSchema, status: z.string() });

/** What a scan resolved to. `via` says which of the part's codes was scanned. */
export const ScanReplySchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('part'), code: z.string(), via: z.enum(['gtin', 'part-number', 'cross-reference', 'superseded']), part: ScannedPartSchema }),
  z.object({ kind: z.literal('bin'), code: z.string(), bin: z.object({ code: z.string(), zone: z.string() }) }),
  z.object({ kind: z.literal('return'), code: z.string(), return: z.object({ id: z.number().int(), reference: z.string(), status: z.string() }) }),
  z.object({ kind: z.literal('service'), code: z.string(), service: z.object({ id: z.number().int(), reference: z.string(), status: z.string() }) }),
  z.object({ kind: z.literal('unit'), code: z.string(), unit: z.object({ id: z.number().int(), serial: z.string(), frameCode: z.string().nullable() }) }),
]);
export type ScanReply = z.infer<typeof ScanReplySchema>;
