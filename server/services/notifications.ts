import type { Db } from '../db/client';
import type { CategorySlug } from '../../shared/catalog';
import { DEALER_TIERS, type DealerTier } from '../../shared/pricing';
import { sendSafely, type MailerPort } from './mailer';
import { renderBackOrderNotice } from './mail-templates/back-order-notice';
import { renderDealerApplicationApproved } from './mail-templates/dealer-application-approved';
import { renderDealerApplicationDeclined } from './mail-templates/dealer-application-declined';
import { renderDealerApplicationReceived } from './mail-templates/dealer-application-received';
import { renderOrderConfirmation } from './mail-templates/order-confirmation';
import { renderPasswordReset } from './mail-templates/password-reset';
import { renderPaymentFailed } from './mail-templates/payment-failed';
import { renderDispatchNotice } from './mail-templates/dispatch-notice';
import { renderReturnDecision } from './mail-templates/return-decision';
import { CONDITION_GRADES, type ConditionGrade } from '../../shared/schemas/warehouse';
import type { WarehouseNotifier } from './warehouse';
import type { ReturnsNotifier } from './returns';
import type { MailAddress } from './mail-templates/types';
import type { OrderNotifier } from './orders';

interface OrderMailRow {
  number: string;
  email: string;
  userName: string;
  createdAt: string;
  paymentMethod: 'card' | 'account';
  paymentState: string;
  purchaseOrder: string | null;
  paymentTermsDays: number | null;
  goodsCents: number;
  discountCents: number;
  coreDepositCents: number;
  freightCents: number;
  taxCents: number;
  totalCents: number;
  shipName: string;
  shipLine1: string;
  shipCity: string;
  shipPostcode: string;
  companyName: string | null;
}

/**
 * Builds each message from the database after the change that causes it has committed, and sends it without
 * letting a mail failure reach the request.
 */
