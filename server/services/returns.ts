import fs from 'node:fs';
import path from 'node:path';
import type Stripe from 'stripe';
import { and, count, desc, eq, inArray, ne, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../db/client';
import { creditNotes, orderEvents, orderLines, orders, parts, returnPhotos, returns } from '../db/schema';
import { ConflictError, InvalidError, NotFoundError, PaymentServiceError } from './errors';
import { REFUND_REFUSED_MESSAGE } from './orders/order-payments';
import type { CurrentUser } from './current-user';
import {
  DECISIONS_FOR_KIND,
  kindRestocks,
  normalizeReturnReference,
  RETURN_KINDS,
  RETURNS_PAGE_SIZE,
  type ReturnDecision,
  type ReturnLabel,
  type ReturnRequest,
  type ReturnsPage,
  type ReturnView,
} from '../../shared/schemas/warehouse';
import { code128Svg } from './barcodes';
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
  decisionReason: returns.decisionReason,
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
  shipLine1: orders.shipLine1,
  shipCity: orders.shipCity,
  shipPostcode: orders.shipPostcode,
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
    const core = Math.min(r.quantity * r.lineCoreDepositCents, left);
    // A core settles only its deposit: no decision on it may pay back more than that.
    return { full: Math.min(lineValue, left), core, max: r.kind === 'core' ? core : Math.min(lineValue, left) };
  }

  /** The photos of many returns in one query, by return id. */
  function photosOf(ids: number[]): Map<number, string[]> {
    const byReturn = new Map<number, string[]>();
    if (ids.length === 0) return byReturn;
    const rows = db
      .select({ returnId: returnPhotos.returnId, name: returnPhotos.storedName })
      .from(returnPhotos)
      .where(inArray(returnPhotos.returnId, ids))
      .orderBy(returnPhotos.id)
      .all();
    for (const p of rows) byReturn.set(p.returnId, [...(byReturn.get(p.returnId) ?? []), p.name]);
    return byReturn;
  }

  function view(r: ReturnRow, photos: string[]): ReturnView {
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
      decisionReason: r.decisionReason,
      creditNoteNumber: r.creditNoteNumber,
      paymentMethod: r.paymentMethod,
      maxRefundCents: r.status === 'requested' ? l.max : 0,
      coreDepositCents: r.quantity * r.lineCoreDepositCents,
      photos,
      customer: r.customer,
      createdAt: r.createdAt,
      decidedAt: r.decidedAt,
    };
  }

  const viewAll = (rows: ReturnRow[]) => {
    const photos = photosOf(rows.map((r) => r.id));
    return rows.map((r) => view(r, photos.get(r.id) ?? []));
  };
  const viewOne = (r: ReturnRow) => view(r, photosOf([r.id]).get(r.id) ?? []);

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
      return viewOne(get(db, create(user, input, photos)));
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
        const restock = (d.decision === 'full-refund' || d.decision === 'partial-refund') && d.restock === true;
        if (restock && kindRestocks(r.kind) && d.conditionGrade === 'as-new') {
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
          decisionReason: d.decision === 'partial-refund' ? d.reason : null,
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

  /** A decision must fit the kind of return (shared/schemas/warehouse.ts DECISIONS_FOR_KIND); anything else is refused before money moves. */
  function refuseMisfit(r: ReturnRow, d: ReturnDecision) {
    const fits = DECISIONS_FOR_KIND[r.kind];
    if (!fits.includes(d.decision)) {
      const why =
        r.kind === 'core'
          ? `${r.reference} is an exchange core: it settles the core deposit (all, part or none), never a refund of the unit`
          : `${r.reference} is a ${RETURN_KINDS[r.kind].toLowerCase()} return: it is refunded in full or in part, or rejected`;
      throw new InvalidError(why, { decision: [`choose one of: ${fits.join(', ')}`] });
    }
    if ('restock' in d && d.restock && !kindRestocks(r.kind)) {
      throw new InvalidError(`${r.reference} is an exchange core: it goes to the rebuild bench, not back on the shelf`, { restock: ['a core is not restocked'] });
    }
  }

  /**
   * Grades a received return and settles it. Card refunds go through the payment service with an idempotency key
   * per return, so a repeated request refunds once; the amount never exceeds what is left of the payment.
   */
  async function decide(id: number, d: ReturnDecision): Promise<ReturnView> {
    const r = get(db, id);
    if (r.status !== 'requested') throw new ConflictError(`${r.reference} was already decided`);
    refuseMisfit(r, d);
    const l = limits(r);
    let amount = 0;
    if (d.decision === 'core-refund') {
      if (r.lineCoreDepositCents === 0) throw new ConflictError('This line carried no core deposit');
      amount = l.core;
    } else if (d.decision === 'full-refund') {
      amount = l.full;
    } else if (d.decision === 'partial-refund') {
      if (d.amountCents > l.max && r.kind === 'core') {
        throw new InvalidError(`A core's refund is at most its deposit, ${formatMoney(l.max)}`, { amountCents: [`at most ${l.max} cents`] });
      }
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
    return viewOne(get(db, id));
  }

  function page(where: SQL | undefined, order: SQL[], pageNumber: number): ReturnsPage {
    const total = db.select({ n: count() }).from(returns).where(where).get()?.n ?? 0;
    const last = Math.max(1, Math.ceil(total / RETURNS_PAGE_SIZE));
    const p = Math.min(Math.max(1, Math.trunc(pageNumber) || 1), last);
    const rows = returnRows(db, where)
      .orderBy(...order)
      .limit(RETURNS_PAGE_SIZE)
      .offset((p - 1) * RETURNS_PAGE_SIZE)
      .all();
    return { items: viewAll(rows), total, page: p, pageSize: RETURNS_PAGE_SIZE };
  }

  /** A buyer's own returns, newest first, a page at a time. */
  function listOwn(user: CurrentUser, pageNumber = 1) {
    return page(eq(returns.userId, user.id), [desc(returns.id)], pageNumber);
  }
  /** The Floor's list: those waiting first (oldest first, the order they arrive in), then the decided, newest first. */
  function listAll(status: 'requested' | 'all', pageNumber = 1) {
    return page(status === 'requested' ? eq(returns.status, 'requested') : undefined, [ne(returns.status, 'requested'), sql`case when ${returns.status} = 'requested' then ${returns.id} else -${returns.id} end`], pageNumber);
  }

  /** The return a scanned or typed label code names, for the Floor. */
  function byReference(code: string): ReturnView {
    const reference = normalizeReturnReference(code);
    if (!reference) throw new InvalidError(`${code.trim().slice(0, 40)} is not a return label: those read like RT-5001`, { code: ['scan the return label'] });
    const r = returnRows(db, eq(returns.reference, reference)).get();
    if (!r) throw new NotFoundError(`No return ${reference}`);
    return viewOne(r);
  }

  /** The printable label of a return the buyer is sending: whose it is, where it goes, and its scannable code. */
  async function label(user: CurrentUser, code: string): Promise<ReturnLabel> {
    const reference = normalizeReturnReference(code);
    const r = reference ? returnRows(db, eq(returns.reference, reference)).get() : undefined;
    const staff = user.role === 'warehouse' || user.role === 'admin';
    if (!r || (r.userId !== user.id && !staff)) throw new NotFoundError(`No return ${code.slice(0, 20)}`);
    if (r.status !== 'requested') throw new ConflictError(`${r.reference} has already been received and decided: it needs no label`);
    return {
      reference: r.reference,
      orderNumber: r.orderNumber,
      partNumber: r.partNumber,
      title: r.title,
      quantity: r.quantity,
      kind: r.kind,
      createdAt: r.createdAt,
      from: { name: r.customer, line1: r.shipLine1, city: r.shipCity, postcode: r.shipPostcode },
      barcodeSvg: await code128Svg(r.reference),
    };
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

  return { request, decide, listOwn, listAll, byReference, label, photoAllowed, get: (id: number) => viewOne(get(db, id)), row: (id: number) => get(db, id) };
}

export type ReturnsService = ReturnType<typeof createReturnsService>;
