import type { ReactNode } from 'react';
import { ExternalLink, PackageOpen, Printer, Truck, Undo2 } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { OrderDetail } from '../../../../shared/schemas/orders';
import { buttonClass } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { PAYMENT_POLL_LIMIT, PAYMENT_POLL_MS, useOrder } from '../../../lib/orders';
import { OrderLinesTable, OrderTotals, zoneLabel } from './order-lines';
import { formatDateTime } from '../../../../shared/format';
import { StatusBadge } from '../../../components/ui/status-badge';
import { OrderTimeline } from './order-timeline';
import { ReorderButton } from './reorder-button';
import { OrderChanges, useBuyerCancelled } from './order-changes';
import { cancelledBanner, type CartHolding } from '../lib/cancelled-banner';

const PAYMENT_STATE_WORDS: Record<string, string> = {
  awaiting: 'Waiting for the card payment to be confirmed',
  requires_action: 'Waiting for card authentication',
  paid: 'Paid by card',
  failed: 'Payment not completed: no money was taken',
  on_account: 'On account',
  refunded: 'Refunded',
  partially_refunded: 'Partly refunded',
};

function PaymentBanner({ order, placed, cart }: { order: OrderDetail; placed: boolean; cart: CartHolding | undefined }) {
  const buyerCancelled = useBuyerCancelled(order.number);
  if (order.status === 'pending_payment') {
    // Polling stops after about PAYMENT_POLL_LIMIT answers; by then the order is old enough to say so.
    const slow = Date.now() - Date.parse(order.createdAt) > (PAYMENT_POLL_LIMIT * PAYMENT_POLL_MS) / 2;
    return (
      <Notice tone={slow ? 'warning' : 'info'} title="Waiting for the payment service to confirm your payment…">
        <p className="text-sm">
          {slow ? 'This is taking longer than usual. Reload the page in a minute; you will also get an e-mail.' : 'This usually takes a second or two.'}
        </p>
      </Notice>
    );
  }
  // A buyer who cancelled the order themselves sees that in the order's changes, not as a failed payment.
  const cancelled = buyerCancelled ? null : cancelledBanner(order, cart);
  if (cancelled) {
    const when = cancelled.at ? (
      <>
        {' '}
        on <time dateTime={cancelled.at}>{formatDateTime(cancelled.at)}</time>
      </>
    ) : null;
    return (
      <Notice tone={cancelled.cart === 'still-there' ? 'warning' : 'info'} title={<>Payment not completed: this order was cancelled{when}</>}>
        <p className="text-ink">
          {cancelled.reason && <>{cancelled.reason.replace(/\.?$/, '.')} </>}
          {/* The recorded reason often says so already. */}
          {!/no (payment|money) was taken/i.test(cancelled.reason ?? '') && 'No money was taken.'}
        </p>
        {cancelled.cart === 'still-there' ? (
          <p className="text-ink">
            Its parts went back into your cart and are still there.{' '}
            <Link to="/cart" className="font-semibold text-temper underline">
              Go to your cart
            </Link>{' '}
            to pay with another card.
          </p>
        ) : cancelled.cart === 'changed' ? (
          <p className="text-ink">Its parts went back into your cart then; your cart has changed since. Reorder puts them in again.</p>
        ) : null}
      </Notice>
    );
  }
  if (placed && (order.status === 'paid' || order.status === 'on_account')) {
    return (
      <Notice tone="done" title={order.status === 'paid' ? 'Thank you: payment received' : 'Thank you: order placed on account'}>
        <p className="text-ink">A confirmation is on its way to {order.email}.</p>
      </Notice>
    );
  }
  return null;
}

/** Each dispatch with its carrier and a link to the carrier's tracking page (the address pattern is configured per carrier). */
function Shipments({ order }: { order: OrderDetail }) {
  if (order.shipments.length === 0) return null;
  return (
    <ul aria-label="Shipments" className="mt-2 grid gap-2">
      {order.shipments.map((s, i) => (
        <li key={`${s.trackingNumber}-${i}`} className="flex items-start gap-2">
          <Truck aria-hidden className="mt-0.5 size-4 shrink-0 text-machined" />
          <span>
            {formatDateTime(s.at)}: <span className="tabular">{s.units}</span> {s.units === 1 ? 'unit' : 'units'} with {s.carrier}
            <span className="block">
              Tracking{' '}
              {s.trackingUrl ? (
                <a href={s.trackingUrl} target="_blank" rel="noreferrer noopener" className="part-no inline-flex items-center gap-1 text-temper underline underline-offset-2">
                  {s.trackingNumber}
                  <ExternalLink aria-hidden className="size-3.5" />
                  <span className="sr-only"> (opens the carrier’s tracking page in a new tab)</span>
                </a>
              ) : (
                <span className="part-no">{s.trackingNumber}</span>
              )}
            </span>
          </span>
        </li>
      ))}
    </ul>
  );
}

