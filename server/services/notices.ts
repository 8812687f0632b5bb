import { and, count, desc, eq, isNull, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { preparedOn } from '../db/prepared';
import { creditNotes, notices, orderLines, orders, returns, shipments } from '../db/schema';
import { formatPrice } from '../../shared/catalog';
import { NOTICES_PAGE_SIZE, type NoticesPage } from '../../shared/schemas/notices';
import type { NoticeKind } from '../../shared/allowed-values';
import type { CurrentUser } from './current-user';
import type { Query } from './orders/order-reads';
import type { OrderNotifier } from './orders';
import type { OrderChangeNotifier } from './orders/order-changes';
import type { WarehouseNotifier } from './warehouse';
import type { ReturnsNotifier } from './returns';
import { NotFoundError } from './errors';

const now = sql<string>`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;

/**
 * On-site notices for buyers: one row per change of an order or return that the buyer is also e-mailed about, written
 * in the transaction of that change (beside the outbox row), so a change that rolls back leaves no notice either.
 */
export function createNotices(deps: { db: Db }) {
  const { db } = deps;

  // Each paid order writes a notice: the two queries are built and prepared once per connection.
  const $ = sql.placeholder;
  const orderOf = (q: Query, orderId: number) =>
    preparedOn(q, 'notices:order', (h) =>
      h
        .select({ id: orders.id, number: orders.number, userId: orders.userId, totalCents: orders.totalCents, paymentState: orders.paymentState, purchaseOrder: orders.purchaseOrder })
        .from(orders)
        .where(eq(orders.id, $('orderId')))
        .prepare(),
    ).get({ orderId });

  function add(q: Query, n: { userId: string; orderId: number | null; kind: NoticeKind; title: string; body: string; link: string }) {
    preparedOn(q, 'notices:add', (h) =>
      h.insert(notices).values({ userId: $('userId'), orderId: $('orderId'), kind: $('kind'), title: $('title'), body: $('body'), link: $('link') }).prepare(),
    ).run(n);
  }

  const waitingLines = (q: Query, orderId: number) =>
    q
      .select({ partNumber: orderLines.partNumber, backordered: orderLines.quantityBackordered })
      .from(orderLines)
      .where(and(eq(orderLines.orderId, orderId), sql`${orderLines.quantityBackordered} > 0`))
      .orderBy(orderLines.id)
      .all();
  const listParts = (lines: Array<{ partNumber: string; backordered: number }>) => lines.map((l) => `${l.backordered} × ${l.partNumber}`).join(', ');

  const orders_: OrderNotifier = {
    orderConfirmed(q, orderId) {
      const o = orderOf(q, orderId);
      if (!o) return;
      const link = `/orders/${o.number}`;
      if (o.paymentState === 'on_account') {
        add(q, { userId: o.userId, orderId, kind: 'on-account', title: `${o.number} placed on account`, body: `${formatPrice(o.totalCents)} on your trade account${o.purchaseOrder ? `, purchase order ${o.purchaseOrder}` : ''}. It goes to the warehouse for picking.`, link });
      } else if (o.paymentState === 'paid') {
        add(q, { userId: o.userId, orderId, kind: 'paid', title: `Payment received for ${o.number}`, body: `${formatPrice(o.totalCents)} paid by card. The order goes to the warehouse for picking.`, link });
      }
    },
    paymentFailed() {
      // The buyer is at checkout when a payment fails and sees it there; the e-mail covers a later failure.
    },
    backordered(q, orderId) {
      const o = orderOf(q, orderId);
      const waiting = o ? waitingLines(q, orderId) : [];
      if (!o || waiting.length === 0) return;
      add(q, { userId: o.userId, orderId, kind: 'back-ordered', title: `Part of ${o.number} is on back-order`, body: `Waiting for stock: ${listParts(waiting)}. The rest is picked now; the back-order follows when stock arrives.`, link: `/orders/${o.number}` });
    },
  };

  const warehouse: WarehouseNotifier = {
    pickingStarted(q, orderId) {
      const o = orderOf(q, orderId);
      if (!o) return;
      add(q, { userId: o.userId, orderId, kind: 'picking', title: `${o.number} is being picked`, body: 'The warehouse has started picking your order from the shelves.', link: `/orders/${o.number}` });
    },
    shortPicked(q, orderId, short) {
      const o = orderOf(q, orderId);
      if (!o) return;
      const what = short.map((l) => `${l.backordered} × ${l.partNumber}`).join(', ');
      add(q, { userId: o.userId, orderId, kind: 'back-ordered', title: `Part of ${o.number} is on back-order`, body: `Not on the shelf when we picked: ${what}. It follows when stock arrives; the rest carries on.`, link: `/orders/${o.number}` });
    },
    dispatched(q, orderId, shipmentId) {
      const o = orderOf(q, orderId);
      const s = q.select({ carrier: shipments.carrier, trackingNumber: shipments.trackingNumber, units: shipments.units }).from(shipments).where(eq(shipments.id, shipmentId)).get();
      if (!o || !s) return;
      const waiting = waitingLines(q, orderId);
      const rest = waiting.length > 0 ? ` Still on back-order: ${listParts(waiting)}.` : '';
      add(q, {
        userId: o.userId,
        orderId,
        kind: 'dispatched',
        title: `${o.number} is on its way`,
        body: `${s.units} ${s.units === 1 ? 'unit' : 'units'} with ${s.carrier}, tracking ${s.trackingNumber}.${rest}`,
        link: `/orders/${o.number}`,
      });
    },
  };

  const returns_: ReturnsNotifier = {
    returnDecided(q, returnId) {
      const r = q
        .select({
          reference: returns.reference,
          userId: returns.userId,
          orderId: returns.orderId,
          kind: returns.kind,
          status: returns.status,
          decision: returns.decision,
          refundCents: returns.refundCents,
          rejectReason: returns.rejectReason,
          decisionReason: returns.decisionReason,
          creditNote: creditNotes.number,
        })
        .from(returns)
        .leftJoin(creditNotes, eq(creditNotes.returnId, returns.id))
        .where(eq(returns.id, returnId))
        .get();
      if (!r) return;
      const how = r.creditNote ? `as credit note ${r.creditNote}` : 'to your card';
      const why = r.decisionReason ? ` Why less: ${r.decisionReason}.` : '';
      const body =
        r.status === 'rejected'
          ? `Not accepted: ${r.rejectReason ?? 'no reason given'}.`
          : r.kind === 'core'
            ? `${r.decision === 'partial-refund' ? 'Part of the core deposit' : 'Core deposit'}: ${formatPrice(r.refundCents)} refunded ${how}.${why}`
            : `${r.decision === 'partial-refund' ? 'Partial refund' : 'Refund'} of ${formatPrice(r.refundCents)} ${how}.${why}`;
      add(q, { userId: r.userId, orderId: r.orderId, kind: 'return-decided', title: `Return ${r.reference} decided`, body, link: `/returns?ref=${r.reference}` });
    },
  };

  const unreadOf = (userId: string) => db.select({ n: count() }).from(notices).where(and(eq(notices.userId, userId), isNull(notices.readAt))).get()?.n ?? 0;

  function list(user: CurrentUser, pageNumber = 1): NoticesPage {
    const total = db.select({ n: count() }).from(notices).where(eq(notices.userId, user.id)).get()?.n ?? 0;
    const last = Math.max(1, Math.ceil(total / NOTICES_PAGE_SIZE));
    const page = Math.min(Math.max(1, Math.trunc(pageNumber) || 1), last);
    const items = db
      .select({ id: notices.id, kind: notices.kind, title: notices.title, body: notices.body, link: notices.link, readAt: notices.readAt, createdAt: notices.createdAt })
      .from(notices)
      .where(eq(notices.userId, user.id))
      .orderBy(desc(notices.id))
      .limit(NOTICES_PAGE_SIZE)
      .offset((page - 1) * NOTICES_PAGE_SIZE)
      .all()
      .map(({ readAt, ...n }) => ({ ...n, read: readAt !== null }));
    return { items, total, unread: unreadOf(user.id), page, pageSize: NOTICES_PAGE_SIZE };
  }

  function markRead(user: CurrentUser, id: number) {
    const done = db
      .update(notices)
      .set({ readAt: sql`coalesce(${notices.readAt}, ${now})` })
      .where(and(eq(notices.id, id), eq(notices.userId, user.id)))
      .run();
    if (done.changes === 0) throw new NotFoundError('No such notice');
    return { unread: unreadOf(user.id) };
  }

  function markAllRead(user: CurrentUser) {
    db.update(notices).set({ readAt: now }).where(and(eq(notices.userId, user.id), isNull(notices.readAt))).run();
    return { unread: 0 };
  }

  return { orders: orders_, warehouse, returns: returns_, list, unread: (user: CurrentUser) => ({ unread: unreadOf(user.id) }), markRead, markAllRead };
}

export type NoticesService = ReturnType<typeof createNotices>;

/** The notifiers the services call: each change is e-mailed (the outbox) and kept as an on-site notice, in one transaction. */
export function withNotices(
  mail: { orders: OrderNotifier & OrderChangeNotifier; warehouse: WarehouseNotifier; returns: ReturnsNotifier },
  notices: Pick<NoticesService, 'orders' | 'warehouse' | 'returns'>,
): { orders: OrderNotifier & OrderChangeNotifier; warehouse: WarehouseNotifier; returns: ReturnsNotifier } {
  return {
    orders: {
      orderConfirmed: (tx, id) => (mail.orders.orderConfirmed(tx, id), notices.orders.orderConfirmed(tx, id)),
      paymentFailed: (tx, id, reason) => (mail.orders.paymentFailed(tx, id, reason), notices.orders.paymentFailed(tx, id, reason)),
      backordered: (tx, id) => (mail.orders.backordered(tx, id), notices.orders.backordered(tx, id)),
      // A buyer's own change is confirmed by e-mail only: they made it on the page that shows it.
      orderChanged: (tx, id) => mail.orders.orderChanged(tx, id),
    },
    warehouse: {
      pickingStarted: (tx, id) => (mail.warehouse.pickingStarted?.(tx, id), notices.warehouse.pickingStarted?.(tx, id)),
      shortPicked: (tx, id, lines) => (mail.warehouse.shortPicked(tx, id, lines), notices.warehouse.shortPicked(tx, id, lines)),
      dispatched: (tx, id, shipmentId) => (mail.warehouse.dispatched(tx, id, shipmentId), notices.warehouse.dispatched(tx, id, shipmentId)),
    },
    returns: {
      returnDecided: (tx, id) => (mail.returns.returnDecided(tx, id), notices.returns.returnDecided(tx, id)),
    },
  };
}