export function createNotifications(deps: { db: Db; mailer: MailerPort; publicUrl: string; track?: (p: Promise<boolean>) => void }) {
  const sqlite = deps.db.$client;
  const track = deps.track ?? (() => {});
  const orderRow = sqlite.prepare(
    `SELECT o.number, o.email, u.name AS userName, o.created_at AS createdAt, o.payment_method AS paymentMethod, o.payment_state AS paymentState,
            o.purchase_order AS purchaseOrder, o.payment_terms_days AS paymentTermsDays, o.goods_cents AS goodsCents, o.discount_cents AS discountCents,
            o.core_deposit_cents AS coreDepositCents, o.freight_cents AS freightCents, o.tax_cents AS taxCents, o.total_cents AS totalCents,
            o.ship_name AS shipName, o.ship_line1 AS shipLine1, o.ship_city AS shipCity, o.ship_postcode AS shipPostcode, d.company_name AS companyName
     FROM orders o JOIN user u ON u.id = o.user_id LEFT JOIN dealer_accounts d ON d.id = o.dealer_account_id WHERE o.id = ?`,
  );
  const orderLines = sqlite.prepare(
    `SELECT l.part_number AS partNumber, l.title, p.category, l.quantity, l.unit_price_cents AS unitPriceCents, l.core_deposit_cents AS coreDepositCents,
            l.quantity_backordered AS backordered
     FROM order_lines l JOIN parts p ON p.id = l.part_id WHERE l.order_id = ? ORDER BY l.id`,
  );
  const dealerRow = sqlite.prepare(
    `SELECT d.company_name AS companyName, d.contact_name AS contactName, d.tier, d.credit_limit_cents AS creditLimitCents,
            d.payment_terms_days AS paymentTermsDays, d.decline_reason AS declineReason, d.created_at AS createdAt, u.email
     FROM dealer_accounts d JOIN dealer_members m ON m.dealer_account_id = d.id JOIN user u ON u.id = m.user_id WHERE d.id = ? LIMIT 1`,
  );

  const send = (label: string, build: () => { to: string; subject: string; text: string; html: string }) => track(sendSafely(deps.mailer, build, label));
  const url = (path: string) => `${deps.publicUrl.replace(/\/$/, '')}${path}`;
  const address = (o: OrderMailRow): MailAddress => ({ name: o.shipName, company: o.companyName ?? undefined, lines: [o.shipLine1], city: o.shipCity, postalCode: o.shipPostcode });
  const load = (orderId: number) => {
    const order = orderRow.get(orderId) as OrderMailRow | undefined;
    const lines = orderLines.all(orderId) as Array<{ partNumber: string; title: string; category: CategorySlug; quantity: number; unitPriceCents: number; coreDepositCents: number; backordered: number }>;
    return order ? { order, lines } : null;
  };

  const orders: OrderNotifier = {
    orderConfirmed(orderId) {
      const found = load(orderId);
      if (!found) return;
      const { order, lines } = found;
      send('order confirmation', () => ({
        to: order.email,
        ...renderOrderConfirmation({
          orderNumber: order.number,
          customerName: order.userName,
          placedAt: new Date(order.createdAt),
          lines: lines.map((l) => ({
            partNumber: l.partNumber,
            title: l.title,
            category: l.category,
            quantity: l.quantity,
            unitPriceCents: l.unitPriceCents,
            lineTotalCents: l.unitPriceCents * l.quantity,
            coreDepositCents: l.coreDepositCents || undefined,
            backOrderedQuantity: l.backordered || undefined,
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
    paymentFailed(orderId, reason) {
      const found = load(orderId);
      if (!found) return;
      const { order } = found;
      send('payment failure', () => ({
        to: order.email,
        ...renderPaymentFailed({ orderNumber: order.number, customerName: order.userName, amountCents: order.totalCents, declineMessage: reason, retryUrl: url('/cart') }),
      }));
    },
    backordered(orderId) {
      const found = load(orderId);
      if (!found) return;
      const { order, lines } = found;
      const waiting = lines.filter((l) => l.backordered > 0);
      if (waiting.length === 0) return;
      send('back-order notice', () => ({
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

  const warehouse: WarehouseNotifier = {
    shortPicked(orderId, short) {
      const found = load(orderId);
      if (!found) return;
      const { order } = found;
      send('short-pick back-order notice', () => ({
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
    dispatched(orderId, shipmentId) {
      const found = load(orderId);
      const shipment = sqlite
        .prepare('SELECT carrier, tracking_number AS trackingNumber, cartons, weight_grams AS grams, created_at AS at FROM shipments WHERE id = ?')
        .get(shipmentId) as { carrier: string; trackingNumber: string; cartons: number; grams: number; at: string } | undefined;
      if (!found || !shipment) return;
      const { order, lines } = found;
      send('dispatch notice', () => ({
        to: order.email,
        ...renderDispatchNotice({
          orderNumber: order.number,
          customerName: order.userName,
          dispatchedAt: new Date(shipment.at),
          carrier: shipment.carrier,
          trackingNumber: shipment.trackingNumber,
          cartons: shipment.cartons,
          weightKg: shipment.grams / 1000,
          lines: lines.filter((l) => l.quantity - l.backordered > 0).map((l) => ({ partNumber: l.partNumber, title: l.title, category: l.category, quantity: l.quantity - l.backordered })),
          stillBackOrdered: lines.filter((l) => l.backordered > 0).map((l) => ({ partNumber: l.partNumber, title: l.title, quantity: l.backordered })),
          deliveryAddress: address(order),
          orderUrl: url(`/orders/${order.number}`),
        }),
      }));
    },
  };

  const returns: ReturnsNotifier = {
    returnDecided(returnId) {
      const r = sqlite
        .prepare(
          `SELECT r.reference, r.quantity, r.status, r.decision, r.refund_cents AS refundCents, r.reject_reason AS rejectReason, r.condition_grade AS grade,
                  o.number AS orderNumber, o.email, u.name, l.part_number AS partNumber, l.title, c.number AS creditNote
           FROM returns r JOIN orders o ON o.id = r.order_id JOIN user u ON u.id = r.user_id JOIN order_lines l ON l.id = r.order_line_id
           LEFT JOIN credit_notes c ON c.return_id = r.id WHERE r.id = ?`,
        )
        .get(returnId) as
        | { reference: string; quantity: number; status: string; decision: string; refundCents: number; rejectReason: string | null; grade: ConditionGrade | null; orderNumber: string; email: string; name: string; partNumber: string; title: string; creditNote: string | null }
        | undefined;
      if (!r) return;
      const route = r.creditNote ? ({ via: 'credit-note', creditNoteNumber: r.creditNote } as const) : ({ via: 'card' } as const);
      const outcome =
        r.decision === 'reject'
          ? ({ kind: 'rejected', reason: r.rejectReason ?? '' } as const)
          : r.decision === 'core-refund'
            ? ({ kind: 'core-deposit-refund', amountCents: r.refundCents, route } as const)
            : ({ kind: 'refund', amountCents: r.refundCents, partial: r.decision === 'partial-refund', route } as const);
      send('return decision', () => ({
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

  type DealerRow = { companyName: string; contactName: string; tier: DealerTier | null; creditLimitCents: number; paymentTermsDays: number; declineReason: string | null; createdAt: string; email: string };
  return {
    orders,
    warehouse,
    returns,
    dealerApplied(dealerAccountId: number) {
      const d = dealerRow.get(dealerAccountId) as DealerRow | undefined;
      if (!d) return;
      send('dealer application received', () => ({ to: d.email, ...renderDealerApplicationReceived({ contactName: d.contactName, companyName: d.companyName, submittedAt: new Date(d.createdAt) }) }));
    },
    dealerDecided(dealerAccountId: number, decision: 'approve' | 'decline') {
      const d = dealerRow.get(dealerAccountId) as DealerRow | undefined;
      if (!d) return;
      if (decision === 'approve' && d.tier) {
        const tier = DEALER_TIERS[d.tier];
        send('dealer approval', () => ({
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
        send('dealer decline', () => ({ to: d.email, ...renderDealerApplicationDeclined({ contactName: d.contactName, companyName: d.companyName, reason: d.declineReason ?? '' }) }));
      }
    },
    async passwordReset(to: { email: string; name: string }, resetUrl: string) {
      await sendSafely(deps.mailer, () => ({ to: to.email, ...renderPasswordReset({ name: to.name, resetUrl, expiresInMinutes: 60 }) }), 'password reset');
    },
    send,
    url,
    address,
    load,
  };
}

export type Notifications = ReturnType<typeof createNotifications>;
