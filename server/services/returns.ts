import fs from 'node:fs';
import path from 'node:path';
import type Stripe from 'stripe';
import { and, desc, eq, ne, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../db/client';
import { creditNotes, orderEvents, orderLines, orders, parts, returnPhotos, returns } from '../db/schema';
import { ConflictError, InvalidError, NotFoundError, PaymentServiceError } from './errors';
import { REFUND_REFUSED_MESSAGE } from './orders/order-payments';
import type { CurrentUser } from './current-user';
import type { ReturnDecision, ReturnRequest, ReturnView } from '../../shared/schemas/warehouse';
import { formatMoney } from '../../shared/format';
import type { StockService } from './stock';
import type { StoredImage } from './uploads';

/** What the returns desk tells the customer, written in the transaction of the decision (the mail outbox in the app). */
export interface ReturnsNotifier {
  returnDecided(tx: DbOrTx, returnId: number): void;
}

/** The same expression as the schema's timestamp defaults. */
const now = sql<string>`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;

/** The database or the transaction a query runs in: better-sqlite3 has one connection, so both see the same data. */
type DbOrTx = Pick<Db, 'select' | 'insert' | 'update'>;

const returnColumns = {
  id: returns.id,
  reference: returns.reference,
  orderId: returns.orderId,
  orderNumber: orders.number,
  orderLineId: returns.orderLineId,
  userId: returns.userId,
  partId: orderLines.partId,
  partNumber: orderLines.partNumber,
  title: orderLines.title,
  quantity: returns.quantity,
  kind: returns.kind,
  reason: returns.reason,
  status: returns.status,
  conditionGrade: returns.conditionGrade,
  decision: returns.decision,
  refundCents: returns.refundCents,
  rejectReason: returns.rejectReason,
  creditNoteNumber: creditNotes.number,
  paymentMethod: orders.paymentMethod,
  paymentState: orders.paymentState,
  paymentIntentId: orders.paymentIntentId,
  dealerAccountId: orders.dealerAccountId,
  orderTotalCents: orders.totalCents,
  orderRefundedCents: orders.refundedCents,
  unitPriceCents: orderLines.unitPriceCents,
  lineCoreDepositCents: orderLines.coreDepositCents,
  customer: orders.shipName,
  createdAt: returns.createdAt,
  decidedAt: returns.decidedAt,
};

function returnRows(q: DbOrTx, where: SQL | undefined) {
  return q
    .select(returnColumns)
    .from(returns)
    .innerJoin(orders, eq(orders.id, returns.orderId))
    .innerJoin(orderLines, eq(orderLines.id, returns.orderLineId))
    .leftJoin(creditNotes, eq(creditNotes.returnId, returns.id))
    .where(where);
}
type ReturnRow = NonNullable<ReturnType<ReturnType<typeof returnRows>['get']>>;

export function createReturnsService(deps: { db: Db; stock: StockService; payments: Stripe; notify: ReturnsNotifier; photosDir: string; taxRatePct: number }) {
  const { db, stock, payments } = deps;

  /** The most a return can refund: the line's value with tax and deposit, capped by what is left of the payment. */
  function limits(r: ReturnRow) {
    const unitWithTax = Math.round(r.unitPriceCents * (1 + deps.taxRatePct / 100));
    const lineValue = r.quantity * (unitWithTax + r.lineCoreDepositCents);
    const paid = r.paymentMethod === 'card' ? (['paid', 'partially_refunded', 'refunded'].includes(r.paymentState) ? r.orderTotalCents : 0) : r.orderTotalCents;
    const left = Math.max(0, paid - r.orderRefundedCents);
    return { full: Math.min(lineValue, left), core: Math.min(r.quantity * r.lineCoreDepositCents, left), max: Math.min(lineValue, left) };
  }

  const photosOf = (returnId: number) =>
    db
      .select({ name: returnPhotos.storedName })
      .from(returnPhotos)
      .where(eq(returnPhotos.returnId, returnId))
      .orderBy(returnPhotos.id)
      .all()
      .map((p) => p.name);

  function view(r: ReturnRow): ReturnView {
    const l = limits(r);
    return {
      id: r.id,
      reference: r.reference,
      orderNumber: r.orderNumber,
      partNumber: r.partNumber,
      title: r.title,
      quantity: r.quantity,
      kind: r.kind,
      reason: r.reason,
      status: r.status,
      conditionGrade: r.conditionGrade,
      decision: r.decision,
      refundCents: r.refundCents,
      rejectReason: r.rejectReason,
      creditNoteNumber: r.creditNoteNumber,
      paymentMethod: r.paymentMethod,
      maxRefundCents: r.status === 'requested' ? l.max : 0,
      coreDepositCents: r.quantity * r.lineCoreDepositCents,
      photos: photosOf(r.id),
      customer: r.customer,
      createdAt: r.createdAt,
      decidedAt: r.decidedAt,
    };
  }

  const get = (q: DbOrTx, id: number) => {
    const r = returnRows(q, eq(returns.id, id)).get();
    if (!r) throw new NotFoundError('No such return');
    return r;
  };

  const create = (user: CurrentUser, input: ReturnRequest, photos: StoredImage[]) =>
    db.transaction((tx) => {
      const line = tx
        .select({ id: orderLines.id, dispatched: orderLines.quantityDispatched, condition: parts.condition, orderId: orders.id, userId: orders.userId })
        .from(orderLines)
        .innerJoin(orders, eq(orders.id, orderLines.orderId))
        .innerJoin(parts, eq(parts.id, orderLines.partId))
        .where(and(eq(orderLines.id, input.lineId), eq(orders.number, input.orderNumber)))
        .get();
      if (!line || line.userId !== user.id) throw new NotFoundError(`No such line on order ${input.orderNumber}`);
      if (input.kind === 'core' && line.condition !== 'exchange') throw new ConflictError('Only exchange units come back as cores');
      const already = tx
        .select({ n: sql<number>`coalesce(sum(${returns.quantity}), 0)` })
        .from(returns)
        .where(and(eq(returns.orderLineId, line.id), ne(returns.status, 'rejected')))
        .get();
      const left = line.dispatched - (already?.n ?? 0);
      if (left <= 0) throw new ConflictError(line.dispatched === 0 ? 'This line has not been dispatched yet' : 'Everything on this line is already being returned');
      if (input.quantity > left) throw new ConflictError(`At most ${left} of this line can come back`);
      const id = tx.select({ next: sql<number>`coalesce(max(${returns.id}), 0) + 1` }).from(returns).get()?.next ?? 1;
      tx.insert(returns)
        .values({ id, reference: `RT-${String(5000 + id)}`, orderId: line.orderId, orderLineId: line.id, userId: user.id, kind: input.kind, quantity: input.quantity, reason: input.reason })
        .run();
      if (photos.length > 0) {
        tx.insert(returnPhotos)
          .values(photos.map((p) => ({ returnId: id, storedName: p.storedName, mimeType: p.mimeType, bytes: p.bytes })))
          .run();
      }
      tx.insert(orderEvents)
        .values({ orderId: line.orderId, status: 'return_requested', note: `RT-${5000 + id}: ${input.quantity} × ${input.kind}` })
        .run();
      return id;
    });

  function request(user: CurrentUser, input: ReturnRequest, photos: StoredImage[]) {
    try {
      return view(get(db, create(user, input, photos)));
    } catch (err) {
      for (const p of photos) fs.rmSync(path.join(deps.photosDir, p.storedName), { force: true });
      throw err;
    }
  }

  const record = (id: number, d: ReturnDecision, amount: number, refundId: string | null) =>
    db.transaction((tx) => {
      const r = get(tx, id);
      if (r.status !== 'requested') throw new ConflictError(`${r.reference} was already decided`);
      let status: ReturnView['status'] = 'rejected';
      if (d.decision !== 'reject') {
        if (r.paymentMethod === 'card') {
          status = 'refunded';
        } else {
          status = 'credited';
          if (r.dealerAccountId === null) throw new Error(`${r.reference} is on an account order without a dealer account`);
          const n = tx.select({ next: sql<number>`coalesce(max(${creditNotes.id}), 0) + 1` }).from(creditNotes).get()?.next ?? 1;
          tx.insert(creditNotes).values({ number: `CN-${7000 + n}`, dealerAccountId: r.dealerAccountId, orderId: r.orderId, returnId: r.id, amountCents: amount }).run();
        }
        tx.update(orders)
          .set({ refundedCents: sql`${orders.refundedCents} + ${amount}` })
          .where(eq(orders.id, r.orderId))
          .run();
        if (r.paymentMethod === 'card') {
          tx.update(orders)
            .set({ paymentState: sql`case when ${orders.refundedCents} >= ${orders.totalCents} then 'refunded' else 'partially_refunded' end` })
            .where(eq(orders.id, r.orderId))
            .run();
        }
        if (d.decision === 'full-refund' && d.restock && d.conditionGrade === 'as-new') {
          const bin = stock.defaultBin(r.partId) ?? 'A-01-1';
          stock.returnIn(r.partId, bin, r.quantity, r.orderId, `${r.reference} back to stock`);
        }
      }
      tx.update(returns)
        .set({
          status,
          conditionGrade: d.conditionGrade,
          decision: d.decision,
          refundCents: amount,
          rejectReason: d.decision === 'reject' ? d.rejectReason : null,
          paymentRefundId: refundId,
          decidedAt: now,
        })
        .where(eq(returns.id, id))
        .run();
      const note = d.decision === 'reject' ? `${r.reference} rejected` : `${r.reference}: ${status === 'credited' ? 'credit note' : 'refund'} of ${formatMoney(amount)}`;
      tx.insert(orderEvents)
        .values({ orderId: r.orderId, status: d.decision === 'reject' ? 'return_rejected' : 'returned', note })
        .run();
      const paidBack = tx
        .select({ fully: sql<number>`${orders.refundedCents} >= ${orders.totalCents}` })
        .from(orders)
        .where(eq(orders.id, r.orderId))
        .get();
      if (paidBack?.fully) tx.update(orders).set({ status: 'returned' }).where(eq(orders.id, r.orderId)).run();
      deps.notify.returnDecided(tx, id);
    });

  /**
   * Grades a received return and settles it. Card refunds go through the payment service with an idempotency key
   * per return, so a repeated request refunds once; the amount never exceeds what is left of the payment.
   */
  async function decide(id: number, d: ReturnDecision): Promise<ReturnView> {
    const r = get(db, id);
    if (r.status !== 'requested') throw new ConflictError(`${r.reference} was already decided`);
    const l = limits(r);
    let amount = 0;
    if (d.decision === 'core-refund') {
      if (r.kind !== 'core' && r.lineCoreDepositCents === 0) throw new ConflictError('This line carried no core deposit');
      amount = l.core;
    } else if (d.decision === 'full-refund') {
      amount = l.full;
    } else if (d.decision === 'partial-refund') {
      if (d.amountCents > l.max) throw new InvalidError(`At most ${formatMoney(l.max)} can be refunded on this return`, { amountCents: [`at most ${l.max} cents`] });
      amount = d.amountCents;
    }
    if (d.decision !== 'reject' && amount <= 0) throw new ConflictError('Nothing is left to refund on this order');
    let refundId: string | null = null;
    if (d.decision !== 'reject' && r.paymentMethod === 'card') {
      if (!r.paymentIntentId) throw new ConflictError('This order has no card payment to refund');
      try {
        const refund = await payments.refunds.create(
          { payment_intent: r.paymentIntentId, amount, reason: 'requested_by_customer', metadata: { return_reference: r.reference } },
          { idempotencyKey: `return-${r.reference}-refund` },
        );
        refundId = refund.id;
      } catch (err) {
        console.warn(`payments: the refund for ${r.reference} failed:`, (err as Error).message);
        throw new PaymentServiceError(REFUND_REFUSED_MESSAGE);
      }
    }
    record(id, d, amount, refundId);
    return view(get(db, id));
  }

  function listOwn(user: CurrentUser) {
    return returnRows(db, eq(returns.userId, user.id)).orderBy(desc(returns.id)).all().map(view);
  }
  function listAll(status: 'requested' | 'all') {
    return returnRows(db, status === 'requested' ? eq(returns.status, 'requested') : undefined)
      .orderBy(ne(returns.status, 'requested'), returns.id)
      .all()
      .map(view);
  }
  function photoAllowed(user: CurrentUser, storedName: string) {
    const owner = db
      .select({ userId: returns.userId })
      .from(returnPhotos)
      .innerJoin(returns, eq(returns.id, returnPhotos.returnId))
      .where(eq(returnPhotos.storedName, storedName))
      .get()?.userId;
    return owner !== undefined && (owner === user.id || user.role === 'warehouse' || user.role === 'admin');
  }

  return { request, decide, listOwn, listAll, photoAllowed, get: (id: number) => view(get(db, id)), row: (id: number) => get(db, id) };
}

export type ReturnsService = ReturnType<typeof createReturnsService>;
