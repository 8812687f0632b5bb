import type Stripe from 'stripe';
import type { Db } from '../db/client';
import type { CartService } from './cart';
import type { StockService } from './stock';
import { createOrderPayments, type OrderNotifier } from './orders/order-payments';
import { createOrderPlacement } from './orders/order-placement';
import { createOrderReads } from './orders/order-reads';
import type { TrackingUrlPatterns } from '../../shared/carriers';
import { createOrderChanges, type OrderChangeNotifier } from './orders/order-changes';

// notifications.ts implements the notifier under this path; the type itself lives with the payments flow.
export type { OrderNotifier } from './orders/order-payments';

export interface OrderServiceDeps {
  db: Db;
  stock: StockService;
  cart: CartService;
  payments: Stripe;
  notify: OrderNotifier & OrderChangeNotifier;
  taxRatePct: number;
  now: () => Date;
  /** Carriers' tracking pages (shared/carriers.ts); the invented defaults when not given. */
  trackingUrls?: TrackingUrlPatterns;
}

/** The order flow as the routes and the unpaid-order sweep use it, built from placing, paying and reading. */
export function createOrderService(deps: OrderServiceDeps) {
  const placement = createOrderPlacement({ db: deps.db, stock: deps.stock, cart: deps.cart, taxRatePct: deps.taxRatePct });
  const payments = createOrderPayments({ db: deps.db, payments: deps.payments, notify: deps.notify, placement, now: deps.now });
  const reads = createOrderReads({ db: deps.db, cart: deps.cart, trackingUrls: deps.trackingUrls });
  const changes = createOrderChanges({ db: deps.db, stock: deps.stock, payments: deps.payments, notify: deps.notify, taxRatePct: deps.taxRatePct, now: deps.now });
  // The housekeeping job's pass over card payments also asks again for change refunds the provider refused.
  async function reconcilePayments(options: { settleAfterMs?: number } = {}) {
    const figures = await payments.reconcilePayments(options);
    return { ...figures, changeRefunds: await changes.retryChangeRefunds(options) };
  }
  // cancelUnpaid cancels the order only; cancelForNonPayment cancels its payment at the provider first.
  return {
    ...reads,
    ...payments,
    reconcilePayments,
    cancelUnpaid: placement.cancelUnpaid,
    changesOf: changes.changesOf,
    changeOrder: changes.change,
    cancelOrder: changes.cancel,
    retryChangeRefunds: changes.retryChangeRefunds,
  };
}

export type OrderService = ReturnType<typeof createOrderService>;
