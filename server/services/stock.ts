import type { Db } from '../db/client';

export type MovementKind = 'goods-in' | 'reserve' | 'release' | 'pick' | 'dispatch' | 'adjustment' | 'return';

/**
 * Stock per part and bin changes only here, and every change writes a ledger row in the same statement group.
 * Callers run these inside their own transaction, so a stock change and the order change that causes it commit
 * together or not at all.
 */
export function createStockService(db: Db) {
  const sqlite = db.$client;
  const stmt = {
    available: sqlite.prepare('SELECT available AS n FROM parts WHERE id = ?'),
    freeBins: sqlite.prepare(
      `SELECT s.bin_code AS binCode, s.on_hand - s.reserved AS free FROM stock s JOIN bins b ON b.code = s.bin_code
       WHERE s.part_id = ? AND s.on_hand - s.reserved > 0 ORDER BY b.walk_order`,
    ),
    ensureRow: sqlite.prepare('INSERT INTO stock (part_id, bin_code, on_hand, reserved) VALUES (?, ?, 0, 0) ON CONFLICT DO NOTHING'),
    apply: sqlite.prepare('UPDATE stock SET on_hand = on_hand + ?, reserved = reserved + ? WHERE part_id = ? AND bin_code = ?'),
    applyPart: sqlite.prepare('UPDATE parts SET available = available + ? WHERE id = ?'),
    movement: sqlite.prepare(
      'INSERT INTO stock_movements (part_id, bin_code, kind, on_hand_delta, reserved_delta, order_id, note) VALUES (?, ?, ?, ?, ?, ?, ?)',
    ),
    heldForOrder: sqlite.prepare(
      `SELECT bin_code AS binCode, SUM(reserved_delta) AS held FROM stock_movements
       WHERE order_id = ? AND part_id = ? GROUP BY bin_code HAVING SUM(reserved_delta) > 0`,
    ),
    row: sqlite.prepare('SELECT on_hand AS onHand, reserved FROM stock WHERE part_id = ? AND bin_code = ?'),
    defaultBin: sqlite.prepare(
      `SELECT s.bin_code AS binCode FROM stock s JOIN bins b ON b.code = s.bin_code WHERE s.part_id = ? ORDER BY b.walk_order LIMIT 1`,
    ),
  };

  function move(partId: number, binCode: string, kind: MovementKind, onHandDelta: number, reservedDelta: number, orderId: number | null, note: string | null) {
    stmt.ensureRow.run(partId, binCode);
    const current = stmt.row.get(partId, binCode) as { onHand: number; reserved: number };
    const onHand = current.onHand + onHandDelta;
    const reserved = current.reserved + reservedDelta;
    if (onHand < 0 || reserved < 0 || reserved > onHand) {
      throw new Error(`Stock for part ${partId} in ${binCode} would become on hand ${onHand}, reserved ${reserved}`);
    }
    stmt.apply.run(onHandDelta, reservedDelta, partId, binCode);
    if (onHandDelta !== reservedDelta) stmt.applyPart.run(onHandDelta - reservedDelta, partId);
    stmt.movement.run(partId, binCode, kind, onHandDelta, reservedDelta, orderId, note);
  }

  return {
    available(partId: number): number {
      return (stmt.available.get(partId) as { n: number }).n;
    },

    /** Reserves up to `quantity` from the bins in walk order; answers how many it could reserve. */
    reserve(partId: number, quantity: number, orderId: number): number {
      let left = quantity;
      for (const bin of stmt.freeBins.all(partId) as Array<{ binCode: string; free: number }>) {
        if (left <= 0) break;
        const take = Math.min(left, bin.free);
        move(partId, bin.binCode, 'reserve', 0, take, orderId, null);
        left -= take;
      }
      return quantity - left;
    },

    /** Stock held for an order line, per bin in walk order. */
    heldFor(orderId: number, partId: number): Array<{ binCode: string; held: number }> {
      return stmt.heldForOrder.all(orderId, partId) as Array<{ binCode: string; held: number }>;
    },

    /** Gives back what an order holds of a part (all of it, or `quantity`). */
    release(orderId: number, partId: number, quantity = Infinity, note: string | null = null): number {
      let released = 0;
      for (const bin of stmt.heldForOrder.all(orderId, partId) as Array<{ binCode: string; held: number }>) {
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
      for (const bin of stmt.heldForOrder.all(orderId, partId) as Array<{ binCode: string; held: number }>) {
        move(partId, bin.binCode, 'dispatch', -bin.held, -bin.held, orderId, null);
        total += bin.held;
      }
      return total;
    },

    /** A record that a line was picked from a bin; it moves no quantity (dispatch does). */
    recordPick(orderId: number, partId: number, binCode: string, quantity: number) {
      stmt.movement.run(partId, binCode, 'pick', 0, 0, orderId, `picked ${quantity}`);
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

    defaultBin(partId: number): string | null {
      return (stmt.defaultBin.get(partId) as { binCode: string } | undefined)?.binCode ?? null;
    },
  };
}

export type StockService = ReturnType<typeof createStockService>;
