import { and, count, desc, eq, gt, inArray, lte, ne, notInArray, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../db/client';
import { bins, stock as binStock, orderEvents, orderLines, orders, parts, partSpecs, shipments, stockMovements, units as unitRows } from '../db/schema';
import { ConflictError, InvalidError, NotFoundError } from './errors';
import { normalizePartNumber } from '../../shared/part-number';
import { PICK_QUEUE_PAGE_SIZE, PickLineSchema, type Dispatch, type Pick as PickInput, type PickLine, type PickList, type PickQueueQuery } from '../../shared/schemas/warehouse';
import type { OrderStatus } from '../../shared/schemas/orders';
import type { StockService } from './stock';
import { resolveScan } from './scan';
import { formatReceipt } from '../../shared/schemas/labels';
import { orientationFrom } from '../../shared/exploded-view';
import type { UnitsService } from './units';

/** What the warehouse tells customers, written in the transaction of the pick or dispatch (the mail outbox in the app). */
export interface WarehouseNotifier {
  /** The first pick of an order (no e-mail goes out for it; the on-site notices record it). */
  pickingStarted?(tx: DbOrTx, orderId: number): void;
  shortPicked(tx: DbOrTx, orderId: number, lines: Array<{ partNumber: string; title: string; ordered: number; backordered: number }>): void;
  dispatched(tx: DbOrTx, orderId: number, shipmentId: number): void;
}

const PICKABLE: OrderStatus[] = ['paid', 'on_account', 'picking', 'back_ordered', 'packed'];

/** The same expression as the schema's timestamp defaults. */
const now = sql<string>`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;

/** The database or the transaction a query runs in: better-sqlite3 has one connection, so both see the same data. */
export type DbOrTx = Pick<Db, 'select' | 'insert' | 'update'>;

const lineColumns = {
  lineId: orderLines.id,
  orderId: orderLines.orderId,
  orderNumber: orders.number,
  partId: orderLines.partId,
  partNumber: orderLines.partNumber,
  normalizedNumber: parts.normalizedNumber,
  title: orderLines.title,
  category: parts.category,
  mounting: partSpecs.mounting,
  photo: sql<string | null>`json_extract(${parts.images}, '$[0]')`,
  quantity: orderLines.quantity,
  backordered: orderLines.quantityBackordered,
  picked: orderLines.quantityPicked,
  dispatched: orderLines.quantityDispatched,
  fitmentSummary: orderLines.fitmentSummary,
  compressorOutletClock: orderLines.compressorOutletClock,
  turbineInletClock: orderLines.turbineInletClock,
};

function lineRows(q: DbOrTx, where: SQL | undefined) {
  return q
    .select(lineColumns)
    .from(orderLines)
    .innerJoin(orders, eq(orders.id, orderLines.orderId))
    .innerJoin(parts, eq(parts.id, orderLines.partId))
    .leftJoin(partSpecs, eq(partSpecs.partId, parts.id))
    .where(where);
}

const linesOf = (q: DbOrTx, orderId: number) => lineRows(q, eq(orderLines.orderId, orderId)).orderBy(orderLines.id).all();
type LineRow = ReturnType<typeof linesOf>[number];

function setStatus(q: DbOrTx, orderId: number, status: OrderStatus) {
  q.update(orders).set({ status, updatedAt: now }).where(eq(orders.id, orderId)).run();
}

function addEvent(q: DbOrTx, orderId: number, status: string, note: string | null) {
  q.insert(orderEvents).values({ orderId, status, note }).run();
}

/** What we sell by serial: each unit of these leaves the warehouse with one (shared/unit-serial.ts). */
const SERIALISED_CATEGORIES = ['turbochargers', 'cartridges'];

export function createWarehouseService(deps: { db: Db; stock: StockService; notify: WarehouseNotifier; units: UnitsService }) {
  const { db, stock, notify, units } = deps;

  /**
   * Gives every packed unit of a complete turbocharger or cartridge its serial, owned by the buyer (and their trade
   * account), with a `sold` line in its history. Units already serialised on an earlier pack of the line keep theirs.
   */
  function serialisePacked(tx: DbOrTx, order: { id: number; number: string }, lines: LineRow[]): number {
    const buyer = tx.select({ userId: orders.userId, dealerAccountId: orders.dealerAccountId }).from(orders).where(eq(orders.id, order.id)).get();
    let given = 0;
    for (const l of lines) {
      if (!SERIALISED_CATEGORIES.includes(l.category)) continue;
      const have = tx.select({ n: count() }).from(unitRows).where(eq(unitRows.orderLineId, l.lineId)).get()?.n ?? 0;
      if (l.picked <= have) continue;
      const part = tx.select({ frameCode: parts.frameCode, bearing: parts.bearing, specBearing: partSpecs.bearing }).from(parts).leftJoin(partSpecs, eq(partSpecs.partId, parts.id)).where(eq(parts.id, l.partId)).get();
      for (let i = have; i < l.picked; i++) {
        const unit = units.register(tx, {
          partId: l.partId,
          frameCode: part?.frameCode ?? null,
          bearing: part?.bearing ?? part?.specBearing ?? 'journal',
          origin: 'sold',
          ownerUserId: buyer?.userId ?? null,
          dealerAccountId: buyer?.dealerAccountId ?? null,
          orderLineId: l.lineId,
        });
        units.addEvent(tx, unit.id, { kind: 'sold', summary: `Sold on ${order.number}: ${l.partNumber} ${l.title}`, ref: order.number });
        given += 1;
      }
    }
    return given;
  }

  const toPick = (l: LineRow) => l.quantity - l.backordered - l.picked;

  /** The bin a line is picked from: the first bin in walk order that holds stock for this order. */
  function pickLine(q: DbOrTx, l: LineRow): PickLine {
    const held = stock.heldFor(l.orderId, l.partId);
    const bin = held[0]?.binCode ?? stock.defaultBin(l.partId);
    const walk = bin ? (q.select({ w: bins.walkOrder }).from(bins).where(eq(bins.code, bin)).get()?.w ?? null) : null;
    return {
      lineId: l.lineId,
      orderNumber: l.orderNumber,
      partNumber: l.partNumber,
      title: l.title,
      // parts.category is plain text in the schema; the pick list's own schema names the allowed slugs.
      category: PickLineSchema.shape.category.parse(l.category),
      specs: { mounting: l.mounting },
      photo: l.photo,
      binCode: bin,
      walkOrder: walk,
      quantity: l.quantity,
      toPick: Math.max(0, toPick(l)),
      picked: l.picked - l.dispatched,
      backordered: l.backordered,
      fitmentSummary: l.fitmentSummary,
      orientation: orientationFrom(l.compressorOutletClock, l.turbineInletClock),
    };
  }

  function orderOr404(q: DbOrTx, number: string) {
    const o = q
      .select({
        id: orders.id,
        number: orders.number,
        status: orders.status,
        customer: orders.shipName,
        deliveryZone: orders.deliveryZone,
        cartons: orders.cartons,
        packedWeightGrams: orders.packedWeightGrams,
      })
      .from(orders)
      .where(eq(orders.number, number))
      .get();
    if (!o) throw new NotFoundError(`No order ${number}`);
    return o;
  }

  /**
   * One page of the orders with something to pick, pack or dispatch, oldest first, filtered by order number or
   * customer, state and payment in the query, so the floor pages through a queue of any length.
   */
  function pickQueue(query: PickQueueQuery = { page: 1, pageSize: PICK_QUEUE_PAGE_SIZE }) {
    const unitsToPick = sql<number>`sum(max(0, ${orderLines.quantity} - ${orderLines.quantityBackordered} - ${orderLines.quantityPicked}))`;
    const unitsPicked = sql<number>`sum(${orderLines.quantityPicked} - ${orderLines.quantityDispatched})`;
    const text = query.q?.toLowerCase();
    const state =
      query.state === 'pick'
        ? and(gt(unitsToPick, 0), ne(orders.status, 'back_ordered'))
        : query.state === 'released'
          ? and(gt(unitsToPick, 0), eq(orders.status, 'back_ordered'))
          : query.state === 'pack'
            ? and(eq(unitsToPick, 0), ne(orders.status, 'packed'))
            : query.state === 'dispatch'
              ? and(eq(unitsToPick, 0), eq(orders.status, 'packed'))
              : undefined;
    const queue = db
      .select({
        id: orders.id,
        number: orders.number,
        status: orders.status,
        paymentMethod: orders.paymentMethod,
        customer: orders.shipName,
        createdAt: orders.createdAt,
        weightGrams: orders.weightGrams,
        lines: sql<number>`count(${orderLines.id})`.as('lines'),
        unitsToPick: unitsToPick.as('units_to_pick'),
      })
      .from(orders)
      .innerJoin(orderLines, eq(orderLines.orderId, orders.id))
      .where(
        and(
          inArray(orders.status, PICKABLE),
          query.payment ? eq(orders.paymentMethod, query.payment) : undefined,
          text ? or(sql`instr(lower(${orders.number}), ${text}) > 0`, sql`instr(lower(${orders.shipName}), ${text}) > 0`) : undefined,
        ),
      )
      .groupBy(orders.id)
      .having(and(or(gt(unitsToPick, 0), gt(unitsPicked, 0)), state))
      .as('queue');
    const total = db.select({ n: count() }).from(queue).get()?.n ?? 0;
    const rows = db
      .select()
      .from(queue)
      .orderBy(queue.createdAt, queue.id)
      .limit(query.pageSize)
      .offset((query.page - 1) * query.pageSize)
      .all();
    const items = rows.map((r) => ({
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
    return { items, total, page: query.page, pageSize: query.pageSize };
  }

  function pickList(numbers: string[]): PickList {
    const found = numbers.map((n) => orderOr404(db, n));
    const lines = found.flatMap((o) => linesOf(db, o.id).map((l) => pickLine(db, l)));
    lines.sort((a, b) => (a.walkOrder ?? 1e9) - (b.walkOrder ?? 1e9) || a.orderNumber.localeCompare(b.orderNumber));
    return {
      orders: found.map((o) => ({ number: o.number, status: o.status, customer: o.customer, deliveryZone: o.deliveryZone })),
      lines,
    };
  }

  /**
   * Confirms a pick against the scanned number. A wrong part is refused before anything is written; a short
   * pick turns the rest of the line into a back-order: the reservation is released and the missing units are
   * written off the bin (they were not there), both through the ledger.
   */
  const recordPick = (number: string, input: PickInput) =>
    db.transaction((tx) => {
      const order = orderOr404(tx, number);
      if (!PICKABLE.includes(order.status) || order.status === 'packed') throw new ConflictError(`Order ${number} is ${order.status.replace('_', ' ')} and cannot be picked`);
      const line = lineRows(tx, and(eq(orderLines.id, input.lineId), eq(orderLines.orderId, order.id))).get();
      if (!line) throw new NotFoundError(`Order ${number} has no such line`);
      // The part's number, a cross-reference or earlier number naming it alone, or its GTIN (check digit verified:
      // a misread is refused as invalid before anything else).
      const typed = input.scannedPartNumber.trim().toUpperCase();
      let scanned: string | null = null;
      try {
        const found = resolveScan(tx, input.scannedPartNumber, ['part']);
        scanned = found.part.partNumber;
      } catch (err) {
        if (!(err instanceof NotFoundError)) throw err;
      }
      if (scanned === null || normalizePartNumber(scanned) !== line.normalizedNumber) {
        const shown = scanned && normalizePartNumber(scanned) !== normalizePartNumber(typed) ? `${typed} (${scanned})` : typed;
        throw new ConflictError(`Scanned ${shown} but this line is ${line.partNumber}: nothing was recorded`);
      }
      const open = toPick(line);
      if (open <= 0) throw new ConflictError(`${line.partNumber} on ${number} is already picked`);
      if (input.quantity > open) throw new ConflictError(`Only ${open} more of ${line.partNumber} to pick on this line`);
      if (input.quantity === 0 && !input.short) throw new InvalidError('Pick at least 1, or report the bin as short', { quantity: ['pick at least 1'] });

      const held = stock.heldFor(order.id, line.partId);
      if (input.quantity > 0) {
        tx.update(orderLines)
          .set({ quantityPicked: sql`${orderLines.quantityPicked} + ${input.quantity}` })
          .where(eq(orderLines.id, line.lineId))
          .run();
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
            const row = tx
              .select({ free: sql<number>`${binStock.onHand} - ${binStock.reserved}` })
              .from(binStock)
              .where(and(eq(binStock.partId, line.partId), eq(binStock.binCode, bin.binCode)))
              .get();
            const writeOff = Math.min(n, row?.free ?? 0);
            if (writeOff > 0) stock.adjust(line.partId, bin.binCode, -writeOff, `short pick on ${number}: not found in bin`);
            left -= n;
          }
          tx.update(orderLines)
            .set({ quantityBackordered: sql`${orderLines.quantityBackordered} + ${missing}` })
            .where(eq(orderLines.id, line.lineId))
            .run();
          addEvent(tx, order.id, 'back_ordered', `${missing} × ${line.partNumber} short at picking`);
          message = `Short pick: ${missing} × ${line.partNumber} back-ordered; the customer is told`;
          shortLine = { partNumber: line.partNumber, title: line.title, ordered: line.quantity, backordered: line.backordered + missing };
        }
      }
      const after = linesOf(tx, order.id);
      // Everything left waits for stock and nothing is picked: the order waits as a back-order, off the queue.
      const waitingOnly = after.every((l) => toPick(l) <= 0 && l.picked <= l.dispatched);
      const status: OrderStatus = waitingOnly ? 'back_ordered' : 'picking';
      if (order.status !== status) {
        setStatus(tx, order.id, status);
        if (status === 'picking') addEvent(tx, order.id, 'picking', null);
        // Only the first time: an order back to picking after a released back-order is not news to the buyer again.
        if (status === 'picking' && (order.status === 'paid' || order.status === 'on_account')) notify.pickingStarted?.(tx, order.id);
      }
      const updated = after.find((l) => l.lineId === line.lineId)!;
      if (shortLine) notify.shortPicked(tx, order.id, [shortLine]);
      return { line: pickLine(tx, updated), orderStatus: status, message, orderId: order.id, shortLine };
    });

  function pick(number: string, input: PickInput) {
    const result = recordPick(number, input);
    return { line: result.line, orderStatus: result.orderStatus, message: result.message };
  }

  const pack = (number: string, cartons: number, weightKg: number) =>
    db.transaction((tx) => {
      const order = orderOr404(tx, number);
      const lines = linesOf(tx, order.id);
      if (lines.some((l) => toPick(l) > 0)) throw new ConflictError(`Order ${number} still has lines to pick`);
      if (!lines.some((l) => l.picked > l.dispatched)) throw new ConflictError(`Order ${number} has nothing picked to pack`);
      tx.update(orders)
        .set({ cartons, packedWeightGrams: Math.round(weightKg * 1000) })
        .where(eq(orders.id, order.id))
        .run();
      if (order.status !== 'packed') {
        setStatus(tx, order.id, 'packed');
        addEvent(tx, order.id, 'packed', `${cartons} carton${cartons === 1 ? '' : 's'}, ${weightKg} kg`);
      }
      serialisePacked(tx, order, lines);
      return { status: 'packed' as const };
    });

  /** Stock leaves on hand exactly once: what was picked and not yet dispatched; with nothing picked, 409. */
  const dispatchOrder = (number: string, input: Dispatch) =>
    db.transaction((tx) => {
      const order = orderOr404(tx, number);
      const lines = linesOf(tx, order.id);
      const ready = lines.filter((l) => l.picked > l.dispatched);
      if (ready.length === 0) throw new ConflictError(`Order ${number} has nothing picked to dispatch${order.status === 'dispatched' ? ': it was already dispatched' : ''}`);
      if (lines.some((l) => toPick(l) > 0)) throw new ConflictError(`Order ${number} still has lines to pick`);
      const cartons = input.cartons ?? order.cartons;
      const grams = input.weightKg !== undefined ? Math.round(input.weightKg * 1000) : order.packedWeightGrams;
      if (!cartons || !grams) throw new InvalidError('Pack the order first: cartons and weight', { cartons: ['enter the cartons'], weightKg: ['enter the weight'] });
      let units = 0;
      for (const l of ready) {
        const sent = stock.dispatch(order.id, l.partId);
        const expected = l.picked - l.dispatched;
        if (sent !== expected) throw new Error(`Ledger holds ${sent} of ${l.partNumber} for ${number}, ${expected} were picked`);
        tx.update(orderLines).set({ quantityDispatched: orderLines.quantityPicked }).where(eq(orderLines.id, l.lineId)).run();
        units += sent;
      }
      const shipment = tx
        .insert(shipments)
        .values({ orderId: order.id, carrier: input.carrier, trackingNumber: input.trackingNumber, cartons, weightGrams: grams, units })
        .returning({ id: shipments.id })
        .get();
      const waiting = lines.some((l) => l.backordered > 0);
      const status: OrderStatus = waiting ? 'back_ordered' : 'dispatched';
      tx.update(orders)
        .set({ carrier: input.carrier, trackingNumber: input.trackingNumber, cartons, packedWeightGrams: grams })
        .where(eq(orders.id, order.id))
        .run();
      setStatus(tx, order.id, status);
      addEvent(tx, order.id, 'dispatched', `${input.carrier} ${input.trackingNumber}, ${units} unit${units === 1 ? '' : 's'}`);
      if (waiting) addEvent(tx, order.id, 'back_ordered', 'The rest follows when stock arrives');
      notify.dispatched(tx, order.id, shipment.id);
      return { orderId: order.id, status, shipmentId: shipment.id, shipment: { carrier: input.carrier, trackingNumber: input.trackingNumber, cartons, units } };
    });

  function dispatch(number: string, input: Dispatch) {
    const result = dispatchOrder(number, input);
    return { status: result.status, shipment: result.shipment };
  }

  function partOr404(q: DbOrTx, partNumber: string) {
    const byNumber = (n: string) =>
      q.select({ id: parts.id, partNumber: parts.partNumber, title: parts.title }).from(parts).where(eq(parts.normalizedNumber, normalizePartNumber(n))).get();
    // Its own number first; else what the scan resolver makes of it (a GTIN, a cross-reference naming one part).
    let part = byNumber(partNumber);
    try {
      part ??= byNumber(resolveScan(q, partNumber, ['part']).part.partNumber);
    } catch (err) {
      if (!(err instanceof NotFoundError)) throw err;
    }
    if (!part) throw new NotFoundError(`No part ${partNumber}`);
    return part;
  }
  function binOr400(q: DbOrTx, code: string) {
    if (!q.select({ code: bins.code }).from(bins).where(eq(bins.code, code)).get()) throw new InvalidError(`No bin ${code}`, { binCode: [`no bin ${code}`] });
  }
  const stockIn = (q: DbOrTx, partId: number, binCode: string) =>
    q
      .select({ onHand: binStock.onHand, reserved: binStock.reserved })
      .from(binStock)
      .where(and(eq(binStock.partId, partId), eq(binStock.binCode, binCode)))
      .get();

  /** Goods-in: stock enters a bin and is given to waiting back-orders first, oldest order first. */
  const goodsIn = (input: { partNumber: string; binCode: string; quantity: number; note?: string }) =>
    db.transaction((tx) => {
      const part = partOr404(tx, input.partNumber);
      binOr400(tx, input.binCode);
      stock.goodsIn(part.id, input.binCode, input.quantity, input.note ?? null);
      // The receipt is the ledger row just written: its number prints this delivery's labels (GET /labels?receipts=).
      const receipt = tx
        .select({ id: sql<number>`max(${stockMovements.id})` })
        .from(stockMovements)
        .where(and(eq(stockMovements.partId, part.id), eq(stockMovements.binCode, input.binCode), eq(stockMovements.kind, 'goods-in')))
        .get()!.id;
      const waiting = tx
        .select({ lineId: orderLines.id, orderId: orderLines.orderId, number: orders.number, backordered: orderLines.quantityBackordered })
        .from(orderLines)
        .innerJoin(orders, eq(orders.id, orderLines.orderId))
        .where(and(eq(orderLines.partId, part.id), gt(orderLines.quantityBackordered, 0), notInArray(orders.status, ['cancelled', 'returned', 'pending_payment'])))
        .orderBy(orders.createdAt, orders.id)
        .all();
      const released: Array<{ orderNumber: string; quantity: number }> = [];
      for (const w of waiting) {
        const free = stock.available(part.id);
        if (free <= 0) break;
        const n = stock.reserve(part.id, Math.min(free, w.backordered), w.orderId);
        if (n <= 0) break;
        tx.update(orderLines)
          .set({ quantityBackordered: sql`${orderLines.quantityBackordered} - ${n}` })
          .where(eq(orderLines.id, w.lineId))
          .run();
        addEvent(tx, w.orderId, 'stock_arrived', `${n} × ${part.partNumber} arrived for the back-order`);
        released.push({ orderNumber: w.number, quantity: n });
      }
      return { partNumber: part.partNumber, binCode: input.binCode, onHand: stockIn(tx, part.id, input.binCode)?.onHand ?? 0, released, receipt: formatReceipt(receipt), quantity: input.quantity };
    });

  const adjust = (input: { partNumber: string; binCode: string; delta: number; reason: string }) =>
    db.transaction((tx) => {
      const part = partOr404(tx, input.partNumber);
      binOr400(tx, input.binCode);
      const row = stockIn(tx, part.id, input.binCode);
      const onHand = row?.onHand ?? 0;
      const reserved = row?.reserved ?? 0;
      if (onHand + input.delta < reserved) {
        throw new ConflictError(`${input.binCode} holds ${onHand}, of which ${reserved} are reserved for orders: it cannot go below ${reserved}`);
      }
      stock.adjust(part.id, input.binCode, input.delta, input.reason);
      return { onHand: onHand + input.delta, reserved };
    });

  function lowStock() {
    const waitingBackorders = db
      .select({ n: sql<number>`coalesce(sum(${orderLines.quantityBackordered}), 0)` })
      .from(orderLines)
      .innerJoin(orders, eq(orders.id, orderLines.orderId))
      .where(and(eq(orderLines.partId, parts.id), notInArray(orders.status, ['cancelled', 'returned'])));
    return db
      .select({
        partNumber: parts.partNumber,
        title: parts.title,
        available: sql<number>`coalesce(sum(${binStock.onHand} - ${binStock.reserved}), 0)`,
        onHand: sql<number>`coalesce(sum(${binStock.onHand}), 0)`,
        minStock: parts.minStock,
        waitingBackorders: sql<number>`${waitingBackorders}`.as('waitingBackorders'),
      })
      .from(parts)
      .leftJoin(binStock, eq(binStock.partId, parts.id))
      .where(eq(parts.status, 'active'))
      .groupBy(parts.id)
      // parts.available is the bins' sum as the stock service keeps it, so filtering and ordering need no second aggregate.
      .having(lte(parts.available, parts.minStock))
      .orderBy((r) => [desc(r.waitingBackorders), sql`${parts.available} - ${parts.minStock}`, parts.partNumber])
      .limit(500)
      .all()
}

  function stockDetail(partNumber: string) {
    const part = partOr404(db, partNumber);
    const ledger = (delta: typeof stockMovements.onHandDelta | typeof stockMovements.reservedDelta) =>
      sql<number>`${db
        .select({ n: sql`coalesce(sum(${delta}), 0)` })
        .from(stockMovements)
        .where(and(eq(stockMovements.partId, binStock.partId), eq(stockMovements.binCode, binStock.binCode)))}`;
    const binRows = db
      .select({
        binCode: binStock.binCode,
        onHand: binStock.onHand,
        reserved: binStock.reserved,
        ledgerOnHand: ledger(stockMovements.onHandDelta),
        ledgerReserved: ledger(stockMovements.reservedDelta),
      })
      .from(binStock)
      .innerJoin(bins, eq(bins.code, binStock.binCode))
      .where(eq(binStock.partId, part.id))
      .orderBy(bins.walkOrder)
      .all();
    const movements = db
      .select({
        id: stockMovements.id,
        binCode: stockMovements.binCode,
        kind: stockMovements.kind,
        onHandDelta: stockMovements.onHandDelta,
        reservedDelta: stockMovements.reservedDelta,
        orderNumber: orders.number,
        note: stockMovements.note,
        createdAt: stockMovements.createdAt,
      })
      .from(stockMovements)
      .leftJoin(orders, eq(orders.id, stockMovements.orderId))
      .where(eq(stockMovements.partId, part.id))
      .orderBy(desc(stockMovements.id))
      .limit(100)
      .all();
    return { partNumber: part.partNumber, title: part.title, bins: binRows, movements };
  }

  return { pickQueue, pickList, pick, pack, dispatch, goodsIn, adjust, lowStock, stockDetail };
}

export type WarehouseService = ReturnType<typeof createWarehouseService>;
