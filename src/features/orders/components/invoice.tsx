import { Printer } from 'lucide-react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { useFocusableWhenScrolling } from '../../../components/ui/scroll-focus';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useOrder } from '../../../lib/orders';
import { OrderLinesTable, OrderTotals } from './order-lines';
import { formatDate } from '../../../../shared/format';
import { formatPrice } from '../../../../shared/catalog';
import { statusMeta } from './order-status';
import { useOrderChanges } from '../api/get-order-changes';

/** The distributor's own details, printed at the head of every invoice. */
export const DISTRIBUTOR = { name: 'Spoolyard Turbo Supply', address: 'Unit 7, Foundry Row, Quenchfold', email: 'orders@spoolyard.test' } as const;

function dueDate(createdAt: string, days: number) {
  const d = new Date(createdAt);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString();
}

/** A printable invoice (on account) or receipt (card): plain black on white, no site chrome on paper. */
export function Invoice({ number }: { number: string }) {
  const order = useOrder(number);
  const scrollRef = useFocusableWhenScrolling<HTMLElement>();
  const changes = useOrderChanges(number).data?.changes ?? [];
  if (order.isPending) return <LoadingState label={`Loading invoice for ${number}…`} />;
  if (order.isError) {
    return order.error instanceof ApiError && order.error.isNotFound ? (
      <p className="py-6">No order {number} on your account.</p>
    ) : (
      <ErrorState title="The invoice did not load" message={order.error.message} onRetry={() => order.refetch()} />
    );
  }
  const o = order.data;
  const account = o.paymentMethod === 'account';
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <style>{'@page { size: A4; margin: 14mm; } @media print { html, body { background: #fff; } }'}</style>
      <div className="no-print flex flex-wrap items-center gap-3">
        <Button onClick={() => window.print()}>
          <Printer aria-hidden className="size-4" />
          Print
        </Button>
        <Link to={`/orders/${encodeURIComponent(o.number)}`} className="font-semibold text-temper underline">
          Back to the order
        </Link>
      </div>
      <article ref={scrollRef} aria-label={`${account ? 'Invoice' : 'Receipt'} ${o.number}`} className="mx-auto grid w-full max-w-3xl gap-6 overflow-x-auto bg-white focus-visible:outline-3 focus-visible:outline-temper p-4 sm:p-8 text-ink shadow-sm ring-1 ring-cast-line print:max-w-none print:p-0 print:shadow-none print:ring-0">
        <header className="flex flex-wrap justify-between gap-6 border-b-2 border-ink pb-4">
          <div>
            <p className="text-2xl font-bold">{DISTRIBUTOR.name}</p>
            <p>{DISTRIBUTOR.address}</p>
            <p>{DISTRIBUTOR.email}</p>
          </div>
          <div className="text-right">
            <h1 className="text-3xl font-bold">{account ? 'Invoice' : 'Receipt'}</h1>
            <dl className="mt-1 grid grid-cols-[auto_auto] justify-end gap-x-3 text-sm">
              <dt>Number</dt>
              <dd className="part-no">{o.number}</dd>
              <dt>Date</dt>
              <dd className="tabular">{formatDate(o.createdAt)}</dd>
              {o.purchaseOrder && (
                <>
                  <dt>Your PO</dt>
                  <dd className="part-no">{o.purchaseOrder}</dd>
                </>
              )}
              {o.paymentTermsDays !== null && (
                <>
                  <dt>Terms</dt>
                  <dd>{o.paymentTermsDays} days net</dd>
                  <dt>Due</dt>
                  <dd className="tabular">{formatDate(dueDate(o.createdAt, o.paymentTermsDays))}</dd>
                </>
              )}
              <dt>Status</dt>
              <dd>{statusMeta(o.status).label}</dd>
            </dl>
          </div>
        </header>
        <div className="grid gap-6 sm:grid-cols-2 print:grid-cols-2">
          <section>
            <h2 className="text-sm font-bold uppercase tracking-wide">Bill to</h2>
            <p>{o.dealer?.companyName ?? o.delivery.name}</p>
            <p>{o.email}</p>
          </section>
          <section>
            <h2 className="text-sm font-bold uppercase tracking-wide">Deliver to</h2>
            <address className="not-italic">
              {o.delivery.name}
              <br />
              {o.delivery.line1}
              <br />
              {o.delivery.city} {o.delivery.postcode}
            </address>
          </section>
        </div>
        <OrderLinesTable order={o} print />
        <div className="ml-auto w-full max-w-sm">
          <OrderTotals order={o} />
        </div>
        <footer className="grid gap-1 border-t border-cast-line pt-3 text-sm">
          {changes.length > 0 && (
            <p className="font-semibold">
              {o.status === 'cancelled'
                ? `Cancelled at your request on ${formatDate(changes[0]!.createdAt)}.`
                : `Amended at your request on ${formatDate(changes[0]!.createdAt)}: originally ${formatPrice(changes.at(-1)!.beforeTotalCents)}, now ${formatPrice(o.totalCents)}.`}
            </p>
          )}
          {account && o.status === 'cancelled' ? (
            <p>This invoice is cancelled; nothing is due.</p>
          ) : account ? (
            <p>
              Payment due within {o.paymentTermsDays ?? 30} days of the invoice date. Please quote {o.purchaseOrder ? `your PO ${o.purchaseOrder} and ` : ''}invoice {o.number}.
            </p>
          ) : (
            <p>{o.status === 'cancelled' ? 'This order was cancelled; nothing is due.' : 'Paid by card. Nothing further is due.'}</p>
          )}
          {o.totals.coreDepositCents > 0 && <p>Core deposits are refunded when the old units are returned in rebuildable condition.</p>}
        </footer>
      </article>
    </div>
  );
}
