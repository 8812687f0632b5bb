import { and, desc, eq, gt, inArray, isNotNull, isNull, lt, sql } from 'drizzle-orm';
import Stripe from 'stripe';
import { z } from 'zod';
import type { Db } from '../../db/client';
import { preparedOn } from '../../db/prepared';
import { orderChanges, orderLines, orders, paymentAlerts, paymentEvents } from '../../db/schema';
import { PaymentDeclinedError } from '../errors';
import type { CurrentUser } from '../current-user';
import type { Checkout, CheckoutResponse } from '../../../shared/schemas/orders';
import { formatMoney } from '../../../shared/format';
import type { CartOwner } from '../cart';
import { addOrderEvent, setOrderState, type OrderPlacement } from './order-placement';
import { findOrder, findOrderByIntent, type OrderHeader, type Query } from './order-reads';

/**
 * What the order flow tells people. Each call takes the transaction of the change that causes it and writes the
 * message there (the mail outbox), so the message commits or rolls back with the change.
 */
export interface OrderNotifier {
  orderConfirmed(tx: Query, orderId: number): void;
  paymentFailed(tx: Query, orderId: number, reason: string): void;
  backordered(tx: Query, orderId: number): void;
}

export interface OrderPaymentsDeps {
  db: Db;
  payments: Stripe;
  notify: OrderNotifier;
  placement: OrderPlacement;
  now: () => Date;
  /** How long checkout may spend with the provider before it answers (default 14 s). */
  checkoutBudgetMs?: number;
}

/** The SDK's timeout for one request; checkout uses it too, bounded by what is left of its budget. */
export const PAYMENTS_TIMEOUT_MS = 10_000;
const CHECKOUT_BUDGET_MS = 14_000;
/** Below this, a second try cannot get an answer back in time. */
const MIN_TRY_MS = 500;

/**
 * The part of a webhook event's object this service reads. Events of every type are recorded, so the fields are
 * parsed leniently: a charge names its payment intent, a payment intent is one.
 */
const EventObjectSchema = z.object({
  id: z.string().catch(''),
  object: z.string().catch(''),
  payment_intent: z.string().nullish().catch(null),
  amount: z.number().optional().catch(undefined),
  amount_received: z.number().optional().catch(undefined),
  amount_refunded: z.number().optional().catch(undefined),
  metadata: z.object({ order_number: z.string().optional().catch(undefined) }).nullish().catch(null),
});

type EventEffect = null | 'paid' | 'failed' | 'refunded' | 'stray';

export const DECLINED_NOTE = 'No payment was taken.';
/** What the buyer is told while the provider cannot say whether the card was charged. */
export const CONFIRMING_MESSAGE =
  'We are confirming your payment with the card provider. Do not pay again: we will e-mail you as soon as it is settled.';
/** Staff's words for a refund the provider refused; the provider's own message goes to the log. */
export const REFUND_REFUSED_MESSAGE = 'The card provider did not accept the refund; nothing was refunded. Try again later or refund by other means.';

const money = formatMoney;

/** A card decline is an answer; anything else (no reply, a timeout, a 5xx, a refused request) leaves the truth unknown. */
const isDecline = (err: unknown): err is Stripe.errors.StripeCardError => err instanceof Stripe.errors.StripeCardError;

/**
 * The intent's parameters, the same on every try, so a repeated create with its key is recognised as the first. It is
 * created and confirmed in one call (`confirm: true`): one round trip to the provider per card order instead of two.
 */
const intentParams = (order: { number: string; totalCents: number; email: string }, paymentMethod: string): Stripe.PaymentIntentCreateParams => ({
  amount: order.totalCents,
  currency: 'usd',
  payment_method: paymentMethod,
  description: `Spoolyard order ${order.number}`,
  metadata: { order_number: order.number },
  receipt_email: order.email,
  confirm: true,
});

