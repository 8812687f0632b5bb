import { and, eq, gt, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { bins, parts, stock, stockMovements } from '../db/schema';

export type MovementKind = (typeof stockMovements.$inferSelect)['kind'];

/**
 * Stock per part and bin changes only here, and every change writes a ledger row in the same statement group.
 * Callers run these inside their own transaction, so a stock change and the order change that causes it commit
 * together or not at all.
 */
export function createStockService(db: Db) {
  const free = sql<number>`${stock.onHand} - ${stock.reserved}`;
  const held = sql<number>`sum(${stockMovements.reservedDelta})`;

  const $ = sql.placeholder;
  const thisBin = and(eq(stock.partId, $('partId')), eq(stock.binCode, $('binCode')));
  // Every order, pick and receipt runs these: each is built and prepared once here (Drizzle's prepared queries with
  // placeholders), not rebuilt from its parts at every call. Callers' transactions run them (one connection).
  const prepared = {
    available: db.select({ n: parts.available }).from(parts).where(eq(parts.id, $('partId'))).prepare(),
    freeBins: db
      .select({ binCode: stock.binCode, free })
      .from(stock)
      .innerJoin(bins, eq(bins.code, stock.binCode))
      .where(and(eq(stock.partId, $('partId')), gt(free, 0)))
      .orderBy(bins.walkOrder)
      .prepare(),
    ensureRow: db.insert(stock).values({ partId: $('partId'), binCode: $('binCode'), onHand: 0, reserved: 0 }).onConflictDoNothing().prepare(),
    apply: db
      .update(stock)
      .set({ onHand: sql`${stock.onHand} + ${$('onHandDelta')}`, reserved: sql`${stock.reserved} + ${$('reservedDelta')}` })
      .where(thisBin)
      .prepare(),
    applyPart: db
      .update(parts)
      .set({ available: sql`${parts.available} + ${$('delta')}` })
      .where(eq(parts.id, $('partId')))
      .prepare(),
    movement: db
      .insert(stockMovements)
      .values({ partId: $('partId'), binCode: $('binCode'), kind: $('kind'), onHandDelta: $('onHandDelta'), reservedDelta: $('reservedDelta'), orderId: $('orderId'), note: $('note') })
      .prepare(),
    heldForOrder: db
      .select({ binCode: stockMovements.binCode, held })
      .from(stockMovements)
      .where(and(eq(stockMovements.orderId, $('orderId')), eq(stockMovements.partId, $('partId'))))
      .groupBy(stockMovements.binCode)
      .having(gt(held, 0))
      .prepare(),
    row: db.select({ onHand: stock.onHand, reserved: stock.reserved }).from(stock).where(thisBin).prepare(),
    defaultBin: db
      .select({ binCode: stock.binCode })
      .from(stock)
      .innerJoin(bins, eq(bins.code, stock.binCode))
      .where(eq(stock.partId, $('partId')))
      .orderBy(bins.walkOrder)
      .limit(1)
      .prepare(),
  };
  const q = {
    available: (partId: number) => prepared.available.get({ partId }),
    freeBins: (partId: number) => prepared.freeBins.all({ partId }),
    ensureRow: (partId: number, binCode: string) => prepared.ensureRow.run({ partId, binCode }),
    apply: (partId: number, binCode: string, onHandDelta: number, reservedDelta: number) => prepared.apply.run({ partId, binCode, onHandDelta, reservedDelta }),
    applyPart: (partId: number, delta: number) => prepared.applyPart.run({ partId, delta }),
    movement: (row: { partId: number; binCode: string; kind: MovementKind; onHandDelta: number; reservedDelta: number; orderId: number | null; note: string | null }) =>
      prepared.movement.run(row),
    heldForOrder: (orderId: number, partId: number) => prepared.heldForOrder.all({ orderId, partId }),
    row: (partId: number, binCode: string) => prepared.row.get({ partId, binCode }),
    defaultBin: (partId: number) => prepared.defaultBin.get({ partId }),
  };

  function move(partId: number, binCode: string, kind: MovementKind, onHandDelta: number, reservedDelta: number, orderId: number | null, note: string | null) {
    q.ensureRow(partId, binCode);
    const current = q.row(partId, binCode);
    if (!current) throw new Error(`No stock row for part ${partId} in ${binCode}`);
    const onHand = current.onHand + onHandDelta;
    const reserved = current.reserved + reservedDelta;
    if (onHand < 0 || reserved < 0 || reserved > onHand) {
      throw new Error(`Stock for part ${partId} in ${binCode} would become on hand ${onHand}, reserved ${reserved}`);
    }
    q.apply(partId, binCode, onHandDelta, reservedDelta);
    if (onHandDelta !== reservedDelta) q.applyPart(partId, onHandDelta - reservedDelta);
    q.movement({ partId, binCode, kind, onHandDelta, reservedDelta, orderId, note });
  }

  return {
    available(partId: number): number {
      const part = q.available(partId);
      if (!part) throw new Error(`No part ${partId}`);
      return part.n;
    },

    /** Reserves up to `quantity` from the bins in walk order; answers how many it could reserve. */
    reserve(partId: number, quantity: number, orderId: number): number {
      let left = quantity;
      for (const bin of q.freeBins(partId)) {
        if (left <= 0) break;
        const take = Math.min(left, bin.free);
        move(partId, bin.binCode, 'reserve', 0, take, orderId, null);
        left -= take;
      }
      return quantity - left;
    },

    /** Stock held for an order line, per bin in walk order. */
    heldFor(orderId: number, partId: number) {
      return q.heldForOrder(orderId, partId);
    },

    /** Gives back what an order holds of a part (all of it, or `quantity`). */
    release(orderId: number, partId: number, quantity = Infinity, note: string | null = null): number {
      let released = 0;
      for (const bin of q.heldForOrder(orderId, partId)) {
        const give = Math.min(quantity - released, bin.held);
        if (give <= 0) break;
        move(partId, bin.binCode, 'release', 0, -give, orderId, note);
        released += give;
      }
      return released;
    },

    /** Stock leaves the building: on hand and reserved fall together, once, for what the order holds. */
    dispatch(orderId: number, partId: number): number {
      let total = 0;
      for (const bin of q.heldForOrder(orderId, partId)) {
        move(partId, bin.binCode, 'dispatch', -bin.held, -bin.held, orderId, null);
        total += bin.held;
      }
      return total;
    },

    /** A record that a line was picked from a bin; it moves no quantity (dispatch does). */
    recordPick(orderId: number, partId: number, binCode: string, quantity: number) {
      q.movement({ partId, binCode, kind: 'pick', onHandDelta: 0, reservedDelta: 0, orderId, note: `picked ${quantity}` });
    },

    goodsIn(partId: number, binCode: string, quantity: number, note: string | null = null) {
      move(partId, binCode, 'goods-in', quantity, 0, null, note);
    },

    adjust(partId: number, binCode: string, delta: number, reason: string) {
      move(partId, binCode, 'adjustment', delta, 0, null, reason);
    },

    returnIn(partId: number, binCode: string, quantity: number, orderId: number, note: string | null) {
      move(partId, binCode, 'return', quantity, 0, orderId, note);
    },

    /**
     * Parts fitted on the Bench leave stock from free bins in walk order (as the Floor picks): on hand falls, nothing
     * is reserved. Answers the bins taken from; throws when there is not enough free stock, so the caller's
     * transaction rolls back whole.
     */
    consumeForWorkshop(partId: number, quantity: number, note: string): Array<{ binCode: string; quantity: number }> {
      const taken: Array<{ binCode: string; quantity: number }> = [];
      let left = quantity;
      for (const bin of q.freeBins(partId)) {
        if (left <= 0) break;
        const take = Math.min(left, bin.free);
        move(partId, bin.binCode, 'workshop', -take, 0, null, note);
        taken.push({ binCode: bin.binCode, quantity: take });
        left -= take;
      }
      if (left > 0) throw new Error(`Not enough free stock of part ${partId}: ${left} short`);
      return taken;
    },

    defaultBin(partId: number): string | null {
      return q.defaultBin(partId)?.binCode ?? null;
    },
  };
}

export type StockService = ReturnType<typeof createStockService>;
