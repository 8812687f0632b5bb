import { sql } from 'drizzle-orm';
import type { Db } from '../server/db/client';
import { bins, frames, partAliases, partLinks, parts, partSpecs, stock, stockMovements } from '../server/db/schema';
import { itemReferenceOf } from '../shared/gtin';
import { normalizePartNumber } from '../shared/part-number';
import { buildCompressorMap } from '../shared/fitment/compressor-map';
import type { CatalogueSeed } from './generate';

function chunks<T>(rows: T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < rows.length; i += size) out.push(rows.slice(i, i + size));
  return out;
}

export function catalogueIsEmpty(db: Db): boolean {
  const row = db.select({ n: sql<number>`count(*)` }).from(parts).get();
  return (row?.n ?? 0) === 0;
}

/** Writes a generated catalogue into an empty database in one transaction. */
export function loadCatalogue(db: Db, seed: CatalogueSeed): { parts: number } {
  db.transaction((tx) => {
    for (const f of seed.frames) {
      tx.insert(frames)
        .values({
          code: f.code,
          name: f.name,
          inducerMm: f.inducerMm,
          exducerMm: f.exducerMm,
          turbineWheelMm: f.turbineWheelMm,
          powerMinHp: f.powerBandHp[0],
          powerMaxHp: f.powerBandHp[1],
          maxFlowLbMin: f.maxFlowLbMin,
          maxPressureRatio: f.maxPressureRatio,
          maxShaftRpm: f.maxShaftRpm,
          weightKg: f.weightKg,
          flangePattern: f.flangePattern,
          bearingOptions: f.bearingOptions,
          compressorMap: buildCompressorMap(f),
        })
        .run();
    }
    for (const group of chunks(seed.bins, 200)) tx.insert(bins).values(group).run();

    const ids = new Map<string, number>();
    for (const group of chunks(seed.parts, 400)) {
      const inserted = tx
        .insert(parts)
        .values(
          group.map((p) => ({
            // The GTIN's item reference is the part id, as for parts added later (shared/gtin.ts), so ids are given.
            id: itemReferenceOf(p.gtin) ?? undefined,
            gtin: p.gtin,
            partNumber: p.partNumber,
            normalizedNumber: normalizePartNumber(p.partNumber),
            title: p.title,
            category: p.category,
            frameCode: p.frameCode,
            status: p.status,
            condition: p.condition,
            priceCents: p.priceCents,
            coreDepositCents: p.coreDepositCents,
            weightGrams: p.weightGrams,
            description: p.description,
            supersededBy: p.supersededBy,
            minStock: p.minStock,
          })),
        )
        .returning({ id: parts.id, partNumber: parts.partNumber })
        .all();
      for (const r of inserted) ids.set(r.partNumber, r.id);
    }
    const idOf = (n: string) => {
      const id = ids.get(n);
      if (id === undefined) throw new Error(`Seed refers to unknown part ${n}`);
      return id;
    };

    for (const group of chunks(seed.parts, 400)) {
      tx.insert(partSpecs).values(group.map((p) => ({ partId: idOf(p.partNumber), ...p.specs }))).run();
    }
    const aliasRows = seed.parts.flatMap((p) =>
      p.aliases.map((a) => ({ partId: idOf(p.partNumber), alias: a.alias, normalizedAlias: normalizePartNumber(a.alias), kind: a.kind, source: a.source })),
    );
    for (const group of chunks(aliasRows, 400)) tx.insert(partAliases).values(group).run();
    const linkRows = seed.parts.flatMap((p) => p.goesWith.map((n) => ({ partId: idOf(p.partNumber), relatedPartId: idOf(n), kind: 'goes-with' })));
    for (const group of chunks(linkRows, 400)) tx.insert(partLinks).values(group).onConflictDoNothing().run();
    const stockRows = seed.parts.flatMap((p) => p.stock.map((s) => ({ partId: idOf(p.partNumber), binCode: s.binCode, onHand: s.onHand, reserved: 0 })));
    for (const group of chunks(stockRows, 400)) tx.insert(stock).values(group).run();
    // Opening stock enters through the ledger like any other goods-in.
    const openingRows = stockRows.map((s) => ({ partId: s.partId, binCode: s.binCode, kind: 'goods-in' as const, onHandDelta: s.onHand, note: 'opening stock' }));
    for (const group of chunks(openingRows, 400)) tx.insert(stockMovements).values(group).run();
    tx.run(sql`UPDATE parts SET available = COALESCE((SELECT SUM(s.on_hand - s.reserved) FROM stock s WHERE s.part_id = parts.id), 0)`);
  });
  return { parts: seed.parts.length };
}
