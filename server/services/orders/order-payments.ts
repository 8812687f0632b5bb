import { and, eq, gt, lt, sql } from 'drizzle-orm';
import Stripe from 'stripe';
import { z } from 'zod';
import type { Db } from '../../db/client';
import { orderLines, orders, paymentEvents } from '../../db/schema';
import { PaymentDeclinedError, PaymentServiceError } from '../errors';
import type { CurrentUser } from '../current-user';
import type { Checkout, CheckoutResponse } from '../../../shared/schemas/orders';
import type { CartOwner } from '../cart';
import { addOrderEvent, setOrderState, type OrderPlacement } from './order-placement';
import { findOrder, type Query } from './order-reads';

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
}

/**
 * The part of a webhook event's object this service reads. Events of every type are recorded, so the fields are
 * parsed leniently: a charge names its payment intent, a payment intent is one.
 */
const EventObjectSchema = z.object({
  id: z.string().catch(''),
  object: z.string().catch(''),
  payment_intent: z.string().nullish().catch(null),
  amount_refunded: z.number().optional().catch(undefined),
});

type EventEffect = null | 'paid' | 'failed' | 'refunded';

export function createOrderPayments(deps: OrderPaymentsDeps) {
  const { db, payments, notify, placement } = deps;

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
    if (input.method === 'account') {
      return { order: { number: placed.number, status: placed.status, totalCents: placed.totalCents }, nextAction: null };
    }
    // The provider is called after the order's transaction has committed: better-sqlite3 cannot wait inside one.
    try {
      const intent = await payments.paymentIntents.create(
        {
          amount: placed.totalCents,
          currency: 'usd',
          payment_method: input.paymentMethod,
          description: `Spoolyard order ${placed.number}`,
          metadata: { order_number: placed.number },
          receipt_email: user.email,
        },
        { idempotencyKey: `order-${placed.number}-intent` },
      );
      db.update(orders).set({ paymentIntentId: intent.id }).where(eq(orders.id, placed.orderId)).run();
      const confirmed = await payments.paymentIntents.confirm(intent.id, { payment_method: input.paymentMethod }, { idempotencyKey: `order-${placed.number}-confirm` });
      if (confirmed.status === 'requires_action') {
        setOrderState(db, placed.orderId, 'pending_payment', 'requires_action');
        return {
          order: { number: placed.number, status: 'pending_payment', totalCents: placed.totalCents },
          nextAction: { type: 'authenticate', paymentIntentId: intent.id, clientSecret: confirmed.client_secret },
        };
      }
      return { order: { number: placed.number, status: 'pending_payment', totalCents: placed.totalCents }, nextAction: null };
    } catch (err) {
      const declined = err instanceof Stripe.errors.StripeCardError;
      const reason = declined
        ? `Your card was declined${err.decline_code ? ` (${err.decline_code.replace(/_/g, ' ')})` : ''}. No payment was taken.`
        : 'The payment service could not be reached. No payment was taken.';
      db.transaction((tx) => {
        if (placement.cancelUnpaid(placed.orderId, reason)) notify.paymentFailed(tx, placed.orderId, reason);
      });
      const message = `${reason} Your cart is as it was: try another card.`;
      throw declined ? new PaymentDeclinedError(message) : new PaymentServiceError(message);
    }
  }

  /**
   * Applies a verified webhook event once. The event id is recorded in the same transaction as its effect, so a
   * repeat changes nothing, and a paid order is never moved back by a late failure event.
   */
  const applyEvent = (event: Stripe.Event) =>
    db.transaction((tx): { applied: boolean; effect: EventEffect; orderId: number | null } => {
      const object = EventObjectSchema.parse(event.data.object);
      const intentId = object.object === 'payment_intent' ? object.id : (object.payment_intent ?? null);
      const inserted = tx.insert(paymentEvents).values({ eventId: event.id, type: event.type, paymentIntentId: intentId }).onConflictDoNothing().run();
      if (inserted.changes === 0) return { applied: false, effect: null, orderId: null };
      const order = intentId ? findOrder(tx, eq(orders.paymentIntentId, intentId)) : undefined;
      if (!order) return { applied: true, effect: null, orderId: null };
      if (event.type === 'payment_intent.succeeded') {
        if (order.status === 'pending_payment') {
          setOrderState(tx, order.id, 'paid', 'paid');
          addOrderEvent(tx, order.id, 'paid', 'Card payment received');
          return { applied: true, effect: 'paid', orderId: order.id };
        }
        return { applied: true, effect: null, orderId: order.id };
      }
      if (event.type === 'payment_intent.payment_failed') {
        // The cancelling itself runs after this transaction, through cancelUnpaid.
        return { applied: true, effect: order.status === 'pending_payment' ? 'failed' : null, orderId: order.id };
      }
      if (event.type === 'charge.refunded' && typeof object.amount_refunded === 'number') {
        const refunded = Math.min(object.amount_refunded, order.totalCents);
        tx.update(orders)
          .set({ refundedCents: sql`max(${orders.refundedCents}, ${refunded})`, paymentState: refunded >= order.totalCents ? 'refunded' : 'partially_refunded' })
          .where(eq(orders.id, order.id))
          .run();
        return { applied: true, effect: 'refunded', orderId: order.id };
      }
      return { applied: true, effect: null, orderId: order.id };
    });

  const handlePaymentEvent = (event: Stripe.Event) => db.transaction((tx) => {
    const result = applyEvent(event);
    if (result.effect === 'paid' && result.orderId) {
      notify.orderConfirmed(tx, result.orderId);
      const backordered = tx
        .select({ id: orderLines.id })
        .from(orderLines)
        .where(and(eq(orderLines.orderId, result.orderId), gt(orderLines.quantityBackordered, 0)))
        .limit(1)
        .get();
      if (backordered) notify.backordered(tx, result.orderId);
    }
    if (result.effect === 'failed' && result.orderId) {
      const reason = 'The card payment could not be completed (authentication failed). No payment was taken.';
      if (placement.cancelUnpaid(result.orderId, reason)) notify.paymentFailed(tx, result.orderId, reason);
    }
    return result;
  });

  /**
   * Card orders left unpaid (an authentication never finished, a tab closed) give their stock back after a while:
   * the payment is cancelled with the provider first, so a late success cannot land on a cancelled order.
   */
  async function expireUnpaid(maxAgeMinutes: number) {
    const cutoff = new Date(deps.now().getTime() - maxAgeMinutes * 60_000).toISOString();
    const stale = db
      .select({ id: orders.id, number: orders.number, intent: orders.paymentIntentId })
      .from(orders)
      .where(and(eq(orders.status, 'pending_payment'), lt(orders.createdAt, cutoff)))
      .orderBy(orders.id)
      .limit(100)
      .all();
    let expired = 0;
    for (const o of stale) {
      if (o.intent) {
        try {
          const intent = await payments.paymentIntents.retrieve(o.intent);
          if (intent.status === 'succeeded' || intent.status === 'processing') continue; // the webhook will settle it
          if (intent.status !== 'canceled') await payments.paymentIntents.cancel(o.intent, {}, { idempotencyKey: `order-${o.number}-expire` });
        } catch {
          continue; // the payment service is unreachable: try again on the next sweep
        }
      }
      if (placement.cancelUnpaid(o.id, `Not paid within ${maxAgeMinutes} minutes; the stock went back on the shelf`)) expired++;
    }
    return expired;
  }

  return { checkout, handlePaymentEvent, expireUnpaid };
}

export type OrderPayments = ReturnType<typeof createOrderPayments>;