const RETURN_STATUS_WORDS: Record<string, string> = { requested: 'authorised, on its way back', refunded: 'refunded', credited: 'credited', rejected: 'not accepted' };

/** Returns asked for on this order, each with its label while the part is on its way back. */
function OrderReturns({ order }: { order: OrderDetail }) {
  if (order.returns.length === 0) return null;
  const partOf = (lineId: number) => order.lines.find((l) => l.id === lineId)?.partNumber ?? '';
  return (
    <section aria-labelledby="order-returns-heading" className="grid gap-2">
      <h2 id="order-returns-heading" className="text-xl font-bold">
        Returns
      </h2>
      <ul className="grid gap-2">
        {order.returns.map((r) => (
          <li key={r.reference} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-cast-line bg-white p-3">
            <span>
              <Link to={`/returns?ref=${encodeURIComponent(r.reference)}`} className="part-no text-temper underline underline-offset-2">
                {r.reference}
              </Link>{' '}
              · <span className="tabular">{r.quantity}</span> × <span className="part-no">{partOf(r.lineId)}</span> · {RETURN_STATUS_WORDS[r.status] ?? r.status}
            </span>
            {r.status === 'requested' && (
              <Link to={`/returns/${encodeURIComponent(r.reference)}/label`} className={buttonClass('secondary')}>
                <Printer aria-hidden className="size-4" /> Label<span className="sr-only"> for {r.reference}</span>
              </Link>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

/** `saveToList` is the page's "save this order to a list" tool for trade accounts (another feature owns lists). */
export function OrderPage({
  number,
  placed,
  canReturn = false,
  onReorderAdded,
  saveToList,
  cartLines,
}: {
  number: string;
  placed: boolean;
  canReturn?: boolean;
  onReorderAdded: () => void;
  saveToList?: ReactNode;
  /** What the buyer's cart holds now, so a cancelled order's banner says whether its parts are still there. */
  cartLines?: CartHolding;
}) {
  const order = useOrder(number);
  if (order.isPending) return <LoadingState label={`Loading order ${number}…`} />;
  if (order.isError) {
    if (order.error instanceof ApiError && order.error.isNotFound) {
      return (
        <div className="grid gap-2 py-6">
          <h1 className="text-2xl font-bold">No order {number}</h1>
          <p>
            We have no order with that number on your account.{' '}
            <Link to="/orders" className="font-semibold text-temper underline">
              See your orders
            </Link>
          </p>
        </div>
      );
    }
    if (order.error instanceof ApiError && order.error.isUnauthorized) {
      return (
        <p className="py-6">
          <Link to={`/sign-in?next=/orders/${encodeURIComponent(number)}`} className="font-semibold text-temper underline">
            Sign in
          </Link>{' '}
          to see this order.
        </p>
      );
    }
    return <ErrorState title="This order did not load" message={order.error.message} onRetry={() => order.refetch()} />;
  }
  const o = order.data;
  const hasDispatch = o.dispatch.carrier || o.dispatch.trackingNumber || o.dispatch.cartons;
  const canReorder = o.status !== 'pending_payment';
  return (
    <article className="grid gap-6">
      <nav aria-label="Breadcrumb" className="text-sm text-cast">
        <Link to="/orders" className="hover:underline">
          Your orders
        </Link>{' '}
        / <span className="part-no">{o.number}</span>
      </nav>
      <header className="flex flex-wrap items-center justify-between gap-4">
        <div>
          <h1 className="text-3xl font-bold">
            Order <span className="part-no">{o.number}</span>
          </h1>
          <p className="text-cast">
            Placed <time dateTime={o.createdAt}>{formatDateTime(o.createdAt)}</time>
            {o.dealer && <> · {o.dealer.companyName}</>}
          </p>
        </div>
        <StatusBadge kind="order" status={o.status} />
      </header>
      <PaymentBanner order={o} placed={placed} cart={cartLines} />
      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="grid min-w-0 content-start gap-6">
          <section aria-labelledby="lines-heading" className="min-w-0">
            <h2 id="lines-heading" className="mb-2 text-xl font-bold">
              Lines
            </h2>
            <OrderLinesTable
              order={o}
              lineAction={
                canReturn && o.lines.some((l) => l.quantityReturnable > 0)
                  ? (l) =>
                      l.quantityReturnable > 0 ? (
                        <Link to={`/returns/new?order=${encodeURIComponent(o.number)}&line=${l.id}`} className={`${buttonClass('secondary')} whitespace-nowrap`}>
                          <Undo2 aria-hidden className="size-4" />
                          Return<span className="sr-only"> {l.partNumber}</span>
                        </Link>
                      ) : null
                  : undefined
              }
            />
            {canReturn && o.lines.some((l) => l.quantityReturnable > 0) && (
              <p className="mt-2 flex items-center gap-2 text-sm text-cast">
                <PackageOpen aria-hidden className="size-4 shrink-0" /> Wrong, faulty, or an exchange core to send back? Use Return on the line; you print a label for the parcel.
              </p>
            )}
          </section>
          <section aria-labelledby="totals-heading" className="max-w-md justify-self-end rounded-lg bg-white p-5 shadow-sm ring-1 ring-cast-line sm:min-w-80">
            <h2 id="totals-heading" className="text-xl font-bold">
              Totals
            </h2>
            <OrderTotals order={o} />
          </section>
          <OrderChanges order={o} />
          <OrderReturns order={o} />
        </div>
        <aside className="grid min-w-0 content-start gap-6" aria-label="Order details">
          <section aria-labelledby="timeline-heading">
            <h2 id="timeline-heading" className="mb-3 text-xl font-bold">
              Progress
            </h2>
            <OrderTimeline order={o} />
          </section>
          <section aria-labelledby="payment-heading">
            <h2 id="payment-heading" className="text-xl font-bold">
              Payment
            </h2>
            <dl className="mt-1 grid gap-1">
              <div>
                <dt className="sr-only">Method</dt>
                <dd>{o.paymentMethod === 'account' ? 'On account' : 'Card'}</dd>
              </div>
              {o.paymentState !== 'on_account' && (
                <div>
                  <dt className="sr-only">State</dt>
                  <dd className="text-cast">{PAYMENT_STATE_WORDS[o.paymentState] ?? o.paymentState}</dd>
                </div>
              )}
              {o.purchaseOrder && (
                <div className="flex gap-1">
                  <dt>Purchase order:</dt>
                  <dd className="part-no">{o.purchaseOrder}</dd>
                </div>
              )}
              {o.paymentTermsDays !== null && (
                <div className="flex gap-1">
                  <dt>Terms:</dt>
                  <dd>{o.paymentTermsDays} days</dd>
                </div>
              )}
            </dl>
          </section>
          <section aria-labelledby="delivery-heading">
            <h2 id="delivery-heading" className="text-xl font-bold">
              Delivery
            </h2>
            <address className="mt-1 not-italic">
              {o.delivery.name}
              <br />
              {o.delivery.line1}
              <br />
              {o.delivery.city} {o.delivery.postcode}
              <br />
              <span className="text-cast">{zoneLabel(o.delivery.zone)}</span>
            </address>
            {o.shipments.length > 0 && <Shipments order={o} />}
            {hasDispatch && o.shipments.length === 0 && (
              <p className="mt-2 inline-flex items-start gap-2">
                <Truck aria-hidden className="mt-0.5 size-4 shrink-0 text-machined" />
                <span>
                  Dispatched{o.dispatch.carrier && <> with {o.dispatch.carrier}</>}
                  {o.dispatch.trackingNumber && (
                    <>
                      , tracking <span className="part-no">{o.dispatch.trackingNumber}</span>
                    </>
                  )}
                  {o.dispatch.cartons !== null && (
                    <>
                      {' '}
                      · <span className="tabular">{o.dispatch.cartons}</span> {o.dispatch.cartons === 1 ? 'carton' : 'cartons'}
                    </>
                  )}
                </span>
              </p>
            )}
          </section>
          <div className="grid gap-3">
            {canReorder && <ReorderButton number={o.number} onAdded={onReorderAdded} />}
            {saveToList}
            <Link to={`/orders/${encodeURIComponent(o.number)}/invoice`} className={buttonClass('secondary')}>
              <Printer aria-hidden className="size-4" />
              {o.paymentMethod === 'account' ? 'Printable invoice' : 'Printable receipt'}
            </Link>
          </div>
        </aside>
      </div>
    </article>
  );
}
