import { eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import type { Db } from '../db/client';
import { preparedOn } from '../db/prepared';
import { creditNotes, dealerAccounts, dealerMembers, orderChanges, orderLines, orders, parts, returns, shipments, user } from '../db/schema';
import { CATEGORY_SLUGS } from '../../shared/catalog';
import { DEALER_TIERS } from '../../shared/pricing';
import { enqueueMail } from './mail-outbox';
import type { Query } from './orders/order-reads';
import type { MailKind } from '../../shared/allowed-values';
import type { OutgoingMail } from './mailer';
import { renderBackOrderNotice } from './mail-templates/back-order-notice';
import { renderDealerApplicationApproved } from './mail-templates/dealer-application-approved';
import { renderDealerApplicationDeclined } from './mail-templates/dealer-application-declined';
import { renderDealerApplicationReceived } from './mail-templates/dealer-application-received';
import { renderOrderConfirmation } from './mail-templates/order-confirmation';
import { renderPasswordReset } from './mail-templates/password-reset';
import { renderAccountConfirm, renderExistingAccountNotice } from './mail-templates/account-confirm';
import { renderPaymentFailed } from './mail-templates/payment-failed';
import { renderDispatchNotice } from './mail-templates/dispatch-notice';
import { renderReturnDecision } from './mail-templates/return-decision';
import { CONDITION_GRADES } from '../../shared/schemas/warehouse';
import type { WarehouseNotifier } from './warehouse';
import type { ReturnsNotifier } from './returns';
import type { MailAddress } from './mail-templates/types';
import type { OrderNotifier } from './orders';
import type { OrderChangeNotifier } from './orders/order-changes';
import { renderOrderChanged } from './mail-templates/order-changed';
import { OrderChangeLineSchema } from '../../shared/schemas/order-changes';
import { orientationWords } from '../../shared/exploded-view';

/** parts.category is plain text in the schema; the templates take the shop's category slugs. */
const categorySlug = z.enum(CATEGORY_SLUGS);

/**
 * Builds each message inside the transaction of the change that causes it (every method takes that transaction) and
 * writes it to the mail outbox there; the outbox worker sends it after the commit, so no request waits for the mail
 * server and a change that rolls back leaves no message.
 */
export function createNotifications(deps: { db: Db; publicUrl: string }) {
  const orderRow = (q: Query, orderId: number) =>
    preparedOn(q, 'mail:order', (h) =>
      h
      .select({
        number: orders.number,
        email: orders.email,
        userName: user.name,
        createdAt: orders.createdAt,
        paymentMethod: orders.paymentMethod,
        paymentState: orders.paymentState,
        purchaseOrder: orders.purchaseOrder,
        paymentTermsDays: orders.paymentTermsDays,
        goodsCents: orders.goodsCents,
        discountCents: orders.discountCents,
        coreDepositCents: orders.coreDepositCents,
        freightCents: orders.freightCents,
        taxCents: orders.taxCents,
        totalCents: orders.totalCents,
        shipName: orders.shipName,
        shipLine1: orders.shipLine1,
        shipCity: orders.shipCity,
        shipPostcode: orders.shipPostcode,
        companyName: dealerAccounts.companyName,
      })
      .from(orders)
      .innerJoin(user, eq(user.id, orders.userId))
      .leftJoin(dealerAccounts, eq(dealerAccounts.id, orders.dealerAccountId))
      .where(eq(orders.id, sql.placeholder('orderId')))
      .prepare(),
    ).get({ orderId });
  const orderLinesOf = (q: Query, orderId: number) =>
    preparedOn(q, 'mail:order-lines', (h) =>
      h
      .select({
        partNumber: orderLines.partNumber,
        title: orderLines.title,
        category: parts.category,
        quantity: orderLines.quantity,
        unitPriceCents: orderLines.unitPriceCents,
        coreDepositCents: orderLines.coreDepositCents,
        backordered: orderLines.quantityBackordered,
        compressorOutletClock: orderLines.compressorOutletClock,
        turbineInletClock: orderLines.turbineInletClock,
      })
      .from(orderLines)
      .innerJoin(parts, eq(parts.id, orderLines.partId))
      .where(eq(orderLines.orderId, sql.placeholder('orderId')))
      .orderBy(orderLines.id)
      .prepare(),
    ).all({ orderId });
  const dealerRow = (q: Query, dealerAccountId: number) =>
    q
      .select({
        companyName: dealerAccounts.companyName,
        contactName: dealerAccounts.contactName,
        tier: dealerAccounts.tier,
        creditLimitCents: dealerAccounts.creditLimitCents,
        paymentTermsDays: dealerAccounts.paymentTermsDays,
        declineReason: dealerAccounts.declineReason,
        createdAt: dealerAccounts.createdAt,
        email: user.email,
      })
      .from(dealerAccounts)
      .innerJoin(dealerMembers, eq(dealerMembers.dealerAccountId, dealerAccounts.id))
      .innerJoin(user, eq(user.id, dealerMembers.userId))
      .where(eq(dealerAccounts.id, dealerAccountId))
      .limit(1)
      .get();
  type OrderMailRow = NonNullable<ReturnType<typeof orderRow>>;

  const send = (q: Query, kind: MailKind, build: () => OutgoingMail) => enqueueMail(q, kind, build);
  const url = (path: string) => `${deps.publicUrl.replace(/\/$/, '')}${path}`;
  const address = (o: OrderMailRow): MailAddress => ({ name: o.shipName, company: o.companyName ?? undefined, lines: [o.shipLine1], city: o.shipCity, postalCode: o.shipPostcode });
  const load = (q: Query, orderId: number) => {
    const order = orderRow(q, orderId);
    const lines = orderLinesOf(q, orderId);
    return order ? { order, lines } : null;
  };

  const orderMail: OrderNotifier & OrderChangeNotifier = {
    orderConfirmed(q, orderId) {
      const found = load(q, orderId);
      if (!found) return;
      const { order, lines } = found;
      send(q, 'order-confirmation', () => ({
        to: order.email,
        ...renderOrderConfirmation({
          orderNumber: order.number,
          customerName: order.userName,
          placedAt: new Date(order.createdAt),
          lines: lines.map((l) => ({
            partNumber: l.partNumber,
            title: l.title,
            category: categorySlug.parse(l.category),
            quantity: l.quantity,
            unitPriceCents: l.unitPriceCents,
            lineTotalCents: l.unitPriceCents * l.quantity,
            coreDepositCents: l.coreDepositCents || undefined,
            backOrderedQuantity: l.backordered || undefined,
            orientation: orientationWords(l.compressorOutletClock, l.turbineInletClock),
          })),
          totals: {
            goodsCents: order.goodsCents + order.discountCents,
            dealerDiscountCents: order.discountCents,
            coreDepositsCents: order.coreDepositCents,
            freightCents: order.freightCents,
            taxCents: order.taxCents,
            totalCents: order.totalCents,
          },
          deliveryAddress: address(order),
          payment:
            order.paymentMethod === 'account'
              ? { method: 'account', purchaseOrder: order.purchaseOrder ?? '', paymentTerms: `Net ${order.paymentTermsDays ?? 30} days` }
              : { method: 'card', status: order.paymentState === 'paid' ? 'paid' : 'pending' },
          orderUrl: url(`/orders/${order.number}`),
        }),
      }));
    },
    paymentFailed(q, orderId, reason) {
      const found = load(q, orderId);
      if (!found) return;
      const { order } = found;
      send(q, 'payment-failed', () => ({
        to: order.email,
        ...renderPaymentFailed({ orderNumber: order.number, customerName: order.userName, amountCents: order.totalCents, declineMessage: reason, retryUrl: url('/cart') }),
      }));
    },
    orderChanged(q, changeId) {
      const c = q.select().from(orderChanges).where(eq(orderChanges.id, changeId)).get();
      const order = c ? orderRow(q, c.orderId) : undefined;
      if (!c || !order) return;
      send(q, 'order-changed', () => ({
        to: order.email,
        ...renderOrderChanged({
          orderNumber: order.number,
          customerName: order.userName,
          kind: c.kind,
          lines: OrderChangeLineSchema.array().parse(c.lines),
          beforeTotalCents: c.beforeTotalCents,
          afterTotalCents: c.afterTotalCents,
          adjustmentCents: c.adjustmentCents,
          settlement: c.settlement,
          purchaseOrder: order.purchaseOrder ?? undefined,
          orderUrl: url(`/orders/${order.number}`),
        }),
      }));
    },
    backordered(q, orderId) {
      const found = load(q, orderId);
      if (!found) return;
      const { order, lines } = found;
      const waiting = lines.filter((l) => l.backordered > 0);
      if (waiting.length === 0) return;
      send(q, 'back-order', () => ({
        to: order.email,
        ...renderBackOrderNotice({
          orderNumber: order.number,
          customerName: order.userName,
          cause: 'checkout',
          lines: waiting.map((l) => ({ partNumber: l.partNumber, title: l.title, orderedQuantity: l.quantity, backOrderedQuantity: l.backordered })),
          orderUrl: url(`/orders/${order.number}`),
        }),
      }));
    },
  };

  const warehouseMail: WarehouseNotifier = {
    shortPicked(q, orderId, short) {
      const found = load(q, orderId);
      if (!found) return;
      const { order } = found;
      send(q, 'short-pick', () => ({
        to: order.email,
        ...renderBackOrderNotice({
          orderNumber: order.number,
          customerName: order.userName,
          cause: 'short-pick',
          lines: short.map((l) => ({ partNumber: l.partNumber, title: l.title, orderedQuantity: l.ordered, backOrderedQuantity: l.backordered })),
          orderUrl: url(`/orders/${order.number}`),
        }),
      }));
    },
    dispatched(q, orderId, shipmentId) {
      const found = load(q, orderId);
      const shipment = q
        .select({ carrier: shipments.carrier, trackingNumber: shipments.trackingNumber, cartons: shipments.cartons, grams: shipments.weightGrams, at: shipments.createdAt })
        .from(shipments)
        .where(eq(shipments.id, shipmentId))
        .get();
      if (!found || !shipment) return;
      const { order, lines } = found;
      send(q, 'dispatch', () => ({
        to: order.email,
        ...renderDispatchNotice({
          orderNumber: order.number,
          customerName: order.userName,
          dispatchedAt: new Date(shipment.at),
          carrier: shipment.carrier,
          trackingNumber: shipment.trackingNumber,
          cartons: shipment.cartons,
          weightKg: shipment.grams / 1000,
          lines: lines.filter((l) => l.quantity - l.backordered > 0).map((l) => ({ partNumber: l.partNumber, title: l.title, category: categorySlug.parse(l.category), quantity: l.quantity - l.backordered })),
          stillBackOrdered: lines.filter((l) => l.backordered > 0).map((l) => ({ partNumber: l.partNumber, title: l.title, quantity: l.backordered })),
          deliveryAddress: address(order),
          orderUrl: url(`/orders/${order.number}`),
        }),
      }));
    },
  };

  const returnsMail: ReturnsNotifier = {
    returnDecided(q, returnId) {
      const r = q
        .select({
          reference: returns.reference,
          quantity: returns.quantity,
          status: returns.status,
          decision: returns.decision,
          refundCents: returns.refundCents,
          rejectReason: returns.rejectReason,
          decisionReason: returns.decisionReason,
          kind: returns.kind,
          grade: returns.conditionGrade,
          orderNumber: orders.number,
          email: orders.email,
          name: user.name,
          partNumber: orderLines.partNumber,
          title: orderLines.title,
          creditNote: creditNotes.number,
        })
        .from(returns)
        .innerJoin(orders, eq(orders.id, returns.orderId))
        .innerJoin(user, eq(user.id, returns.userId))
        .innerJoin(orderLines, eq(orderLines.id, returns.orderLineId))
        .leftJoin(creditNotes, eq(creditNotes.returnId, returns.id))
        .where(eq(returns.id, returnId))
        .get();
      if (!r) return;
      const route = r.creditNote ? ({ via: 'credit-note', creditNoteNumber: r.creditNote } as const) : ({ via: 'card' } as const);
      const outcome =
        r.decision === 'reject'
          ? ({ kind: 'rejected', reason: r.rejectReason ?? '' } as const)
          : r.kind === 'core'
            ? ({ kind: 'core-deposit-refund', amountCents: r.refundCents, route, partial: r.decision === 'partial-refund', reason: r.decisionReason ?? undefined } as const)
            : ({ kind: 'refund', amountCents: r.refundCents, partial: r.decision === 'partial-refund', route, reason: r.decisionReason ?? undefined } as const);
      send(q, 'return-decision', () => ({
        to: r.email,
        ...renderReturnDecision({
          customerName: r.name,
          returnReference: r.reference,
          orderNumber: r.orderNumber,
          partNumber: r.partNumber,
          title: r.title,
          quantity: r.quantity,
          conditionGrade: r.grade ? CONDITION_GRADES[r.grade] : undefined,
          outcome,
          orderUrl: url('/returns'),
        }),
      }));
    },
  };

  return {
    orders: orderMail,
    warehouse: warehouseMail,
    returns: returnsMail,
    dealerApplied(q: Query, dealerAccountId: number) {
      const d = dealerRow(q, dealerAccountId);
      if (!d) return;
      send(q, 'dealer-application-received', () => ({ to: d.email, ...renderDealerApplicationReceived({ contactName: d.contactName, companyName: d.companyName, submittedAt: new Date(d.createdAt) }) }));
    },
    dealerDecided(q: Query, dealerAccountId: number, decision: 'approve' | 'decline') {
      const d = dealerRow(q, dealerAccountId);
      if (!d) return;
      if (decision === 'approve' && d.tier) {
        const tier = DEALER_TIERS[d.tier];
        send(q, 'dealer-approved', () => ({
          to: d.email,
          ...renderDealerApplicationApproved({
            contactName: d.contactName,
            companyName: d.companyName,
            tier: tier.label,
            discountPercent: tier.discountPct,
            creditLimitCents: d.creditLimitCents,
            paymentTerms: `Net ${d.paymentTermsDays} days`,
            signInUrl: url('/sign-in'),
          }),
        }));
      } else {
        send(q, 'dealer-declined', () => ({ to: d.email, ...renderDealerApplicationDeclined({ contactName: d.contactName, companyName: d.companyName, reason: d.declineReason ?? '' }) }));
      }
    },
    /** The auth library's mails are written on their own (it has no transaction to share); the answer waits for one insert. */
    passwordReset(to: { email: string; name: string }, resetUrl: string) {
      send(deps.db, 'password-reset', () => ({ to: to.email, ...renderPasswordReset({ name: to.name, resetUrl, expiresInMinutes: 60 }) }));
    },
    accountConfirm(to: { email: string; name: string }, confirmUrl: string) {
      send(deps.db, 'account-confirm', () => ({ to: to.email, ...renderAccountConfirm({ name: to.name, confirmUrl, expiresInMinutes: 24 * 60 }) }));
    },
    existingAccountNotice(to: { email: string; name: string }) {
      send(deps.db, 'existing-account-notice', () => ({ to: to.email, ...renderExistingAccountNotice({ name: to.name, signInUrl: url('/sign-in'), resetUrl: url('/forgot-password') }) }));
    },
    send,
    url,
    address,
    load,
  };
}

export type Notifications = ReturnType<typeof createNotifications>;
