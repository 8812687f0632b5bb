import { and, desc, eq, inArray, lt, sql } from 'drizzle-orm';
import type Stripe from 'stripe';
import type { Db } from '../../db/client';
import { orderChanges, orderLines, orders } from '../../db/schema';
import { ConflictError, InvalidError, NotFoundError, PaymentServiceError } from '../errors';
import type { CurrentUser } from '../current-user';
import type { StockService } from '../stock';
import { changeRefusal, reduceLine, repriceOrder } from '../../../shared/order-changes';
import { DELIVERY_ZONE_KEYS, type DeliveryZone } from '../../../shared/pricing';
import { formatPrice } from '../../../shared/catalog';
import {
  OrderChangeLineSchema,
  type ChangeOrder,
  type OrderChangeLine,
  type OrderChangeResult,
  type OrderChanges,
  type OrderChangeView,
} from '../../../shared/schemas/order-changes';
import type { OrderStatus } from '../../../shared/schemas/orders';
import { addOrderEvent } from './order-placement';
import type { Query } from './order-reads';

/** Tells the buyer what changed, written in the transaction of the change (the mail outbox in the app). */
export interface OrderChangeNotifier {
  orderChanged(tx: Query, changeId: number): void;
}

export interface OrderChangesDeps {
  db: Db;
  stock: StockService;
  payments: Stripe;
  notify: OrderChangeNotifier;
  taxRatePct: number;
  now: () => Date;
}

