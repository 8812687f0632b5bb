import { eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { preparedOn } from '../../db/prepared';
import { CART_LINE_COMPRESSOR_CLOCK_KEY, CART_LINE_TURBINE_CLOCK_KEY, cartLines, dealerAccounts, orderEvents, orderLines, orders, parts, savedFitments } from '../../db/schema';
import { ConflictError, InvalidError, NotAllowedError } from '../errors';
import type { CurrentUser } from '../current-user';
import { checkCredit } from '../../../shared/credit';
import { DELIVERY_ZONE_KEYS, priceOrder, zoneForPostcode, type DeliveryZone } from '../../../shared/pricing';
import type { Checkout, OrderStatus } from '../../../shared/schemas/orders';
import { buyerOf, type CartOwner, type CartService } from '../cart';
import { dealerOpenBalance } from '../dealer-accounts';
import type { StockService } from '../stock';
import { findOrder, type Query } from './order-reads';
import { formatOrderNumber } from '../../../shared/part-number';

type PaymentState = (typeof orders.$inferSelect)['paymentState'];

/** The same expression as the schema's timestamp defaults. */
const now = sql<string>`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;

const $ = sql.placeholder;

export function setOrderState(q: Query, orderId: number, status: OrderStatus, paymentState: PaymentState) {
  preparedOn(q, 'order:state', (h) => h.update(orders).set({ status: sql`${$('status')}`, paymentState: sql`${$('paymentState')}`, updatedAt: now }).where(eq(orders.id, $('orderId'))).prepare()).run({
    orderId,
    status,
    paymentState,
  });
}

export function addOrderEvent(q: Query, orderId: number, status: string, note: string | null) {
  preparedOn(q, 'order:event', (h) => h.insert(orderEvents).values({ orderId: $('orderId'), status: $('status'), note: $('note') }).prepare()).run({ orderId, status, note });
}

const isDeliveryZone = (zone: string | undefined): zone is DeliveryZone => DELIVERY_ZONE_KEYS.some((k) => k === zone);

export interface OrderPlacementDeps {
  db: Db;
  stock: StockService;
  cart: CartService;
  taxRatePct: number;
}

export function createOrderPlacement(deps: OrderPlacementDeps) {
  const { db, stock, cart } = deps;

  // Each placement inserts an order and its lines with these, built and prepared once (placeholders by column name).
  const placeholders = <K extends string>(keys: readonly K[]) => Object.fromEntries(keys.map((k) => [k, $(k)])) as unknown as Record<K, ReturnType<typeof $>>;
  const ORDER_FIELDS = [
    'number', 'userId', 'dealerAccountId', 'status', 'paymentMethod', 'paymentState', 'purchaseOrder', 'paymentTermsDays', 'goodsCents', 'discountCents',
    'coreDepositCents', 'freightCents', 'taxCents', 'totalCents', 'weightGrams', 'deliveryZone', 'shipName', 'shipLine1', 'shipCity', 'shipPostcode', 'email',
  ] as const;
  const LINE_FIELDS = [
    'orderId', 'partId', 'partNumber', 'title', 'quantity', 'quantityBackordered', 'unitPriceCents', 'retailUnitPriceCents', 'coreDepositCents', 'weightGrams',
    'fitmentId', 'fitmentSummary', 'compressorOutletClock', 'turbineInletClock',
  ] as const;
  const insertOrder = db.insert(orders).values(placeholders(ORDER_FIELDS) as unknown as typeof orders.$inferInsert).returning({ id: orders.id }).prepare();
  const insertLine = db.insert(orderLines).values(placeholders(LINE_FIELDS) as unknown as typeof orderLines.$inferInsert).prepare();

  function cartLinesOf(q: Query, cartId: number) {
    return preparedOn(q, 'order:cart-lines', (h) =>
      h
      .select({
        lineId: cartLines.id,
        partId: parts.id,
        partNumber: parts.partNumber,
        title: parts.title,
        status: parts.status,
        quantity: cartLines.quantity,
        allowBackorder: cartLines.allowBackorder,
        priceCents: parts.priceCents,
        coreDepositCents: parts.coreDepositCents,
        weightGrams: parts.weightGrams,
        fitmentId: cartLines.fitmentId,
        fitmentName: savedFitments.name,
        fitmentSummary: savedFitments.summary,
        compressorOutletClock: cartLines.compressorOutletClock,
        turbineInletClock: cartLines.turbineInletClock,
      })
      .from(cartLines)
      .innerJoin(parts, eq(parts.id, cartLines.partId))
      .leftJoin(savedFitments, eq(savedFitments.id, cartLines.fitmentId))
      .where(eq(cartLines.cartId, $('cartId')))
      .orderBy(cartLines.id)
      .prepare(),
    ).all({ cartId });
  }

  function dealerAddress(q: Query, dealerId: number | null) {
    if (!dealerId) return null;
    const found = q
      .select({ name: dealerAccounts.companyName, line1: dealerAccounts.addressLine1, city: dealerAccounts.city, postcode: dealerAccounts.postcode })
      .from(dealerAccounts)
      .where(eq(dealerAccounts.id, dealerId))
      .get();
    return found ?? null;
  }

  /** Places the order in one immediate transaction: stock is checked and reserved, so a last unit is sold once. */
  const placeOrder = (user: CurrentUser, cartId: number, input: Checkout) =>
    db.transaction(
      (tx) => {
        const lines = cartLinesOf(tx, cartId);
        if (lines.length === 0) throw new ConflictError('Your cart is empty');
        const buyer = buyerOf(user);
        const dealer = buyer.kind === 'dealer' ? user.dealer : null;
        if (input.method === 'account' && !dealer) throw new NotAllowedError('Ordering on account needs an approved trade account');

        const backorders = new Map<number, number>();
        for (const l of lines) {
          const available = Math.max(0, stock.available(l.partId));
          if (l.quantity <= available) continue;
          const short = l.quantity - available;
          if (dealer && l.allowBackorder && l.status !== 'discontinued') {
            backorders.set(l.lineId, short);
          } else {
            throw new ConflictError(
              available === 0
                ? `${l.partNumber} is out of stock${dealer ? ': remove it or allow a back-order' : ''}`
                : `Only ${available} of ${l.partNumber} available${dealer ? ': lower the quantity or allow a back-order for the rest' : ': lower the quantity'}`,
            );
          }
        }

        const dealerZone = dealer?.deliveryZone;
        // Never a zone the client sends: a trade account's freight goes by the zone staff set on the account (what its
        // cart shows), anyone else's by the delivery address's postcode.
        const zone: DeliveryZone = dealer ? (isDeliveryZone(dealerZone) ? dealerZone : 'national') : zoneForPostcode(input.delivery?.postcode ?? '');
        const totals = priceOrder(
          lines.map((l) => ({ partNumber: l.partNumber, quantity: l.quantity, retailUnitCents: l.priceCents, coreDepositCents: l.coreDepositCents, weightGrams: l.weightGrams })),
          buyer,
          zone,
          deps.taxRatePct,
        );

        if (input.method === 'account' && dealer) {
          const credit = checkCredit({ openBalanceCents: dealerOpenBalance(tx, dealer.id), orderCents: totals.totalCents, creditLimitCents: dealer.creditLimitCents });
          if (!credit.fits) throw new ConflictError(credit.message);
        }

        const delivery = input.delivery ?? dealerAddress(tx, dealer?.id ?? null);
        if (!delivery) throw new InvalidError('A delivery address is needed', { delivery: ['enter a delivery address'] });
        const next = preparedOn(tx, 'order:next-id', (h) =>
          h
            .select({ id: sql<number>`coalesce(max(${orders.id}), 0) + 1` })
            .from(orders)
            .prepare(),
        ).get();
        const number = formatOrderNumber(next?.id ?? 1);
        const status: OrderStatus = input.method === 'account' ? 'on_account' : 'pending_payment';
        const { id: orderId } = insertOrder.get({
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
          } satisfies Record<(typeof ORDER_FIELDS)[number], unknown>)!;
        lines.forEach((l, i) =>
          insertLine.run({
              orderId,
              partId: l.partId,
              partNumber: l.partNumber,
              title: l.title,
              quantity: l.quantity,
              quantityBackordered: backorders.get(l.lineId) ?? 0,
              unitPriceCents: totals.lines[i]!.unitCents,
              retailUnitPriceCents: l.priceCents,
              coreDepositCents: l.coreDepositCents,
              weightGrams: l.weightGrams,
              fitmentId: l.fitmentId,
              fitmentSummary: l.fitmentId ? `${l.fitmentName ?? 'Saved check'}: ${l.fitmentSummary ?? ''}`.trim() : null,
              compressorOutletClock: l.compressorOutletClock,
              turbineInletClock: l.turbineInletClock,
            } satisfies Record<(typeof LINE_FIELDS)[number], unknown>),
        );
        for (const l of lines) {
          const wanted = l.quantity - (backorders.get(l.lineId) ?? 0);
          if (stock.reserve(l.partId, wanted, orderId) !== wanted) throw new Error(`Reservation mismatch on ${l.partNumber}`);
        }
        addOrderEvent(tx, orderId, 'placed', input.method === 'account' ? `Purchase order ${input.purchaseOrder}` : null);
        if (input.method === 'account' && dealer) addOrderEvent(tx, orderId, 'on_account', `Payment terms ${dealer.paymentTermsDays} days`);
        if (backorders.size > 0) addOrderEvent(tx, orderId, 'back_ordered', `${[...backorders.values()].reduce((a, b) => a + b, 0)} units wait for stock`);
        preparedOn(tx, 'order:empty-cart', () => db.delete(cartLines).where(eq(cartLines.cartId, $('cartId'))).prepare()).run({ cartId });
        return { orderId, number, status, totalCents: totals.totalCents, backordered: backorders.size > 0 };
      },
      { behavior: 'immediate' },
    );

  /** The buyer's cart becomes an order; an empty or missing cart is refused before anything is written. */
  function placeFromCart(user: CurrentUser, owner: CartOwner, input: Checkout) {
    const cartId = cart.cartId(owner, false);
    if (!cartId) throw new ConflictError('Your cart is empty');
    return placeOrder(user, cartId, input);
  }

  /** A card order that will not be paid: stock goes back, the lines go back into the cart, the order is cancelled. */
  const cancelUnpaid = (orderId: number, note: string) =>
    db.transaction((tx) => {
      const order = findOrder(tx, eq(orders.id, orderId));
      if (!order || order.status !== 'pending_payment') return false;
      const restoreTo = cart.cartId({ userId: order.userId }, true)!;
      // The lines go back as they were: quantity, the fitment check they were bought for, and the back-order tick
      // (a line that went on back-order had it ticked; the saved check is only kept if it still exists).
      const lines = tx
        .select({
          partId: orderLines.partId,
          quantity: orderLines.quantity,
          backordered: orderLines.quantityBackordered,
          fitmentId: savedFitments.id,
          compressorOutletClock: orderLines.compressorOutletClock,
          turbineInletClock: orderLines.turbineInletClock,
        })
        .from(orderLines)
        .leftJoin(savedFitments, eq(savedFitments.id, orderLines.fitmentId))
        .where(eq(orderLines.orderId, orderId))
        .orderBy(orderLines.id)
        .all();
      for (const l of lines) {
        stock.release(orderId, l.partId, Infinity, 'payment not completed');
        tx.insert(cartLines)
          .values({
            cartId: restoreTo,
            partId: l.partId,
            quantity: l.quantity,
            fitmentId: l.fitmentId,
            allowBackorder: l.backordered > 0,
            compressorOutletClock: l.compressorOutletClock,
            turbineInletClock: l.turbineInletClock,
          })
          .onConflictDoNothing({ target: [cartLines.cartId, cartLines.partId, CART_LINE_COMPRESSOR_CLOCK_KEY, CART_LINE_TURBINE_CLOCK_KEY] })
          .run();
      }
      setOrderState(tx, orderId, 'cancelled', 'failed');
      addOrderEvent(tx, orderId, 'cancelled', note);
      return true;
    });

  return { placeFromCart, cancelUnpaid };
}

export type OrderPlacement = ReturnType<typeof createOrderPlacement>;
