import type Stripe from 'stripe';
import type { Db } from '../db/client';
import { HttpError } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session';
import { priceOrder, type DeliveryZone } from '../../shared/pricing';
import type { Checkout, CheckoutResponse, OrderDetail, OrderStatus, OrderSummary } from '../../shared/schemas/orders';
import { buyerOf, type CartOwner, type CartService } from './cart';
import type { StockService } from './stock';

/** What the order flow tells people; implemented with the mailer, replaced by a recorder in tests. */
export interface OrderNotifier {
  orderConfirmed(orderId: number): void;
  paymentFailed(orderId: number, reason: string): void;
  backordered(orderId: number): void;
}

interface CheckoutLine {
  lineId: number;
  partId: number;
  partNumber: string;
  title: string;
  status: string;
  quantity: number;
  allowBackorder: number;
  priceCents: number;
  coreDepositCents: number;
  weightGrams: number;
  fitmentId: number | null;
  fitmentName: string | null;
  fitmentSummary: string | null;
}

interface OrderRow {
  id: number;
  number: string;
  userId: string;
  status: OrderStatus;
  paymentMethod: 'card' | 'account';
  paymentState: string;
  paymentIntentId: string | null;
  totalCents: number;
  refundedCents: number;
}

export interface OrderServiceDeps {
  db: Db;
  stock: StockService;
  cart: CartService;
  payments: Stripe;
  notify: OrderNotifier;
  taxRatePct: number;
  now: () => Date;
}

const OPEN_ACCOUNT_SQL = `SELECT COALESCE(SUM(total_cents - refunded_cents), 0) AS n FROM orders
  WHERE dealer_account_id = ? AND payment_method = 'account' AND payment_state = 'on_account' AND status NOT IN ('cancelled', 'returned')`;