export function createOrderPayments(deps: OrderPaymentsDeps) {
  const { db, payments, notify, placement } = deps;
  const budgetMs = deps.checkoutBudgetMs ?? CHECKOUT_BUDGET_MS;

  /**
   * One provider call made at most twice (the second with the same idempotency key) within a deadline. A decline is
   * thrown; any other failure comes back as `unknown`.
   */
  async function within<T>(deadline: number, call: (options: Stripe.RequestOptions) => Promise<T>): Promise<{ ok: true; value: T } | { ok: false; error: unknown }> {
    let last: unknown = null;
    for (let attempt = 0; attempt < 2; attempt++) {
      const left = deadline - Date.now();
      if (left < MIN_TRY_MS) break;
      try {
        return { ok: true, value: await call({ timeout: Math.min(PAYMENTS_TIMEOUT_MS, left), maxNetworkRetries: 0 }) };
      } catch (err) {
        if (isDecline(err)) throw err;
        last = err;
        // A refused request (bad parameters) gets the same answer again.
        if (err instanceof Stripe.errors.StripeInvalidRequestError) break;
      }
    }
    return { ok: false, error: last };
  }

  const orderById = (orderId: number) => findOrder(db, eq(orders.id, orderId));

  /**
   * Marks a pending order paid once; says whether this call did it (and so should send the confirmation). Given the
   * provider's intent, the order learns it in the same write (if it did not know it yet).
   */
  function markPaid(orderId: number, note: string, intentId?: string) {
    const done = db.transaction((tx) => {
      if (intentId) setIntentIfUnknown(tx, orderId, intentId);
      const order = findOrder(tx, eq(orders.id, orderId));
      if (!order || order.status !== 'pending_payment') return false;
      setOrderState(tx, order.id, 'paid', 'paid');
      addOrderEvent(tx, order.id, 'paid', note);
      confirmPaid(tx, order.id);
      return true;
    });
    return done;
  }

  const setIntentIfUnknown = (q: Query, orderId: number, intentId: string) =>
    preparedOn(q, 'payments:set-intent', (h) =>
      h
        .update(orders)
        .set({ paymentIntentId: sql`${sql.placeholder('intentId')}` })
        .where(and(eq(orders.id, sql.placeholder('orderId')), isNull(orders.paymentIntentId)))
        .prepare(),
    ).run({ intentId, orderId });

  /** Writes the confirmation (and a back-order notice) in the transaction that marks the order paid. */
  function confirmPaid(tx: Query, orderId: number) {
    notify.orderConfirmed(tx, orderId);
    const backordered = preparedOn(tx, 'payments:backordered', (h) =>
      h
        .select({ id: orderLines.id })
        .from(orderLines)
        .where(and(eq(orderLines.orderId, sql.placeholder('orderId')), gt(orderLines.quantityBackordered, 0)))
        .limit(1)
        .prepare(),
    ).get({ orderId });
    if (backordered) notify.backordered(tx, orderId);
  }

  /**
   * Cancels an order that will not be paid: its payment is cancelled at the provider FIRST (idempotently), so a late
   * confirmation cannot take money for a cancelled order. If the provider cannot be reached, or the payment turns out
   * to have gone through, the order is not cancelled (the reconciliation job tries again).
   */
  async function cancelForNonPayment(orderId: number, reason: string): Promise<'cancelled' | 'paid' | 'kept'> {
    const order = orderById(orderId);
    if (!order || order.status !== 'pending_payment') return 'kept';
    if (order.paymentIntentId) {
      try {
        let intent = await payments.paymentIntents.retrieve(order.paymentIntentId);
        if (intent.status !== 'canceled' && intent.status !== 'succeeded' && intent.status !== 'processing') {
          intent = await payments.paymentIntents.cancel(order.paymentIntentId, {}, { idempotencyKey: `order-${order.number}-cancel` });
        }
        if (intent.status === 'succeeded') return markPaid(orderId, 'Card payment received') ? 'paid' : 'kept';
        if (intent.status !== 'canceled') return 'kept';
      } catch (err) {
        console.warn(`payments: could not cancel the payment of order ${order.number}; the order stays open:`, (err as Error).message);
        return 'kept';
      }
    }
    db.transaction((tx) => {
      if (placement.cancelUnpaid(orderId, reason)) notify.paymentFailed(tx, orderId, reason);
    });
    return 'cancelled';
  }

  /**
   * A payment that succeeded for an order no longer awaiting one is refunded in full, once (one idempotency key per
   * intent), recorded on the order and listed for staff.
   */
  async function refundStray(order: OrderHeader, intentId: string, amountCents: number, what: string) {
    const alert = db.transaction((tx) => {
      const existing = tx.select().from(paymentAlerts).where(eq(paymentAlerts.paymentIntentId, intentId)).get();
      if (existing) return existing;
      addOrderEvent(tx, order.id, 'payment_alert', `${what} ${money(amountCents)}: refunding it automatically`);
      return tx.insert(paymentAlerts).values({ orderId: order.id, paymentIntentId: intentId, amountCents, what }).returning().get();
    });
    if (alert.refundState === 'refunded') return alert;
    try {
      const refund = await payments.refunds.create(
        { payment_intent: intentId, reason: 'duplicate', metadata: { order_number: order.number } },
        { idempotencyKey: `stray-${intentId}-refund` },
      );
      db.transaction((tx) => {
        const updated = tx
          .update(paymentAlerts)
          .set({ refundState: 'refunded', refundId: refund.id, lastError: null, attempts: sql`${paymentAlerts.attempts} + 1`, updatedAt: sql`strftime('%Y-%m-%dT%H:%M:%fZ','now')` })
          .where(and(eq(paymentAlerts.id, alert.id), eq(paymentAlerts.refundState, alert.refundState)))
          .run();
        if (updated.changes === 1) addOrderEvent(tx, order.id, 'payment_refunded', `${money(amountCents)} refunded automatically (${refund.id})`);
      });
    } catch (err) {
      console.warn(`payments: the automatic refund of ${intentId} (order ${order.number}) failed:`, (err as Error).message);
      db.update(paymentAlerts)
        .set({ refundState: 'failed', lastError: REFUND_REFUSED_MESSAGE, attempts: sql`${paymentAlerts.attempts} + 1`, updatedAt: sql`strftime('%Y-%m-%dT%H:%M:%fZ','now')` })
        .where(and(eq(paymentAlerts.id, alert.id), inArray(paymentAlerts.refundState, ['pending', 'failed'])))
        .run();
    }
    return db.select().from(paymentAlerts).where(eq(paymentAlerts.id, alert.id)).get();
  }

  /** Acts on what the provider says of an order's payment. */
  async function settle(order: OrderHeader, intent: Stripe.PaymentIntent, reason: string): Promise<'paid' | 'cancelled' | 'refunded' | 'open'> {
    if (intent.status === 'succeeded') {
      if (order.status === 'pending_payment') return markPaid(order.id, 'Card payment received') ? 'paid' : 'open';
      if (order.status === 'cancelled' && order.paymentState === 'failed') {
        await refundStray(order, intent.id, intent.amount_received || intent.amount, 'A card payment succeeded after the order was cancelled:');
        return 'refunded';
      }
      return 'open';
    }
    if (order.status !== 'pending_payment') return 'open';
    if (intent.status === 'canceled' || intent.status === 'requires_payment_method' || intent.status === 'requires_confirmation') {
      const result = await cancelForNonPayment(order.id, reason);
      return result === 'kept' ? 'open' : result;
    }
    return 'open';
  }

  async function checkout(user: CurrentUser, owner: CartOwner, input: Checkout): Promise<CheckoutResponse> {
    // The placing's own transaction becomes a savepoint inside this one, so an account order and its mail commit together.
    const placed = db.transaction((tx) => {
      const p = placement.placeFromCart(user, owner, input);
      if (input.method === 'account') {
        notify.orderConfirmed(tx, p.orderId);
        if (p.backordered) notify.backordered(tx, p.orderId);
      }
      return p;
    });
    const answer = (status: CheckoutResponse['order']['status'], extra: Partial<CheckoutResponse> = {}): CheckoutResponse => ({
      order: { number: placed.number, status, totalCents: placed.totalCents },
      nextAction: null,
      ...extra,
    });
    if (input.method === 'account') {
      return answer(placed.status);
    }
    // The provider is called after the order's transaction has committed: better-sqlite3 cannot wait inside one.
    const deadline = Date.now() + budgetMs;
    const confirming = () => {
      addOrderEvent(db, placed.orderId, 'payment_unconfirmed', 'The card provider did not answer; the payment is being confirmed');
      return answer('pending_payment', { outcome: 'confirming', message: CONFIRMING_MESSAGE });
    };
    const declined = async (err: Stripe.errors.StripeCardError): Promise<never> => {
      const reason = `Your card was declined${err.decline_code ? ` (${err.decline_code.replace(/_/g, ' ')})` : ''}. ${DECLINED_NOTE}`;
      const result = await cancelForNonPayment(placed.orderId, reason);
      throw new PaymentDeclinedError(
        result === 'cancelled' ? `${reason} Your cart is as it was: try another card.` : `${reason} Your cart comes back in a few minutes, once the card provider has closed the payment.`,
      );
    };
    const header = { number: placed.number, totalCents: placed.totalCents, email: user.email };

    let intent: Stripe.PaymentIntent;
    try {
      // One call creates and confirms the payment; repeated with its key, the provider answers as it did the first time.
      const created = await within(deadline, (o) => payments.paymentIntents.create(intentParams(header, input.paymentMethod), { ...o, idempotencyKey: `order-${placed.number}-intent` }));
      if (created.ok) {
        intent = created.value;
        if (intent.status === 'succeeded') {
          // The provider's own answer to our call says the money is taken: the order is paid now, in the write that
          // records its payment, and the webhook that follows finds nothing left to do (it may also come first).
          const paid = markPaid(placed.orderId, 'Card payment received', intent.id) || orderById(placed.orderId)?.status === 'paid';
          return answer(paid ? 'paid' : 'pending_payment', { outcome: 'confirmed' });
        }
        setIntentIfUnknown(db, placed.orderId, intent.id);
      } else {
        // A refused create took nothing: the order goes back to the cart.
        if (created.error instanceof Stripe.errors.StripeInvalidRequestError) {
          console.warn(`payments: the payment of order ${placed.number} was refused:`, created.error.message);
          const reason = `The card payment could not be started. ${DECLINED_NOTE}`;
          db.transaction((tx) => {
            if (placement.cancelUnpaid(placed.orderId, reason)) notify.paymentFailed(tx, placed.orderId, reason);
          });
          throw new PaymentDeclinedError(`${reason} Your cart is as it was: try again or choose another card.`);
        }
        console.warn(`payments: the payment of order ${placed.number} got no answer; asking the provider:`, (created.error as Error | null)?.message);
        // The provider is asked for the payment by the order number it carries; none yet may still be on its way.
        const found = await within(deadline, (o) => findIntentByOrderNumber(placed.number, new Date(Date.now() - budgetMs), o));
        if (!found.ok || !found.value) return confirming();
        intent = found.value;
        if (intent.status === 'succeeded') {
          markPaid(placed.orderId, 'Card payment received (confirmed with the card provider after a lost reply)', intent.id);
          return answer('paid', { outcome: 'confirmed' });
        }
        setIntentIfUnknown(db, placed.orderId, intent.id);
        const order = orderById(placed.orderId)!;
        if (intent.status === 'requires_confirmation') {
          // Created but never confirmed: nothing was taken.
          const reason = `The card payment could not be completed. ${DECLINED_NOTE}`;
          const result = await cancelForNonPayment(order.id, reason);
          if (result === 'cancelled') throw new PaymentDeclinedError(`${reason} Your cart is as it was: try again.`);
          return confirming();
        }
      }
    } catch (err) {
      if (isDecline(err)) {
        // The declined payment exists at the provider: the order learns it, so cancelling goes through the provider first.
        const declinedIntent = err.payment_intent?.id;
        if (declinedIntent) db.update(orders).set({ paymentIntentId: declinedIntent }).where(and(eq(orders.id, placed.orderId), isNull(orders.paymentIntentId))).run();
        return declined(err);
      }
      throw err;
    }
    if (intent.status === 'requires_action') {
      setOrderState(db, placed.orderId, 'pending_payment', 'requires_action');
      return answer('pending_payment', { outcome: 'authenticate', nextAction: { type: 'authenticate', paymentIntentId: intent.id, clientSecret: intent.client_secret } });
    }
    if (intent.status === 'requires_payment_method' || intent.status === 'canceled') {
      const reason = `Your card was declined. ${DECLINED_NOTE}`;
      const result = await cancelForNonPayment(placed.orderId, reason);
      throw new PaymentDeclinedError(result === 'cancelled' ? `${reason} Your cart is as it was: try another card.` : `${reason} Your cart comes back in a few minutes.`);
    }
    // Succeeded or processing: the webhook (or the reconciliation job) marks the order paid.
    return answer('pending_payment', { outcome: intent.status === 'succeeded' ? 'confirmed' : 'processing' });
  }

  /** The order a webhook's intent belongs to: by the stored intent, or by the order number the intent carries. */
  function orderOfIntent(q: Parameters<typeof findOrder>[0], intentId: string | null, orderNumber: string | undefined) {
    if (!intentId) return undefined;
    const byIntent = findOrderByIntent(q, intentId);
    if (byIntent || !orderNumber) return byIntent;
    // The create's reply was lost, so the order never learnt its intent: adopt it now.
    const byNumber = findOrder(q, and(eq(orders.number, orderNumber), isNull(orders.paymentIntentId), eq(orders.paymentMethod, 'card'))!);
    if (!byNumber) return undefined;
    q.update(orders).set({ paymentIntentId: intentId }).where(eq(orders.id, byNumber.id)).run();
    return { ...byNumber, paymentIntentId: intentId };
  }

  /**
   * Applies a verified webhook event once. The event id is recorded in the same transaction as its effect, so a
   * repeat changes nothing, and a paid order is never moved back by a late failure event.
   */
  const applyEvent = (event: Stripe.Event) => {
    const object = EventObjectSchema.parse(event.data.object);
    const intentId = object.object === 'payment_intent' ? object.id : (object.payment_intent ?? null);
    const amountCents = object.amount_received || object.amount || 0;
    const none = { applied: true, effect: null, orderId: null, intentId, amountCents };
    if (event.type === 'payment_intent.succeeded' && intentId) {
      // Most card orders are paid at checkout, by the provider's answer to our own call: their success event is read
      // and answered without a write. What the transaction below would do for it is nothing either (a paid order
      // stays paid); only an order still awaiting payment, or one cancelled unpaid (a stray to refund), goes on.
      const known = findOrderByIntent(db, intentId);
      if (known && known.status !== 'pending_payment' && !(known.status === 'cancelled' && known.paymentState === 'failed')) {
        return { ...none, applied: false, orderId: known.id };
      }
    }
    return db.transaction((tx): { applied: boolean; effect: EventEffect; orderId: number | null; intentId: string | null; amountCents: number } => {
      const inserted = preparedOn(tx, 'payments:event', (h) =>
        h.insert(paymentEvents).values({ eventId: sql.placeholder('eventId'), type: sql.placeholder('type'), paymentIntentId: sql.placeholder('intentId') }).onConflictDoNothing().prepare(),
      ).run({ eventId: event.id, type: event.type, intentId });
      if (inserted.changes === 0) return { ...none, applied: false };
      const order = orderOfIntent(tx, intentId, object.object === 'payment_intent' ? (object.metadata?.order_number ?? undefined) : undefined);
      if (!order) return none;
      if (event.type === 'payment_intent.succeeded') {
        if (order.status === 'pending_payment') {
          setOrderState(tx, order.id, 'paid', 'paid');
          addOrderEvent(tx, order.id, 'paid', 'Card payment received');
          confirmPaid(tx, order.id);
          return { ...none, effect: 'paid', orderId: order.id };
        }
        // Money taken for an order that no longer awaits it: refunded after this transaction.
        // (A buyer's cancel of a paid order refunds through its order change, so only an unpaid cancel makes a stray.)
        return { ...none, effect: order.status === 'cancelled' && order.paymentState === 'failed' ? 'stray' : null, orderId: order.id };
      }
      if (event.type === 'payment_intent.payment_failed') {
        // The cancelling itself runs after this transaction, through cancelForNonPayment.
        return { ...none, effect: order.status === 'pending_payment' ? 'failed' : null, orderId: order.id };
      }
      if (event.type === 'charge.refunded' && typeof object.amount_refunded === 'number') {
        // The charge counts every refund; those of order changes lowered the order's total instead of refunding part of it.
        const amended = tx
          .select({ n: sql<number>`coalesce(sum(${orderChanges.adjustmentCents}), 0)` })
          .from(orderChanges)
          .where(and(eq(orderChanges.orderId, order.id), eq(orderChanges.kind, 'change'), eq(orderChanges.settlement, 'card-refund')))
          .get();
        const refunded = Math.min(Math.max(0, object.amount_refunded - (amended?.n ?? 0)), order.totalCents);
        if (refunded === 0) return { ...none, orderId: order.id };
        tx.update(orders)
          .set({ refundedCents: sql`max(${orders.refundedCents}, ${refunded})`, paymentState: refunded >= order.totalCents ? 'refunded' : 'partially_refunded' })
          .where(eq(orders.id, order.id))
          .run();
        return { ...none, effect: 'refunded', orderId: order.id };
      }
      return { ...none, orderId: order.id };
    });
  };

  async function handlePaymentEvent(event: Stripe.Event) {
    const result = applyEvent(event);
    if (result.effect === 'failed' && result.orderId) {
      await cancelForNonPayment(result.orderId, `The card payment could not be completed (authentication failed). ${DECLINED_NOTE}`);
    }
    if (result.effect === 'stray' && result.orderId && result.intentId) {
      const order = orderById(result.orderId)!;
      await refundStray(order, result.intentId, result.amountCents || order.totalCents, 'A card payment succeeded after the order was cancelled:');
    }
    return result;
  }

  /**
   * Card orders left unpaid (an authentication never finished, a tab closed) give their stock back after a while:
   * the payment is cancelled with the provider first, so a late success cannot land on a cancelled order.
   */
  async function expireUnpaid(maxAgeMinutes: number) {
    const cutoff = new Date(deps.now().getTime() - maxAgeMinutes * 60_000).toISOString();
    const stale = db
      .select({ id: orders.id })
      .from(orders)
      .where(and(eq(orders.status, 'pending_payment'), lt(orders.createdAt, cutoff)))
      .orderBy(orders.id)
      .limit(100)
      .all();
    let expired = 0;
    for (const o of stale) {
      if ((await cancelForNonPayment(o.id, `Not paid within ${maxAgeMinutes} minutes; the stock went back on the shelf`)) === 'cancelled') expired++;
    }
    return expired;
  }

  /** The provider's intent for an order whose create reply was lost: found by the order number it carries. */
  async function findIntentByOrderNumber(number: string, since: Date, options?: Stripe.RequestOptions) {
    const created = { gte: Math.floor(since.getTime() / 1000) - 300 };
    let seen = 0;
    for await (const intent of payments.paymentIntents.list({ limit: 100, created }, options)) {
      if (intent.metadata?.order_number === number) return intent;
      if (++seen >= 1000) break;
    }
    return null;
  }

  /**
   * Compares open card orders with the provider and fixes drift: paid → marked paid and confirmed; cancelled or
   * failed → cancelled at the provider first, then the order, its stock released; a success on a cancelled order →
   * refunded and listed for staff. Orders younger than `settleAfterMs` are left to their checkout.
   */
  async function reconcilePayments(options: { settleAfterMs?: number } = {}) {
    const settleAfterMs = options.settleAfterMs ?? 60_000;
    const cutoff = new Date(deps.now().getTime() - settleAfterMs).toISOString();
    const figures = { checked: 0, paid: 0, cancelled: 0, refunded: 0, unreachable: 0 };
    const open = db
      .select({ id: orders.id, createdAt: orders.createdAt })
      .from(orders)
      .where(and(eq(orders.status, 'pending_payment'), eq(orders.paymentMethod, 'card'), lt(orders.updatedAt, cutoff)))
      .orderBy(orders.id)
      .limit(200)
      .all();
    // Cancelled card orders of the last two days, not yet flagged: a payment may still have gone through.
    const recentCutoff = new Date(deps.now().getTime() - 2 * 86_400_000).toISOString();
    const cancelled = db
      .select({ id: orders.id, createdAt: orders.createdAt })
      .from(orders)
      .leftJoin(paymentAlerts, eq(paymentAlerts.orderId, orders.id))
      .where(and(eq(orders.status, 'cancelled'), eq(orders.paymentState, 'failed'), eq(orders.paymentMethod, 'card'), isNotNull(orders.paymentIntentId), gt(orders.updatedAt, recentCutoff), isNull(paymentAlerts.id)))
      .orderBy(desc(orders.id))
      .limit(50)
      .all();
    for (const row of [...open, ...cancelled]) {
      let order = orderById(row.id);
      if (!order) continue;
      figures.checked++;
      try {
        if (!order.paymentIntentId) {
          const found = await findIntentByOrderNumber(order.number, new Date(`${row.createdAt}`));
          if (found) {
            db.update(orders).set({ paymentIntentId: found.id }).where(and(eq(orders.id, order.id), isNull(orders.paymentIntentId))).run();
            order = orderById(row.id)!;
          } else if (order.status === 'pending_payment') {
            // The create never reached the provider: nothing can have been taken.
            const reason = `The card payment could not be confirmed with the card provider. ${DECLINED_NOTE}`;
            const id = order.id;
            const cancelled = db.transaction((tx) => {
              const done = placement.cancelUnpaid(id, reason);
              if (done) notify.paymentFailed(tx, id, reason);
              return done;
            });
            if (cancelled) figures.cancelled++;
            continue;
          }
        }
        if (!order.paymentIntentId) continue;
        const intent = await payments.paymentIntents.retrieve(order.paymentIntentId);
        const result = await settle(order, intent, `The card payment did not go through. ${DECLINED_NOTE}`);
        if (result === 'paid') figures.paid++;
        if (result === 'cancelled') figures.cancelled++;
        if (result === 'refunded') figures.refunded++;
      } catch (err) {
        figures.unreachable++;
        console.warn(`payments: could not reconcile order ${order.number}:`, (err as Error).message);
      }
    }
    // Automatic refunds the provider refused before are tried again.
    const failed = db.select().from(paymentAlerts).where(inArray(paymentAlerts.refundState, ['pending', 'failed'])).limit(50).all();
    for (const a of failed) {
      const order = orderById(a.orderId);
      if (order) await refundStray(order, a.paymentIntentId, a.amountCents, a.what);
    }
    return figures;
  }

  /** The Office's list of payment alerts, newest first. */
  function listPaymentAlerts() {
    return db
      .select({
        id: paymentAlerts.id,
        orderNumber: orders.number,
        amountCents: paymentAlerts.amountCents,
        what: paymentAlerts.what,
        refundState: paymentAlerts.refundState,
        refundId: paymentAlerts.refundId,
        lastError: paymentAlerts.lastError,
        attempts: paymentAlerts.attempts,
        createdAt: paymentAlerts.createdAt,
        updatedAt: paymentAlerts.updatedAt,
      })
      .from(paymentAlerts)
      .innerJoin(orders, eq(orders.id, paymentAlerts.orderId))
      .orderBy(desc(paymentAlerts.id))
      .limit(200)
      .all();
  }

  /** Staff ask for a failed automatic refund to be tried again now. */
  async function retryAlertRefund(id: number) {
    const a = db.select().from(paymentAlerts).where(eq(paymentAlerts.id, id)).get();
    const order = a ? orderById(a.orderId) : undefined;
    if (!a || !order) return undefined;
    await refundStray(order, a.paymentIntentId, a.amountCents, a.what);
    return listPaymentAlerts().find((x) => x.id === id);
  }

  return { checkout, handlePaymentEvent, expireUnpaid, reconcilePayments, listPaymentAlerts, retryAlertRefund, cancelForNonPayment };
}

export type OrderPayments = ReturnType<typeof createOrderPayments>;
