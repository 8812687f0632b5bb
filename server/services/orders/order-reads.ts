import { count, desc, eq, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { preparedOn } from '../../db/prepared';
import { dealerAccounts, orderEvents, orderLines, orders, parts, returns, shipments, units } from '../../db/schema';
import { DEFAULT_TRACKING_URLS, trackingUrl, type TrackingUrlPatterns } from '../../../shared/carriers';
import { NotFoundError } from '../errors';
import type { CurrentUser } from '../current-user';
import type { OrderDetail, OrderSummary } from '../../../shared/schemas/orders';
import type { CartService } from '../cart';
import { orientationFrom, orientationProblem, type Orientation } from '../../../shared/exploded-view';

/** The database or the transaction a query runs in: better-sqlite3 has one connection, so both see the same data. */
export type Query = Pick<Db, 'select' | 'insert' | 'update'>;

/** What the order flow reads of an order to decide what may happen to it. */
export const headerColumns = {
  id: orders.id,
  number: orders.number,
  userId: orders.userId,
  status: orders.status,
  paymentMethod: orders.paymentMethod,
  paymentState: orders.paymentState,
  paymentIntentId: orders.paymentIntentId,
  totalCents: orders.totalCents,
  refundedCents: orders.refundedCents,
};

/** One order's header by id, number or payment intent; the other modules of the order flow share it. */
export function findOrder(q: Query, where: SQL) {
  return q.select(headerColumns).from(orders).where(where).get();
}

/** The same header by payment intent, prepared once per connection: every payment webhook looks one up. */
export function findOrderByIntent(q: Query, intentId: string) {
  return preparedOn(q, 'orders:header-by-intent', (h) => h.select(headerColumns).from(orders).where(eq(orders.paymentIntentId, sql.placeholder('intentId'))).prepare()).get({ intentId });
}

export type OrderHeader = NonNullable<ReturnType<typeof findOrder>>;

/** Units of a line already on a return that is open or settled; a rejected one gives them back. */
const claimedByReturns = sql<number>`(select coalesce(sum(${returns.quantity}), 0) from ${returns} where ${returns.orderLineId} = ${orderLines.id} and ${returns.status} <> 'rejected')`;

export function createOrderReads(deps: { db: Db; cart: CartService; trackingUrls?: TrackingUrlPatterns }) {
  const { db, cart } = deps;
  const trackingPatterns = deps.trackingUrls ?? DEFAULT_TRACKING_URLS;

  /** A signed-in user's own order; someone else's answers 404 exactly like a missing one. */
  function ownOrder(user: CurrentUser, number: string): OrderHeader {
    const order = findOrder(db, eq(orders.number, number));
    const allowed = order && (order.userId === user.id || user.role === 'admin' || user.role === 'warehouse');
    if (!order || !allowed) throw new NotFoundError(`No order ${number}`);
    return order;
  }

  function listOrders(user: CurrentUser): OrderSummary[] {
    return db
      .select({
        number: orders.number,
        status: orders.status,
        paymentMethod: orders.paymentMethod,
        paymentState: orders.paymentState,
        purchaseOrder: orders.purchaseOrder,
        totalCents: orders.totalCents,
        createdAt: orders.createdAt,
        lineCount: count(orderLines.id),
        hasBackorder: sql<boolean>`max(${orderLines.quantityBackordered} > 0)`.mapWith((v: number) => v === 1),
        unitsDispatched: sql<number>`sum(${orderLines.quantityDispatched})`,
      })
      .from(orders)
      .innerJoin(orderLines, eq(orderLines.orderId, orders.id))
      .where(eq(orders.userId, user.id))
      .groupBy(orders.id)
      .orderBy(desc(orders.id))
      .limit(200)
      .all();
  }

  function orderDetail(user: CurrentUser, number: string): OrderDetail {
    const { id } = ownOrder(user, number);
    const found = db
      .select({ order: orders, companyName: dealerAccounts.companyName })
      .from(orders)
      .leftJoin(dealerAccounts, eq(dealerAccounts.id, orders.dealerAccountId))
      .where(eq(orders.id, id))
      .get();
    if (!found) throw new NotFoundError(`No order ${number}`);
    const { order: o, companyName } = found;
    const lines = db
      .select({
        id: orderLines.id,
        partNumber: orderLines.partNumber,
        title: orderLines.title,
        quantity: orderLines.quantity,
        quantityBackordered: orderLines.quantityBackordered,
        quantityPicked: orderLines.quantityPicked,
        quantityDispatched: orderLines.quantityDispatched,
        quantityReturnable: sql<number>`max(0, ${orderLines.quantityDispatched} - ${claimedByReturns})`,
        unitPriceCents: orderLines.unitPriceCents,
        coreDepositCents: orderLines.coreDepositCents,
        lineCents: sql<number>`${orderLines.unitPriceCents} * ${orderLines.quantity}`,
        fitmentSummary: orderLines.fitmentSummary,
        compressorOutletClock: orderLines.compressorOutletClock,
        turbineInletClock: orderLines.turbineInletClock,
        category: parts.category,
        condition: parts.condition,
      })
      .from(orderLines)
      .innerJoin(parts, eq(parts.id, orderLines.partId))
      .where(eq(orderLines.orderId, id))
      .orderBy(orderLines.id)
      .all()
      .map(({ compressorOutletClock, turbineInletClock, ...l }) => ({ ...l, orientation: orientationFrom(compressorOutletClock, turbineInletClock) }));
    const serials = db
      .select({ lineId: units.orderLineId, serial: units.serial })
      .from(units)
      .innerJoin(orderLines, eq(orderLines.id, units.orderLineId))
      .where(eq(orderLines.orderId, id))
      .orderBy(units.serial)
      .all();
    const timeline = db
      .select({ status: orderEvents.status, note: orderEvents.note, at: orderEvents.createdAt })
      .from(orderEvents)
      .where(eq(orderEvents.orderId, id))
      .orderBy(orderEvents.id)
      .all();
    const sent = db
      .select({ carrier: shipments.carrier, trackingNumber: shipments.trackingNumber, cartons: shipments.cartons, units: shipments.units, at: shipments.createdAt })
      .from(shipments)
      .where(eq(shipments.orderId, id))
      .orderBy(shipments.id)
      .all();
    const asked = db
      .select({ reference: returns.reference, lineId: returns.orderLineId, quantity: returns.quantity, status: returns.status, kind: returns.kind })
      .from(returns)
      .where(eq(returns.orderId, id))
      .orderBy(returns.id)
      .all();
    return {
      number: o.number,
      status: o.status,
      paymentMethod: o.paymentMethod,
      paymentState: o.paymentState,
      purchaseOrder: o.purchaseOrder,
      totalCents: o.totalCents,
      createdAt: o.createdAt,
      lineCount: lines.length,
      hasBackorder: lines.some((l) => l.quantityBackordered > 0),
      unitsDispatched: lines.reduce((n, l) => n + l.quantityDispatched, 0),
      email: o.email,
      paymentTermsDays: o.paymentTermsDays,
      lines: lines.map((l) => ({ ...l, serials: serials.filter((u) => u.lineId === l.id).map((u) => u.serial) })),
      totals: {
        goodsCents: o.goodsCents,
        discountCents: o.discountCents,
        coreDepositCents: o.coreDepositCents,
        freightCents: o.freightCents,
        taxCents: o.taxCents,
        totalCents: o.totalCents,
        weightGrams: o.weightGrams,
        refundedCents: o.refundedCents,
      },
      delivery: { name: o.shipName, line1: o.shipLine1, city: o.shipCity, postcode: o.shipPostcode, zone: o.deliveryZone },
      dispatch: { carrier: o.carrier, trackingNumber: o.trackingNumber, cartons: o.cartons },
      timeline,
      dealer: companyName ? { companyName } : null,
      shipments: sent.map((x) => ({ ...x, trackingUrl: trackingUrl(trackingPatterns, x.carrier, x.trackingNumber) })),
      returns: asked,
    };
  }

  /**
   * Rebuilds the cart from a past order; superseded parts are replaced by what supersedes them, with a notice. A
   * complete unit keeps the orientation it was ordered in (it goes back into the same installation), unless the part
   * now sold cannot be built that way: then it comes in its frame's standard position, with a notice.
   */
  function reorder(user: CurrentUser, number: string) {
    const { id } = ownOrder(user, number);
    const lines = db
      .select({ partNumber: orderLines.partNumber, quantity: orderLines.quantity, compressorOutletClock: orderLines.compressorOutletClock, turbineInletClock: orderLines.turbineInletClock })
      .from(orderLines)
      .where(eq(orderLines.orderId, id))
      .orderBy(orderLines.id)
      .all();
    const notices: string[] = [];
    const addable: Array<{ partNumber: string; quantity: number; orientation?: Orientation }> = [];
    for (const l of lines) {
      const resolved = cart.resolvePart(l.partNumber);
      if (!resolved) {
        notices.push(`${l.partNumber} is no longer in the catalogue and was left out.`);
        continue;
      }
      if (resolved.part.status === 'discontinued' && resolved.part.available <= 0) {
        notices.push(`${resolved.part.partNumber} is discontinued and out of stock, so it was left out.`);
        continue;
      }
      // The line is added under its new number, so addLines cannot see the supersession: say so here.
      if (resolved.replacedFrom) notices.push(`${l.partNumber} is superseded: ${resolved.part.partNumber} was added instead.`);
      const part = resolved.part;
      let orientation = orientationFrom(l.compressorOutletClock, l.turbineInletClock) ?? undefined;
      if (orientation && orientationProblem(part, part.frameCode ? { code: part.frameCode, flangePattern: part.flangePattern ?? '' } : null, orientation)) {
        notices.push(`${part.partNumber} cannot be built in the orientation of ${l.partNumber}: it comes in its standard position.`);
        orientation = undefined;
      }
      addable.push({ partNumber: part.partNumber, quantity: l.quantity, orientation });
    }
    const view = addable.length ? cart.addLines({ userId: user.id }, user, addable) : cart.view({ userId: user.id }, user);
    return { added: addable.length, notices: [...view.notices, ...notices] };
  }

  function orderForIntent(user: CurrentUser, intentId: string): OrderHeader {
    const order = findOrderByIntent(db, intentId);
    if (!order || order.userId !== user.id) throw new NotFoundError('No such payment');
    return order;
  }

  return { ownOrder, listOrders, orderDetail, reorder, orderForIntent };
}

export type OrderReads = ReturnType<typeof createOrderReads>;
