import { and, asc, between, eq, inArray } from 'drizzle-orm';
import type { Db } from '../db/client';
import { bins, parts, stock, stockMovements } from '../db/schema';
import { gtinForPart } from '../../shared/gtin';
import { normalizeBinCode } from '../../shared/scan-code';
import { formatReceipt, LABELS_MAX, normalizeReceipt, shortName, type BinLabel, type LabelQuery, type LabelSheet, type PartLabel } from '../../shared/schemas/labels';
import { ean13Svg, code128Svg } from './barcodes';
import { InvalidError, NotFoundError } from './errors';
import { resolveScan } from './scan';

/**
 * Label sheets for the Floor: part labels (EAN-13 of the GTIN, part number, short name, bin) and bin labels (Code 128
 * of the bin code). Parts come by number or GTIN, or from goods-in receipts (one label per unit received, in the bin
 * it went to); bins by a range in walk order. Unknown items are named in `problems`, the rest still printed.
 */
export function createLabelService(db: Db) {
  const firstBin = (partId: number) =>
    db.select({ binCode: stock.binCode }).from(stock).innerJoin(bins, eq(bins.code, stock.binCode)).where(eq(stock.partId, partId)).orderBy(asc(bins.walkOrder)).limit(1).get()?.binCode ?? null;

  const partById = (id: number) => db.select({ id: parts.id, partNumber: parts.partNumber, title: parts.title, gtin: parts.gtin }).from(parts).where(eq(parts.id, id)).get();

  async function sheet(query: LabelQuery): Promise<LabelSheet> {
    const copies = query.copies ?? 1;
    const problems: string[] = [];
    const wanted: Array<{ partId: number; binCode: string | null; copies: number }> = [];

    for (const item of query.parts) {
      // "FUL-20-0203*3": three of this one.
      const m = /^(.+?)(?:[*x×](\d{1,3}))?$/i.exec(item);
      const code = m?.[1] ?? item;
      const own = m?.[2] ? Number(m[2]) : copies;
      try {
        const found = resolveScan(db, code, ['part']);
        const p = db.select({ id: parts.id }).from(parts).where(eq(parts.partNumber, found.part.partNumber)).get()!;
        wanted.push({ partId: p.id, binCode: firstBin(p.id), copies: Math.max(1, own) });
      } catch (err) {
        if (err instanceof InvalidError || err instanceof NotFoundError) problems.push(`${code}: ${err.message}`);
        else throw err;
      }
    }

    const receipts = query.receipts.map((r) => ({ raw: r, id: normalizeReceipt(r) }));
    for (const r of receipts.filter((x) => x.id === null)) problems.push(`${r.raw}: a goods-in receipt reads like GI-123`);
    const ids = receipts.flatMap((r) => (r.id === null ? [] : [r.id]));
    if (ids.length > 0) {
      const moves = db
        .select({ id: stockMovements.id, partId: stockMovements.partId, binCode: stockMovements.binCode, units: stockMovements.onHandDelta })
        .from(stockMovements)
        .where(and(inArray(stockMovements.id, ids), eq(stockMovements.kind, 'goods-in')))
        .all();
      const byId = new Map(moves.map((mv) => [mv.id, mv]));
      for (const id of ids) {
        const mv = byId.get(id);
        if (!mv) problems.push(`${formatReceipt(id)}: no goods-in receipt with that number`);
        // One label per unit received, in the bin it went into.
        else wanted.push({ partId: mv.partId, binCode: mv.binCode, copies: Math.max(1, mv.units) * copies });
      }
    }

    let binRows: Array<{ code: string; zone: string }> = [];
    if (query.binFrom || query.binTo) {
      const from = normalizeBinCode(query.binFrom ?? query.binTo ?? '');
      const to = normalizeBinCode(query.binTo ?? query.binFrom ?? '');
      const walk = (code: string | null) => (code ? db.select({ walk: bins.walkOrder }).from(bins).where(eq(bins.code, code)).get()?.walk : undefined);
      const a = walk(from);
      const b = walk(to);
      if (a === undefined || b === undefined) {
        const missing = a === undefined ? (query.binFrom ?? '') : (query.binTo ?? '');
        throw new InvalidError(`No bin ${missing}: bin codes look like A-01-2`, { [a === undefined ? 'binFrom' : 'binTo']: [`no bin ${missing}`] });
      }
      binRows = db
        .select({ code: bins.code, zone: bins.zone })
        .from(bins)
        .where(between(bins.walkOrder, Math.min(a, b), Math.max(a, b)))
        .orderBy(asc(bins.walkOrder))
        .all();
    }

    const total = wanted.reduce((s, w) => s + w.copies, 0) + binRows.length * copies;
    if (total > LABELS_MAX) throw new InvalidError(`That is ${total} labels; print at most ${LABELS_MAX} at a time`, { copies: [`at most ${LABELS_MAX} labels at a time`] });

    const partLabels: PartLabel[] = [];
    for (const w of wanted) {
      const p = partById(w.partId)!;
      const gtin = p.gtin ?? gtinForPart(p.id);
      partLabels.push({ partNumber: p.partNumber, shortName: shortName(p.title), gtin, binCode: w.binCode, copies: w.copies, barcodeSvg: await ean13Svg(gtin) });
    }
    const binLabels: BinLabel[] = [];
    for (const b of binRows) binLabels.push({ code: b.code, zone: b.zone, copies, barcodeSvg: await code128Svg(b.code, { heightMm: 12 }) });
    if (partLabels.length === 0 && binLabels.length === 0 && problems.length === 0) {
      throw new InvalidError('Choose what to print: part numbers, a goods-in receipt or a range of bins', { parts: ['give at least one part, receipt or bin'] });
    }
    return { parts: partLabels, bins: binLabels, total, problems };
  }

  return { sheet };
}
export type LabelService = ReturnType<typeof createLabelService>;
