import type { Db } from '../db/client';
import { HttpError } from '../middleware/errors';
import { normalizePartNumber } from '../../shared/part-number';
import type { Dispatch, Pick, PickLine, PickList } from '../../shared/schemas/warehouse';
import type { OrderStatus } from '../../shared/schemas/orders';
import type { StockService } from './stock';

/** What the warehouse tells customers; mail in the app, a recorder in tests. */
export interface WarehouseNotifier {
  shortPicked(orderId: number, lines: Array<{ partNumber: string; title: string; ordered: number; backordered: number }>): void;
  dispatched(orderId: number, shipmentId: number): void;
}

interface LineRow {
  lineId: number;
  orderId: number;
  orderNumber: string;
  partId: number;
  partNumber: string;
  normalizedNumber: string;
  title: string;
  category: PickLine['category'];
  mounting: string | null;
  photo: string | null;
  quantity: number;
  backordered: number;
  picked: number;
  dispatched: number;
  fitmentSummary: string | null;
}

const PICKABLE: OrderStatus[] = ['paid', 'on_account', 'picking', 'back_ordered', 'packed'];

export function createWarehouseService(deps: { db: Db; stock: StockService; notify: WarehouseNotifier }) {
  const { db, stock, notify } = deps;
  const sqlite = db.$client;
  const stmt = {
    order: sqlite.prepare('SELECT id, number, status, payment_method AS paymentMethod FROM orders WHERE number = ?'),
    lines: sqlite.prepare(
      `SELECT l.id AS lineId, l.order_id AS orderId, o.number AS orderNumber, l.part_id AS partId, l.part_number AS partNumber, p.normalized_number AS normalizedNumber,
              l.title, p.category, s.mounting, json_extract(p.images, '$[0]') AS photo,
              l.quantity, l.quantity_backordered AS backordered, l.quantity_picked AS picked, l.quantity_dispatched AS dispatched, l.fitment_summary AS fitmentSummary
       FROM order_lines l JOIN orders o ON o.id = l.order_id JOIN parts p ON p.id = l.part_id LEFT JOIN part_specs s ON s.part_id = p.id WHERE l.order_id = ? ORDER BY l.id`,
    ),
    line: sqlite.prepare(
      `SELECT l.id AS lineId, l.order_id AS orderId, o.number AS orderNumber, l.part_id AS partId, l.part_number AS partNumber, p.normalized_number AS normalizedNumber,
              l.title, p.category, s.mounting, json_extract(p.images, '$[0]') AS photo,
              l.quantity, l.quantity_backordered AS backordered, l.quantity_picked AS picked, l.quantity_dispatched AS dispatched, l.fitment_summary AS fitmentSummary
       FROM order_lines l JOIN orders o ON o.id = l.order_id JOIN parts p ON p.id = l.part_id LEFT JOIN part_specs s ON s.part_id = p.id WHERE l.id = ? AND l.order_id = ?`,
    ),
    setStatus: sqlite.prepare("UPDATE orders SET status = ?, updated_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?"),
    event: sqlite.prepare('INSERT INTO order_events (order_id, status, note) VALUES (?, ?, ?)'),
    addPicked: sqlite.prepare('UPDATE order_lines SET quantity_picked = quantity_picked + ? WHERE id = ?'),
    addBackorder: sqlite.prepare('UPDATE order_lines SET quantity_backordered = quantity_backordered + ? WHERE id = ?'),
    partByNumber: sqlite.prepare('SELECT id, part_number AS partNumber, title FROM parts WHERE normalized_number = ?'),
    bin: sqlite.prepare('SELECT code FROM bins WHERE code = ?'),
  };

  const toPick = (l: LineRow) => l.quantity - l.backordered - l.picked;

  /** The bin a line is picked from: the first bin in walk order that holds stock for this order. */
  function pickLine(l: LineRow): PickLine {
    const held = stock.heldFor(l.orderId, l.partId);
    const bin = held[0]?.binCode ?? stock.defaultBin(l.partId);
    const walk = bin ? (sqlite.prepare('SELECT walk_order AS w FROM bins WHERE code = ?').get(bin) as { w: number } | undefined)?.w ?? null : null;
    return {
      lineId: l.lineId,
      orderNumber: l.orderNumber,
      partNumber: l.partNumber,
      title: l.title,
      category: l.category,
      specs: { mounting: l.mounting },
      photo: l.photo,
      binCode: bin,
      walkOrder: walk,
      quantity: l.quantity,
      toPick: Math.max(0, toPick(l)),
      picked: l.picked - l.dispatched,
      backordered: l.backordered,
      fitmentSummary: l.fitmentSummary,
    };
  }

  function orderOr404(number: string) {
    const o = stmt.order.get(number) as { id: number; number: string; status: OrderStatus; paymentMethod: string } | undefined;
    if (!o) throw new HttpError(404, `No order ${number}`);
    return o;
  }

  function pickQueue() {
    const rows = sqlite
      .prepare(
        `SELECT o.id, o.number, o.status, o.payment_method AS paymentMethod, o.ship_name AS customer, o.created_at AS createdAt, o.weight_grams AS weightGrams,
                count(l.id) AS lines,
                SUM(max(0, l.quantity - l.quantity_backordered - l.quantity_picked)) AS unitsToPick,
                SUM(l.quantity_picked - l.quantity_dispatched) AS unitsPicked
         FROM orders o JOIN order_lines l ON l.order_id = o.id
         WHERE o.status IN (${PICKABLE.map(() => '?').join(',')})
         GROUP BY o.id
         HAVING unitsToPick > 0 OR unitsPicked > 0
         ORDER BY o.created_at, o.id`,
      )
      .all(...PICKABLE) as Array<{ id: number; number: string; status: OrderStatus; paymentMethod: 'card' | 'account'; customer: string; createdAt: string; weightGrams: number; lines: number; unitsToPick: number; unitsPicked: number }>;
    return rows.map((r) => ({
      number: r.number,
      status: r.status,
      paymentMethod: r.paymentMethod,
      customer: r.customer,
      createdAt: r.createdAt,
      lines: r.lines,
      unitsToPick: r.unitsToPick,
      ready: r.unitsToPick > 0 ? ('pick' as const) : r.status === 'packed' ? ('dispatch' as const) : ('pack' as const),
      releasedBackorder: r.status === 'back_ordered',
      weightGrams: r.weightGrams,
    }));
  }

  function pickList(numbers: string[]): PickList {
    const orders = numbers.map(orderOr404);
    const lines = orders.flatMap((o) => (stmt.lines.all(o.id) as LineRow[]).map(pickLine));
    lines.sort((a, b) => (a.walkOrder ?? 1e9) - (b.walkOrder ?? 1e9) || a.orderNumber.localeCompare(b.orderNumber));
    return {
      orders: orders.map((o) => {
        const d = sqlite.prepare('SELECT ship_name AS customer, delivery_zone AS zone FROM orders WHERE id = ?').get(o.id) as { customer: string; zone: string };
        return { number: o.number, status: o.status, customer: d.customer, deliveryZone: d.zone };
      }),
      lines,
    };
  }

  /**
   * Confirms a pick against the scanned number. A wrong part is refused before anything is written; a short
   * pick turns the rest of the line into a back-order: the reservation is released and the missing units are
   * written off the bin (they were not there), both through the ledger.
   */
  const recordPick = sqlite.transaction((number: string, input: Pick) => {
    const order = orderOr404(number);
    if (!PICKABLE.includes(order.status) || order.status === 'packed') throw new HttpError(409, `Order ${number} is ${order.status.replace('_', ' ')} and cannot be picked`);
    const line = stmt.line.get(input.lineId, order.id) as LineRow | undefined;
    if (!line) throw new HttpError(404, `Order ${number} has no such line`);
    const scanned = normalizePartNumber(input.scannedPartNumber);
    if (scanned !== line.normalizedNumber) {
      throw new HttpError(409, `Scanned ${input.scannedPartNumber.trim().toUpperCase()} but this line is ${line.partNumber}: nothing was recorded`);
    }
    const open = toPick(line);
    if (open <= 0) throw new HttpError(409, `${line.partNumber} on ${number} is already picked`);
    if (input.quantity > open) throw new HttpError(409, `Only ${open} more of ${line.partNumber} to pick on this line`);
    if (input.quantity === 0 && !input.short) throw new HttpError(400, 'Pick at least 1, or report the bin as short', { quantity: ['pick at least 1'] });

    const held = stock.heldFor(order.id, line.partId);
    if (input.quantity > 0) {
      stmt.addPicked.run(input.quantity, line.lineId);
      stock.recordPick(order.id, line.partId, held[0]?.binCode ?? stock.defaultBin(line.partId) ?? 'A-01-1', input.quantity);
    }
    let message = `Picked ${line.picked - line.dispatched + input.quantity} of ${line.quantity - line.backordered - line.dispatched} — ${line.partNumber}`;
    let shortLine: { partNumber: string; title: string; ordered: number; backordered: number } | null = null;
    if (input.short) {
      const missing = open - input.quantity;
      if (missing > 0) {
        // The units were reserved but not in the bin: give back the reservation and write them off on hand.
        let left = missing;
        for (const bin of [...held].reverse()) {
          if (left <= 0) break;
          const n = Math.min(left, bin.held);
          stock.release(order.id, line.partId, n, 'short pick');
          const row = sqlite.prepare('SELECT on_hand - reserved AS free FROM stock WHERE part_id = ? AND bin_code = ?').get(line.partId, bin.binCode) as { free: number };
          const writeOff = Math.min(n, row.free);
          if (writeOff > 0) stock.adjust(line.partId, bin.binCode, -writeOff, `short pick on ${number}: not found in bin`);
          left -= n;
        }
        stmt.addBackorder.run(missing, line.lineId);
        stmt.event.run(order.id, 'back_ordered', `${missing} × ${line.partNumber} short at picking`);
        message = `Short pick: ${missing} × ${line.partNumber} back-ordered; the customer is told`;
        shortLine = { partNumber: line.partNumber, title: line.title, ordered: line.quantity, backordered: line.backordered + missing };
      }
    }
    const after = stmt.lines.all(order.id) as LineRow[];
    // Everything left waits for stock and nothing is picked: the order waits as a back-order, off the queue.
    const waitingOnly = after.every((l) => toPick(l) <= 0 && l.picked <= l.dispatched);
    const status: OrderStatus = waitingOnly ? 'back_ordered' : 'picking';
    if (order.status !== status) {
      stmt.setStatus.run(status, order.id);
      if (status === 'picking') stmt.event.run(order.id, 'picking', null);
    }
    const updated = after.find((l) => l.lineId === line.lineId)!;
    return { line: pickLine(updated), orderStatus: status, message, orderId: order.id, shortLine };
  });

  function pick(number: string, input: Pick) {
    const result = recordPick(number, input);
    if (result.shortLine) notify.shortPicked(result.orderId, [result.shortLine]);
    return { line: result.line, orderStatus: result.orderStatus, message: result.message };
  }

  const pack = sqlite.transaction((number: string, cartons: number, weightKg: number) => {
    const order = orderOr404(number);
    const lines = stmt.lines.all(order.id) as LineRow[];
    if (lines.some((l) => toPick(l) > 0)) throw new HttpError(409, `Order ${number} still has lines to pick`);
    if (!lines.some((l) => l.picked > l.dispatched)) throw new HttpError(409, `Order ${number} has nothing picked to pack`);
    sqlite.prepare('UPDATE orders SET cartons = ?, packed_weight_grams = ? WHERE id = ?').run(cartons, Math.round(weightKg * 1000), order.id);
    if (order.status !== 'packed') {
      stmt.setStatus.run('packed', order.id);
      stmt.event.run(order.id, 'packed', `${cartons} carton${cartons === 1 ? '' : 's'}, ${weightKg} kg`);
    }
    return { status: 'packed' as const };
  });

  /** Stock leaves on hand exactly once: what was picked and not yet dispatched; with nothing picked, 409. */
  const dispatchOrder = sqlite.transaction((number: string, input: Dispatch) => {
    const order = orderOr404(number);
    const lines = stmt.lines.all(order.id) as LineRow[];
    const ready = lines.filter((l) => l.picked > l.dispatched);
    if (ready.length === 0) throw new HttpError(409, `Order ${number} has nothing picked to dispatch${order.status === 'dispatched' ? ': it was already dispatched' : ''}`);
    if (lines.some((l) => toPick(l) > 0)) throw new HttpError(409, `Order ${number} still has lines to pick`);
    const o = sqlite.prepare('SELECT cartons, packed_weight_grams AS grams FROM orders WHERE id = ?').get(order.id) as { cartons: number | null; grams: number | null };
    const cartons = input.cartons ?? o.cartons;
    const grams = input.weightKg !== undefined ? Math.round(input.weightKg * 1000) : o.grams;
    if (!cartons || !grams) throw new HttpError(400, 'Pack the order first: cartons and weight', { cartons: ['enter the cartons'], weightKg: ['enter the weight'] });
    let units = 0;
    for (const l of ready) {
      const sent = stock.dispatch(order.id, l.partId);
      const expected = l.picked - l.dispatched;
      if (sent !== expected) throw new Error(`Ledger holds ${sent} of ${l.partNumber} for ${number}, ${expected} were picked`);
      sqlite.prepare('UPDATE order_lines SET quantity_dispatched = quantity_picked WHERE id = ?').run(l.lineId);
      units += sent;
    }
    const shipmentId = (
      sqlite
        .prepare('INSERT INTO shipments (order_id, carrier, tracking_number, cartons, weight_grams, units) VALUES (?, ?, ?, ?, ?, ?) RETURNING id')
        .get(order.id, input.carrier, input.trackingNumber, cartons, grams, units) as { id: number }
    ).id;
    const waiting = lines.some((l) => l.backordered > 0);
    const status: OrderStatus = waiting ? 'back_ordered' : 'dispatched';
    sqlite.prepare('UPDATE orders SET carrier = ?, tracking_number = ?, cartons = ?, packed_weight_grams = ? WHERE id = ?').run(input.carrier, input.trackingNumber, cartons, grams, order.id);
    stmt.setStatus.run(status, order.id);
    stmt.event.run(order.id, 'dispatched', `${input.carrier} ${input.trackingNumber}, ${units} unit${units === 1 ? '' : 's'}`);
    if (waiting) stmt.event.run(order.id, 'back_ordered', 'The rest follows when stock arrives');
    return { orderId: order.id, status, shipmentId, shipment: { carrier: input.carrier, trackingNumber: input.trackingNumber, cartons, units } };
  });

  function dispatch(number: string, input: Dispatch) {
    const result = dispatchOrder(number, input);
    notify.dispatched(result.orderId, result.shipmentId);
    return { status: result.status, shipment: result.shipment };
  }

  function partOr404(partNumber: string) {
    const part = stmt.partByNumber.get(normalizePartNumber(partNumber)) as { id: number; partNumber: string; title: string } | undefined;
    if (!part) throw new HttpError(404, `No part ${partNumber}`);
    return part;
  }
  function binOr400(code: string) {
    if (!stmt.bin.get(code)) throw new HttpError(400, `No bin ${code}`, { binCode: [`no bin ${code}`] });
  }

  /** Goods-in: stock enters a bin and is given to waiting back-orders first, oldest order first. */
  const goodsIn = sqlite.transaction((input: { partNumber: string; binCode: string; quantity: number; note?: string }) => {
    const part = partOr404(input.partNumber);
    binOr400(input.binCode);
    stock.goodsIn(part.id, input.binCode, input.quantity, input.note ?? null);
    const waiting = sqlite
      .prepare(
        `SELECT l.id AS lineId, l.order_id AS orderId, o.number, l.quantity_backordered AS backordered FROM order_lines l JOIN orders o ON o.id = l.order_id
         WHERE l.part_id = ? AND l.quantity_backordered > 0 AND o.status NOT IN ('cancelled', 'returned', 'pending_payment') ORDER BY o.created_at, o.id`,
      )
      .all(part.id) as Array<{ lineId: number; orderId: number; number: string; backordered: number }>;
    const released: Array<{ orderNumber: string; quantity: number }> = [];
    for (const w of waiting) {
      const free = stock.available(part.id);
      if (free <= 0) break;
      const n = stock.reserve(part.id, Math.min(free, w.backordered), w.orderId);
      if (n <= 0) break;
      sqlite.prepare('UPDATE order_lines SET quantity_backordered = quantity_backordered - ? WHERE id = ?').run(n, w.lineId);
      stmt.event.run(w.orderId, 'stock_arrived', `${n} × ${part.partNumber} arrived for the back-order`);
      released.push({ orderNumber: w.number, quantity: n });
    }
    const row = sqlite.prepare('SELECT on_hand AS onHand FROM stock WHERE part_id = ? AND bin_code = ?').get(part.id, input.binCode) as { onHand: number };
    return { partNumber: part.partNumber, binCode: input.binCode, onHand: row.onHand, released };
  });

  const adjust = sqlite.transaction((input: { partNumber: string; binCode: string; delta: number; reason: string }) => {
    const part = partOr404(input.partNumber);
    binOr400(input.binCode);
    const row = sqlite.prepare('SELECT on_hand AS onHand, reserved FROM stock WHERE part_id = ? AND bin_code = ?').get(part.id, input.binCode) as { onHand: number; reserved: number } | undefined;
    const onHand = row?.onHand ?? 0;
    const reserved = row?.reserved ?? 0;
    if (onHand + input.delta < reserved) {
      throw new HttpError(409, `${input.binCode} holds ${onHand}, of which ${reserved} are reserved for orders: it cannot go below ${reserved}`);
    }
    stock.adjust(part.id, input.binCode, input.delta, input.reason);
    return { onHand: onHand + input.delta, reserved };
  });

  function lowStock() {
    return sqlite
      .prepare(
        `SELECT p.part_number AS partNumber, p.title, COALESCE(SUM(s.on_hand - s.reserved), 0) AS available, COALESCE(SUM(s.on_hand), 0) AS onHand, p.min_stock AS minStock,
                (SELECT COALESCE(SUM(l.quantity_backordered), 0) FROM order_lines l JOIN orders o ON o.id = l.order_id WHERE l.part_id = p.id AND o.status NOT IN ('cancelled','returned')) AS waitingBackorders
         FROM parts p LEFT JOIN stock s ON s.part_id = p.id WHERE p.status = 'active'
         GROUP BY p.id HAVING available <= p.min_stock ORDER BY waitingBackorders DESC, available - p.min_stock, p.part_number LIMIT 500`,
      )
      .all();
  }

  function stockDetail(partNumber: string) {
    const part = partOr404(partNumber);
    const bins = sqlite
      .prepare(
        `SELECT s.bin_code AS binCode, s.on_hand AS onHand, s.reserved,
                (SELECT COALESCE(SUM(m.on_hand_delta), 0) FROM stock_movements m WHERE m.part_id = s.part_id AND m.bin_code = s.bin_code) AS ledgerOnHand,
                (SELECT COALESCE(SUM(m.reserved_delta), 0) FROM stock_movements m WHERE m.part_id = s.part_id AND m.bin_code = s.bin_code) AS ledgerReserved
         FROM stock s JOIN bins b ON b.code = s.bin_code WHERE s.part_id = ? ORDER BY b.walk_order`,
      )
      .all(part.id);
    const movements = sqlite
      .prepare(
        `SELECT m.id, m.bin_code AS binCode, m.kind, m.on_hand_delta AS onHandDelta, m.reserved_delta AS reservedDelta, o.number AS orderNumber, m.note, m.created_at AS createdAt
         FROM stock_movements m LEFT JOIN orders o ON o.id = m.order_id WHERE m.part_id = ? ORDER BY m.id DESC LIMIT 100`,
      )
      .all(part.id);
    return { partNumber: part.partNumber, title: part.title, bins, movements };
  }

  return { pickQueue, pickList, pick, pack, dispatch, goodsIn, adjust, lowStock, stockDetail };
}

export type WarehouseService = ReturnType<typeof createWarehouseService>;