const now = sql<string>`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;
const isZone = (z: string): z is DeliveryZone => DELIVERY_ZONE_KEYS.some((k) => k === z);
const units = (n: number) => `${n} unit${n === 1 ? '' : 's'}`;

/** The order's status once nothing waits only for stock any more: back where the warehouse picks it up. */
const readyStatus = (method: 'card' | 'account'): OrderStatus => (method === 'account' ? 'on_account' : 'paid');

/**
 * Buyer's changes to an order before picking starts (docs/decisions/0008-order-changes.md). The order, its stock and
 * the notice change in one immediate transaction, which also re-checks that picking has not started, so the warehouse
 * and the buyer cannot both win. A card refund is asked of the provider after that commit (better-sqlite3 cannot wait
 * inside a transaction), once, with an idempotency key per change; a refund the provider refused is tried again by
 * the housekeeping job.
 */
export function createOrderChanges(deps: OrderChangesDeps) {
  const { db, stock, payments, notify } = deps;

  function orderRow(q: Query, number: string) {
    return q.select().from(orders).where(eq(orders.number, number)).get();
  }
  function linesOf(q: Query, orderId: number) {
    return q.select().from(orderLines).where(eq(orderLines.orderId, orderId)).orderBy(orderLines.id).all();
  }

  /** The buyer's own order (someone else's answers 404 like a missing one). */
  function ownOrder(q: Query, user: CurrentUser, number: string) {
    const order = orderRow(q, number);
    if (!order || order.userId !== user.id) throw new NotFoundError(`No order ${number}`);
    return order;
  }

  function view(row: typeof orderChanges.$inferSelect): OrderChangeView {
    return {
      id: row.id,
      kind: row.kind,
      lines: OrderChangeLineSchema.array().parse(row.lines),
      beforeTotalCents: row.beforeTotalCents,
      afterTotalCents: row.afterTotalCents,
      adjustmentCents: row.adjustmentCents,
      settlement: row.settlement,
      refundState: row.refundState,
      createdAt: row.createdAt,
    };
  }
  const changeById = (q: Query, id: number) => q.select().from(orderChanges).where(eq(orderChanges.id, id)).get();

  /** What the order page may offer now, and the changes made so far (newest first). */
  function changesOf(user: CurrentUser, number: string): OrderChanges {
    const order = ownOrder(db, user, number);
    const lines = linesOf(db, order.id);
    const changeReason = changeRefusal(order, lines, 'change');
    const cancelReason = changeRefusal(order, lines, 'cancel');
    const rows = db.select().from(orderChanges).where(eq(orderChanges.orderId, order.id)).orderBy(desc(orderChanges.id)).all();
    return {
      changeability: { canChange: changeReason === null, canCancel: cancelReason === null, reason: cancelReason ?? changeReason },
      changes: rows.map(view),
    };
  }

  function message(change: OrderChangeView, number: string): string {
    const money = formatPrice(change.adjustmentCents);
    const what = change.kind === 'cancel' ? `Order ${number} is cancelled.` : `Order ${number} is changed.`;
    if (change.settlement === 'payment-cancelled') return `${what} The card payment was cancelled: no money was taken.`;
    if (change.settlement === 'amended-invoice') {
      return change.kind === 'cancel' ? `${what} Its invoice of ${formatPrice(change.beforeTotalCents)} is cancelled.` : `${what} The invoice is amended to ${formatPrice(change.afterTotalCents)} (${money} less).`;
    }
    if (change.refundState === 'refunded') return `${what} ${money} is refunded to your card.`;
    return `${what} ${money} will be refunded to your card: the card provider has not confirmed it yet, and we keep trying.`;
  }

  /** Lowers line quantities (0 takes a line off); the order is repriced, stock released, the money follows. */
  async function change(user: CurrentUser, number: string, input: ChangeOrder): Promise<OrderChangeResult> {
    const changeId = db.transaction(
      (tx) => {
        const order = ownOrder(tx, user, number);
        const lines = linesOf(tx, order.id);
        const refusal = changeRefusal(order, lines, 'change');
        if (refusal) throw new ConflictError(refusal);
        const wanted = new Map<number, number>();
        for (const l of input.lines) {
          const line = lines.find((x) => x.id === l.lineId);
          if (!line) throw new InvalidError(`Order ${number} has no such line`, { lines: ['a line is not on this order'] });
          if (l.quantity > line.quantity) {
            throw new InvalidError(`${line.partNumber}: a change can only lower the quantity (it is ${line.quantity}). To order more, place a new order.`, {
              lines: [`at most ${line.quantity} of ${line.partNumber}`],
            });
          }
          if (l.quantity < line.quantity) wanted.set(line.id, l.quantity);
        }
        if (wanted.size === 0) throw new InvalidError('Nothing changed: lower a quantity or take a line off', { lines: ['lower at least one quantity'] });
        if (lines.every((l) => (wanted.get(l.id) ?? l.quantity) === 0)) return cancelInside(tx, user, order, lines, 'Every line was taken off');

        const record: OrderChangeLine[] = [];
        for (const line of lines) {
          const to = wanted.get(line.id);
          if (to === undefined) continue;
          const { dropBackordered, release } = reduceLine(line, to);
          if (release > 0 && stock.release(order.id, line.partId, release, `order change: ${line.partNumber} ${line.quantity} → ${to}`) !== release) {
            throw new Error(`Ledger held fewer than ${release} of ${line.partNumber} for ${number}`);
          }
          if (to === 0) tx.delete(orderLines).where(eq(orderLines.id, line.id)).run();
          else {
            tx.update(orderLines)
              .set({ quantity: to, quantityBackordered: line.quantityBackordered - dropBackordered })
              .where(eq(orderLines.id, line.id))
              .run();
          }
          record.push({ partNumber: line.partNumber, title: line.title, before: line.quantity, after: to });
        }
        const after = linesOf(tx, order.id);
        const totals = repriceOrder(after, isZone(order.deliveryZone) ? order.deliveryZone : 'national', deps.taxRatePct);
        const adjustment = Math.max(0, order.totalCents - totals.totalCents);
        // An order that waited only for stock it no longer wants goes back to the warehouse's queue.
        const status = order.status === 'back_ordered' && after.some((l) => l.quantity - l.quantityBackordered > 0) ? readyStatus(order.paymentMethod) : order.status;
        tx.update(orders)
          .set({ ...totals, status, updatedAt: now })
          .where(eq(orders.id, order.id))
          .run();
        const card = order.paymentMethod === 'card';
        const { id } = tx
          .insert(orderChanges)
          .values({
            orderId: order.id,
            userId: user.id,
            kind: 'change',
            lines: record,
            beforeTotalCents: order.totalCents,
            afterTotalCents: totals.totalCents,
            adjustmentCents: adjustment,
            settlement: card ? 'card-refund' : 'amended-invoice',
            refundState: card ? (adjustment > 0 ? 'pending' : 'refunded') : null,
          })
          .returning({ id: orderChanges.id })
          .get();
        const removed = record.reduce((s, l) => s + l.before - l.after, 0);
        addOrderEvent(
          tx,
          order.id,
          'changed',
          `${units(removed)} taken off (${record.map((l) => `${l.partNumber} ${l.before} → ${l.after}`).join(', ')}); total ${formatPrice(order.totalCents)} → ${formatPrice(totals.totalCents)}`,
        );
        if (status !== order.status) addOrderEvent(tx, order.id, status, 'Nothing left waits only for stock');
        notify.orderChanged(tx, id);
        return id;
      },
      { behavior: 'immediate' },
    );
    await refundChange(changeId);
    const row = changeById(db, changeId)!;
    return { change: view(row), message: message(view(row), number) };
  }

  /** Inside a transaction: every unit's stock goes back, the order is cancelled, the money is set to follow. */
  function cancelInside(tx: Query, user: CurrentUser, order: typeof orders.$inferSelect, lines: Array<typeof orderLines.$inferSelect>, note: string | null) {
    for (const line of lines) stock.release(order.id, line.partId, Infinity, 'order cancelled by the buyer');
    const pending = order.status === 'pending_payment';
    const card = order.paymentMethod === 'card';
    const adjustment = pending ? 0 : Math.max(0, order.totalCents - order.refundedCents);
    tx.update(orders)
      .set({ status: 'cancelled', ...(pending ? { paymentState: 'failed' as const } : {}), updatedAt: now })
      .where(eq(orders.id, order.id))
      .run();
    const { id } = tx
      .insert(orderChanges)
      .values({
        orderId: order.id,
        userId: user.id,
        kind: 'cancel',
        lines: lines.map((l) => ({ partNumber: l.partNumber, title: l.title, before: l.quantity, after: 0 })),
        beforeTotalCents: order.totalCents,
        afterTotalCents: 0,
        adjustmentCents: adjustment,
        settlement: pending ? 'payment-cancelled' : card ? 'card-refund' : 'amended-invoice',
        refundState: card && !pending ? (adjustment > 0 ? 'pending' : 'refunded') : null,
      })
      .returning({ id: orderChanges.id })
      .get();
    const money = pending ? 'the card payment was cancelled; no money was taken' : card ? `${formatPrice(adjustment)} to be refunded to the card` : `invoice of ${formatPrice(adjustment)} cancelled`;
    addOrderEvent(tx, order.id, 'cancelled', `Cancelled by the buyer${note ? ` (${note.toLowerCase()})` : ''}: ${money}`);
    notify.orderChanged(tx, id);
    return id;
  }

  /** Cancels the whole order. An unpaid card order's payment is cancelled with the provider first. */
  async function cancel(user: CurrentUser, number: string): Promise<OrderChangeResult> {
    const first = ownOrder(db, user, number);
    const refusal = changeRefusal(first, linesOf(db, first.id), 'cancel');
    if (refusal) throw new ConflictError(refusal);
    if (first.status === 'pending_payment' && !first.paymentIntentId) {
      throw new ConflictError('The card payment of this order is still being confirmed with the card provider. Try again in a few minutes.');
    }
    if (first.status === 'pending_payment' && first.paymentIntentId) {
      let intent: Stripe.PaymentIntent;
      try {
        intent = await payments.paymentIntents.retrieve(first.paymentIntentId);
        if (intent.status === 'requires_action' || intent.status === 'requires_payment_method' || intent.status === 'requires_confirmation') {
          // The same key as the unpaid-order sweep's cancel, so the two cannot cancel twice.
          intent = await payments.paymentIntents.cancel(first.paymentIntentId, {}, { idempotencyKey: `order-${first.number}-cancel` });
        }
      } catch (err) {
        console.warn(`payments: cancelling the payment of order ${number} for its buyer failed:`, (err as Error).message);
        throw new PaymentServiceError('The card provider could not be reached to cancel the payment; nothing was changed. Try again in a minute.');
      }
      if (intent.status !== 'canceled') {
        throw new ConflictError('Your card payment has just gone through. Reload the page in a moment and cancel again: the whole amount is then refunded.');
      }
    }
    const changeId = db.transaction(
      (tx) => {
        const order = ownOrder(tx, user, number);
        const lines = linesOf(tx, order.id);
        const again = changeRefusal(order, lines, 'cancel');
        if (again) throw new ConflictError(again);
        return cancelInside(tx, user, order, lines, null);
      },
      { behavior: 'immediate' },
    );
    await refundChange(changeId);
    const row = changeById(db, changeId)!;
    return { change: view(row), message: message(view(row), number) };
  }

  /**
   * Asks the provider for a change's card refund (once: one idempotency key per change) and records the answer. A
   * refusal leaves the change `failed` for the housekeeping job; the change itself stands.
   */
  async function refundChange(changeId: number) {
    const row = changeById(db, changeId);
    if (!row || row.settlement !== 'card-refund' || row.refundState === 'refunded') return;
    const order = db.select().from(orders).where(eq(orders.id, row.orderId)).get();
    if (!order?.paymentIntentId) return;
    try {
      const refund = await payments.refunds.create(
        { payment_intent: order.paymentIntentId, amount: row.adjustmentCents, reason: 'requested_by_customer', metadata: { order_number: order.number, order_change: String(row.id) } },
        { idempotencyKey: `order-change-${row.id}-refund` },
      );
      db.transaction((tx) => {
        const updated = tx
          .update(orderChanges)
          .set({ refundState: 'refunded', refundId: refund.id, refundAttempts: sql`${orderChanges.refundAttempts} + 1`, updatedAt: now })
          .where(and(eq(orderChanges.id, row.id), inArray(orderChanges.refundState, ['pending', 'failed'])))
          .run();
        if (updated.changes !== 1) return;
        if (row.kind === 'cancel') {
          tx.update(orders)
            .set({ refundedCents: sql`min(${orders.totalCents}, ${orders.refundedCents} + ${row.adjustmentCents})`, updatedAt: now })
            .where(eq(orders.id, order.id))
            .run();
          tx.update(orders)
            .set({ paymentState: sql`case when ${orders.refundedCents} >= ${orders.totalCents} then 'refunded' else 'partially_refunded' end` })
            .where(eq(orders.id, order.id))
            .run();
        }
        addOrderEvent(tx, order.id, 'payment_refunded', `${formatPrice(row.adjustmentCents)} refunded to the card (${refund.id})`);
      });
    } catch (err) {
      console.warn(`payments: the refund of change ${row.id} on order ${order.number} failed; it is tried again later:`, (err as Error).message);
      // Staff reading the order see it once; the housekeeping job keeps asking.
      if (row.refundAttempts === 0) addOrderEvent(db, order.id, 'payment_alert', `The card provider did not accept the refund of ${formatPrice(row.adjustmentCents)}; it is tried again automatically`);
      db.update(orderChanges)
        .set({ refundState: 'failed', refundAttempts: sql`${orderChanges.refundAttempts} + 1`, updatedAt: now })
        .where(and(eq(orderChanges.id, row.id), inArray(orderChanges.refundState, ['pending', 'failed'])))
        .run();
    }
  }

  /** The housekeeping job's pass: change refunds still open a minute after their change are asked for again. */
  async function retryChangeRefunds(options: { settleAfterMs?: number } = {}) {
    const cutoff = new Date(deps.now().getTime() - (options.settleAfterMs ?? 60_000)).toISOString();
    const open = db
      .select({ id: orderChanges.id })
      .from(orderChanges)
      .where(and(inArray(orderChanges.refundState, ['pending', 'failed']), lt(orderChanges.updatedAt, cutoff)))
      .orderBy(orderChanges.id)
      .limit(50)
      .all();
    for (const c of open) await refundChange(c.id);
    return open.length;
  }

  return { changesOf, change, cancel, retryChangeRefunds };
}

export type OrderChangesService = ReturnType<typeof createOrderChanges>;