export function createOrderService(deps: OrderServiceDeps) {
  const { db, stock, cart, payments, notify } = deps;
  const sqlite = db.$client;
  const stmt = {
    cartLines: sqlite.prepare(
      `SELECT l.id AS lineId, p.id AS partId, p.part_number AS partNumber, p.title, p.status, l.quantity, l.allow_backorder AS allowBackorder,
              p.price_cents AS priceCents, p.core_deposit_cents AS coreDepositCents, p.weight_grams AS weightGrams,
              l.fitment_id AS fitmentId, f.name AS fitmentName, f.summary AS fitmentSummary
       FROM cart_lines l JOIN parts p ON p.id = l.part_id LEFT JOIN saved_fitments f ON f.id = l.fitment_id WHERE l.cart_id = ? ORDER BY l.id`,
    ),
    nextId: sqlite.prepare('SELECT COALESCE(MAX(id), 0) + 1 AS n FROM orders'),
    insertOrder: sqlite.prepare(
      `INSERT INTO orders (number, user_id, dealer_account_id, status, payment_method, payment_state, purchase_order, payment_terms_days,
         goods_cents, discount_cents, core_deposit_cents, freight_cents, tax_cents, total_cents, weight_grams, delivery_zone,
         ship_name, ship_line1, ship_city, ship_postcode, email)
       VALUES (@number, @userId, @dealerAccountId, @status, @paymentMethod, @paymentState, @purchaseOrder, @paymentTermsDays,
         @goodsCents, @discountCents, @coreDepositCents, @freightCents, @taxCents, @totalCents, @weightGrams, @deliveryZone,
         @shipName, @shipLine1, @shipCity, @shipPostcode, @email) RETURNING id`,
    ),
    insertLine: sqlite.prepare(
      `INSERT INTO order_lines (order_id, part_id, part_number, title, quantity, quantity_backordered, unit_price_cents, retail_unit_price_cents,
         core_deposit_cents, weight_grams, fitment_id, fitment_summary) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    ),
    event: sqlite.prepare('INSERT INTO order_events (order_id, status, note) VALUES (?, ?, ?)'),
    clearCart: sqlite.prepare('DELETE FROM cart_lines WHERE cart_id = ?'),
    openBalance: sqlite.prepare(OPEN_ACCOUNT_SQL),
    byId: sqlite.prepare(
      `SELECT id, number, user_id AS userId, status, payment_method AS paymentMethod, payment_state AS paymentState, payment_intent_id AS paymentIntentId,
              total_cents AS totalCents, refunded_cents AS refundedCents FROM orders WHERE id = ?`,
    ),
    byNumber: sqlite.prepare(
      `SELECT id, number, user_id AS userId, status, payment_method AS paymentMethod, payment_state AS paymentState, payment_intent_id AS paymentIntentId,
              total_cents AS totalCents, refunded_cents AS refundedCents FROM orders WHERE number = ?`,
    ),
    byIntent: sqlite.prepare(
      `SELECT id, number, user_id AS userId, status, payment_method AS paymentMethod, payment_state AS paymentState, payment_intent_id AS paymentIntentId,
              total_cents AS totalCents, refunded_cents AS refundedCents FROM orders WHERE payment_intent_id = ?`,
    ),
    setIntent: sqlite.prepare('UPDATE orders SET payment_intent_id = ? WHERE id = ?'),
    setState: sqlite.prepare("UPDATE orders SET status = ?, payment_state = ?, updated_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?"),
    orderLines: sqlite.prepare('SELECT part_id AS partId, quantity, quantity_backordered AS backordered FROM order_lines WHERE order_id = ?'),
    recordEvent: sqlite.prepare('INSERT INTO payment_events (event_id, type, payment_intent_id) VALUES (?, ?, ?) ON CONFLICT DO NOTHING'),
    setRefunded: sqlite.prepare('UPDATE orders SET refunded_cents = max(refunded_cents, ?), payment_state = ? WHERE id = ?'),
  };

  /** Places the order in one immediate transaction: stock is checked and reserved, so a last unit is sold once. */
  const placeOrder = sqlite.transaction((user: CurrentUser, cartId: number, input: Checkout) => {
    const lines = stmt.cartLines.all(cartId) as CheckoutLine[];
    if (lines.length === 0) throw new HttpError(409, 'Your cart is empty');
    const buyer = buyerOf(user);
    const dealer = buyer.kind === 'dealer' ? user.dealer! : null;
    if (input.method === 'account' && !dealer) throw new HttpError(403, 'Ordering on account needs an approved trade account');

    const backorders = new Map<number, number>();
    for (const l of lines) {
      const available = Math.max(0, stock.available(l.partId));
      if (l.quantity <= available) continue;
      const short = l.quantity - available;
      if (dealer && l.allowBackorder && l.status !== 'discontinued') {
        backorders.set(l.lineId, short);
      } else {
        throw new HttpError(
          409,
          available === 0
            ? `${l.partNumber} is out of stock${dealer ? ': remove it or allow a back-order' : ''}`
            : `Only ${available} of ${l.partNumber} available${dealer ? ': lower the quantity or allow a back-order for the rest' : ': lower the quantity'}`,
        );
      }
    }

    const zone: DeliveryZone = (input.delivery?.zone ?? (dealer?.deliveryZone as DeliveryZone | undefined) ?? 'national') as DeliveryZone;
    const totals = priceOrder(
      lines.map((l) => ({ partNumber: l.partNumber, quantity: l.quantity, retailUnitCents: l.priceCents, coreDepositCents: l.coreDepositCents, weightGrams: l.weightGrams })),
      buyer,
      zone,
      deps.taxRatePct,
    );

    if (input.method === 'account' && dealer) {
      const open = (stmt.openBalance.get(dealer.id) as { n: number }).n;
      if (open + totals.totalCents > dealer.creditLimitCents) {
        const fmt = (c: number) => `$${(c / 100).toFixed(2)}`;
        throw new HttpError(
          409,
          `This order of ${fmt(totals.totalCents)} would take your open balance from ${fmt(open)} to ${fmt(open + totals.totalCents)}, over your credit limit of ${fmt(dealer.creditLimitCents)}. Pay an open invoice, or pay this order by card.`,
        );
      }
    }

    const delivery = input.delivery ?? dealerAddress(dealer?.id ?? null);
    if (!delivery) throw new HttpError(400, 'A delivery address is needed', { delivery: ['enter a delivery address'] });
    const id = (stmt.nextId.get() as { n: number }).n;
    const number = `SY-${100000 + id}`;
    const status: OrderStatus = input.method === 'account' ? 'on_account' : 'pending_payment';
    const orderId = (
      stmt.insertOrder.get({
        number,
        userId: user.id,
        dealerAccountId: dealer?.id ?? null,
        status,
        paymentMethod: input.method,
        paymentState: input.method === 'account' ? 'on_account' : 'awaiting',
        purchaseOrder: input.method === 'account' ? input.purchaseOrder : null,
        paymentTermsDays: dealer && input.method === 'account' ? dealer.paymentTermsDays : null,
        goodsCents: totals.goodsCents,
        discountCents: totals.discountCents,
        coreDepositCents: totals.coreDepositCents,
        freightCents: totals.freightCents,
        taxCents: totals.taxCents,
        totalCents: totals.totalCents,
        weightGrams: totals.weightGrams,
        deliveryZone: zone,
        shipName: delivery.name,
        shipLine1: delivery.line1,
        shipCity: delivery.city,
        shipPostcode: delivery.postcode,
        email: user.email,
      }) as { id: number }
    ).id;
    lines.forEach((l, i) => {
      const priced = totals.lines[i]!;
      const short = backorders.get(l.lineId) ?? 0;
      const fitment = l.fitmentId ? `${l.fitmentName ?? 'Saved check'}: ${l.fitmentSummary ?? ''}`.trim() : null;
      stmt.insertLine.run(orderId, l.partId, l.partNumber, l.title, l.quantity, short, priced.unitCents, l.priceCents, l.coreDepositCents, l.weightGrams, l.fitmentId, fitment);
      const reserved = stock.reserve(l.partId, l.quantity - short, orderId);
      if (reserved !== l.quantity - short) throw new Error(`Reservation mismatch on ${l.partNumber}`);
    });
    stmt.event.run(orderId, 'placed', input.method === 'account' ? `Purchase order ${input.purchaseOrder}` : null);
    if (input.method === 'account') stmt.event.run(orderId, 'on_account', `Payment terms ${dealer!.paymentTermsDays} days`);
    if (backorders.size > 0) stmt.event.run(orderId, 'back_ordered', `${[...backorders.values()].reduce((a, b) => a + b, 0)} units wait for stock`);
    stmt.clearCart.run(cartId);
    return { orderId, number, status, totalCents: totals.totalCents, backordered: backorders.size > 0, lines };
  });

  function dealerAddress(dealerId: number | null) {
    if (!dealerId) return null;
    const d = sqlite
      .prepare('SELECT company_name AS name, address_line1 AS line1, city, postcode, delivery_zone AS zone FROM dealer_accounts WHERE id = ?')
      .get(dealerId) as { name: string; line1: string; city: string; postcode: string; zone: DeliveryZone } | undefined;
    return d ?? null;
  }

  /** A card order that will not be paid: stock goes back, the lines go back into the cart, the order is cancelled. */
  const cancelUnpaid = sqlite.transaction((orderId: number, note: string) => {
    const order = stmt.byId.get(orderId) as OrderRow;
    if (order.status !== 'pending_payment') return false;
    const restoreTo = cart.cartId({ userId: order.userId }, true)!;
    // The lines go back as they were: quantity, the fitment check they were bought for, and the back-order tick
    // (a line that went on back-order had it ticked; the saved check is only kept if it still exists).
    const lines = sqlite
      .prepare(
        `SELECT l.part_id AS partId, l.quantity, l.quantity_backordered AS backordered, f.id AS fitmentId
         FROM order_lines l LEFT JOIN saved_fitments f ON f.id = l.fitment_id WHERE l.order_id = ?`,
      )
      .all(orderId) as Array<{ partId: number; quantity: number; backordered: number; fitmentId: number | null }>;
    for (const l of lines) {
      stock.release(orderId, l.partId, Infinity, 'payment not completed');
      sqlite
        .prepare('INSERT INTO cart_lines (cart_id, part_id, quantity, fitment_id, allow_backorder) VALUES (?, ?, ?, ?, ?) ON CONFLICT (cart_id, part_id) DO NOTHING')
        .run(restoreTo, l.partId, l.quantity, l.fitmentId, l.backordered > 0 ? 1 : 0);
    }
    stmt.setState.run('cancelled', 'failed', orderId);
    stmt.event.run(orderId, 'cancelled', note);
    return true;
  });

  async function checkout(user: CurrentUser, owner: CartOwner, input: Checkout): Promise<{ status: number; body: CheckoutResponse }> {
    const cartId = cart.cartId(owner, false);
    if (!cartId) throw new HttpError(409, 'Your cart is empty');
    const placed = placeOrder.immediate(user, cartId, input);
    if (input.method === 'account') {
      notify.orderConfirmed(placed.orderId);
      if (placed.backordered) notify.backordered(placed.orderId);
      return { status: 201, body: { order: { number: placed.number, status: placed.status, totalCents: placed.totalCents }, nextAction: null } };
    }
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
      stmt.setIntent.run(intent.id, placed.orderId);
      const confirmed = await payments.paymentIntents.confirm(intent.id, { payment_method: input.paymentMethod }, { idempotencyKey: `order-${placed.number}-confirm` });
      if (confirmed.status === 'requires_action') {
        stmt.setState.run('pending_payment', 'requires_action', placed.orderId);
        return {
          status: 201,
          body: { order: { number: placed.number, status: 'pending_payment', totalCents: placed.totalCents }, nextAction: { type: 'authenticate', paymentIntentId: intent.id, clientSecret: confirmed.client_secret } },
        };
      }
      return { status: 201, body: { order: { number: placed.number, status: 'pending_payment', totalCents: placed.totalCents }, nextAction: null } };
    } catch (err) {
      const card = err as { type?: string; message?: string; decline_code?: string; code?: string };
      const declined = card.type === 'StripeCardError';
      const reason = declined
        ? `Your card was declined${card.decline_code ? ` (${card.decline_code.replace(/_/g, ' ')})` : ''}. No payment was taken.`
        : 'The payment service could not be reached. No payment was taken.';
      if (cancelUnpaid(placed.orderId, reason)) notify.paymentFailed(placed.orderId, reason);
      throw new HttpError(declined ? 402 : 502, `${reason} Your cart is as it was: try another card.`);
    }
  }

  /**
   * Applies a verified webhook event once. The event id is recorded in the same transaction as its effect, so a
   * repeat changes nothing, and a paid order is never moved back by a late failure event.
   */
  const applyEvent = sqlite.transaction((event: Stripe.Event) => {
    const object = event.data.object as { id: string; object: string; payment_intent?: string | null; amount_refunded?: number; amount?: number };
    const intentId = object.object === 'payment_intent' ? object.id : (object.payment_intent ?? null);
    const inserted = stmt.recordEvent.run(event.id, event.type, intentId);
    if (inserted.changes === 0) return { applied: false, effect: null as null | 'paid' | 'failed' | 'refunded', orderId: null as number | null };
    const order = intentId ? (stmt.byIntent.get(intentId) as OrderRow | undefined) : undefined;
    if (!order) return { applied: true, effect: null, orderId: null };
    if (event.type === 'payment_intent.succeeded') {
      if (order.status === 'pending_payment') {
        stmt.setState.run('paid', 'paid', order.id);
        stmt.event.run(order.id, 'paid', 'Card payment received');
        return { applied: true, effect: 'paid' as const, orderId: order.id };
      }
      return { applied: true, effect: null, orderId: order.id };
    }
    if (event.type === 'payment_intent.payment_failed') {
      // Cancelling happens outside this transaction's statement group below, through cancelUnpaid.
      return { applied: true, effect: order.status === 'pending_payment' ? ('failed' as const) : null, orderId: order.id };
    }
    if (event.type === 'charge.refunded' && typeof object.amount_refunded === 'number') {
      const refunded = Math.min(object.amount_refunded, order.totalCents);
      stmt.setRefunded.run(refunded, refunded >= order.totalCents ? 'refunded' : 'partially_refunded', order.id);
      return { applied: true, effect: 'refunded' as const, orderId: order.id };
    }
    return { applied: true, effect: null, orderId: order.id };
  });

  function handlePaymentEvent(event: Stripe.Event) {
    const result = applyEvent(event);
    if (result.effect === 'paid' && result.orderId) {
      notify.orderConfirmed(result.orderId);
      const hasBackorder = (stmt.orderLines.all(result.orderId) as Array<{ backordered: number }>).some((l) => l.backordered > 0);
      if (hasBackorder) notify.backordered(result.orderId);
    }
    if (result.effect === 'failed' && result.orderId) {
      const reason = 'The card payment could not be completed (authentication failed). No payment was taken.';
      if (cancelUnpaid(result.orderId, reason)) notify.paymentFailed(result.orderId, reason);
    }
    return result;
  }

  /** A signed-in user's own order; someone else's answers 404 exactly like a missing one. */
  function ownOrder(user: CurrentUser, number: string): OrderRow {
    const order = stmt.byNumber.get(number) as OrderRow | undefined;
    const allowed = order && (order.userId === user.id || user.role === 'admin' || user.role === 'warehouse');
    if (!order || !allowed) throw new HttpError(404, `No order ${number}`);
    return order;
  }

  function listOrders(user: CurrentUser): OrderSummary[] {
    return (
      sqlite
        .prepare(
          `SELECT o.number, o.status, o.payment_method AS paymentMethod, o.payment_state AS paymentState, o.purchase_order AS purchaseOrder,
                  o.total_cents AS totalCents, o.created_at AS createdAt, count(l.id) AS lineCount, max(l.quantity_backordered > 0) AS hasBackorder
           FROM orders o JOIN order_lines l ON l.order_id = o.id WHERE o.user_id = ? GROUP BY o.id ORDER BY o.id DESC LIMIT 200`,
        )
        .all(user.id) as Array<Omit<OrderSummary, 'hasBackorder'> & { hasBackorder: number }>
    ).map((o) => ({ ...o, hasBackorder: o.hasBackorder === 1 }));
  }

  function orderDetail(user: CurrentUser, number: string): OrderDetail {
    const { id } = ownOrder(user, number);
    const o = sqlite
      .prepare(
        `SELECT o.*, d.company_name AS companyName FROM orders o LEFT JOIN dealer_accounts d ON d.id = o.dealer_account_id WHERE o.id = ?`,
      )
      .get(id) as Record<string, string | number | null>;
    const lines = sqlite
      .prepare(
        `SELECT l.id, l.part_number AS partNumber, l.title, l.quantity, l.quantity_backordered AS quantityBackordered, l.quantity_picked AS quantityPicked,
                l.unit_price_cents AS unitPriceCents, l.core_deposit_cents AS coreDepositCents, l.unit_price_cents * l.quantity AS lineCents,
                l.fitment_summary AS fitmentSummary, p.category, p.condition
         FROM order_lines l JOIN parts p ON p.id = l.part_id WHERE l.order_id = ? ORDER BY l.id`,
      )
      .all(id) as OrderDetail['lines'];
    const timeline = sqlite.prepare('SELECT status, note, created_at AS at FROM order_events WHERE order_id = ? ORDER BY id').all(id) as OrderDetail['timeline'];
    return {
      number: String(o.number),
      status: o.status as OrderStatus,
      paymentMethod: o.payment_method as 'card' | 'account',
      paymentState: String(o.payment_state),
      purchaseOrder: (o.purchase_order as string | null) ?? null,
      totalCents: Number(o.total_cents),
      createdAt: String(o.created_at),
      lineCount: lines.length,
      hasBackorder: lines.some((l) => l.quantityBackordered > 0),
      email: String(o.email),
      paymentTermsDays: (o.payment_terms_days as number | null) ?? null,
      lines,
      totals: {
        goodsCents: Number(o.goods_cents),
        discountCents: Number(o.discount_cents),
        coreDepositCents: Number(o.core_deposit_cents),
        freightCents: Number(o.freight_cents),
        taxCents: Number(o.tax_cents),
        totalCents: Number(o.total_cents),
        weightGrams: Number(o.weight_grams),
        refundedCents: Number(o.refunded_cents),
      },
      delivery: { name: String(o.ship_name), line1: String(o.ship_line1), city: String(o.ship_city), postcode: String(o.ship_postcode), zone: String(o.delivery_zone) },
      dispatch: { carrier: (o.carrier as string | null) ?? null, trackingNumber: (o.tracking_number as string | null) ?? null, cartons: (o.cartons as number | null) ?? null },
      timeline,
      dealer: o.companyName ? { companyName: String(o.companyName) } : null,
    };
  }

  /** Rebuilds the cart from a past order; superseded parts are replaced by what supersedes them, with a notice. */
  function reorder(user: CurrentUser, number: string) {
    const { id } = ownOrder(user, number);
    const lines = sqlite.prepare('SELECT part_number AS partNumber, quantity FROM order_lines WHERE order_id = ? ORDER BY id').all(id) as Array<{ partNumber: string; quantity: number }>;
    const notices: string[] = [];
    const addable: Array<{ partNumber: string; quantity: number }> = [];
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
      addable.push({ partNumber: resolved.part.partNumber, quantity: l.quantity });
    }
    const view = addable.length ? cart.addLines({ userId: user.id }, user, addable) : cart.view({ userId: user.id }, user);
    return { added: addable.length, notices: [...view.notices, ...notices] };
  }

  function orderForIntent(user: CurrentUser, intentId: string) {
    const order = stmt.byIntent.get(intentId) as OrderRow | undefined;
    if (!order || order.userId !== user.id) throw new HttpError(404, 'No such payment');
    return order;
  }

  /**
   * Card orders left unpaid (an authentication never finished, a tab closed) give their stock back after a while:
   * the payment is cancelled with the provider first, so a late success cannot land on a cancelled order.
   */
  async function expireUnpaid(maxAgeMinutes: number) {
    const cutoff = new Date(deps.now().getTime() - maxAgeMinutes * 60_000).toISOString();
    const stale = sqlite
      .prepare("SELECT id, number, payment_intent_id AS intent FROM orders WHERE status = 'pending_payment' AND created_at < ? ORDER BY id LIMIT 100")
      .all(cutoff) as Array<{ id: number; number: string; intent: string | null }>;
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
      if (cancelUnpaid(o.id, `Not paid within ${maxAgeMinutes} minutes; the stock went back on the shelf`)) expired++;
    }
    return expired;
  }

  return { checkout, handlePaymentEvent, listOrders, orderDetail, reorder, ownOrder, orderForIntent, cancelUnpaid, expireUnpaid };
}

export type OrderService = ReturnType<typeof createOrderService>;
