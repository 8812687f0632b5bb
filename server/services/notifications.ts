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

  type DealerRow = { companyName: string; contactName: string; tier: DealerTier | null; creditLimitCents: number; paymentTermsDays: number; declineReason: string | null; createdAt: string; email: string };
  return {
    orders,
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
