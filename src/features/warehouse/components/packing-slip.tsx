import { Printer, TriangleAlert } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { OrderDetail } from '../../../../shared/schemas/orders';
import type { PickList } from '../../../../shared/schemas/warehouse';
import { Button, buttonClass } from '../../../components/ui/button';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useOrder } from '../../../lib/orders';
import { usePickList } from '../api/get-pick-list';
import { formatDate } from '../../../../shared/format';
import { OrientationNote } from '../../../components/ui/orientation-note';

export const DISTRIBUTOR = { name: 'Spoolyard Turbo Supply', address: 'Unit 7, Foundry Row, Quenchfold' } as const;

export function PackingSlipPage({ number }: { number: string }) {
  const order = useOrder(number);
  const picks = usePickList([number]);
  if (order.isPending || picks.isPending) return <LoadingState label={`Loading the packing slip for ${number}…`} />;
  if (order.error)
    return (
      <ErrorState
        title={order.error instanceof ApiError && order.error.isNotFound ? `There is no order ${number}` : 'The packing slip did not load'}
        message={order.error.message}
        onRetry={() => void order.refetch()}
      />
    );
  // Bins come from the pick list; a slip without them still goes out with the parcel.
  return <PackingSlip order={order.data} picks={picks.data ?? null} binsError={picks.error?.message ?? null} />;
}

export function PackingSlip({ order, picks, binsError }: { order: OrderDetail; picks: PickList | null; binsError: string | null }) {
  const binFor = (lineId: number) => picks?.lines.find((l) => l.lineId === lineId)?.binCode ?? null;
  const backordered = order.lines.filter((l) => l.quantityBackordered > 0);
  return (
    <article aria-labelledby="slip-heading" className="mx-auto grid max-w-4xl gap-6 bg-white p-6 print:max-w-none print:p-0 print:text-[11pt]">
      <div className="no-print flex flex-wrap gap-3">
        <Button size="lg" onClick={() => window.print()} className="no-print">
          <Printer aria-hidden className="size-5" />
          Print
        </Button>
        <Link to={`/floor/orders/${encodeURIComponent(order.number)}/pack`} className={`${buttonClass('secondary', 'lg')} no-print`}>
          Back to pack and dispatch
        </Link>
        {binsError && <p className="self-center text-cast">Bins could not be loaded: {binsError}</p>}
      </div>

      <header className="flex flex-wrap items-start justify-between gap-4 border-b-4 border-ink pb-4">
        <div>
          <p className="text-2xl font-bold">{DISTRIBUTOR.name}</p>
          <p>{DISTRIBUTOR.address}</p>
        </div>
        <div className="text-right">
          <h1 id="slip-heading" className="text-3xl font-bold">
            Packing slip
          </h1>
          <p className="part-no text-2xl">{order.number}</p>
          <p>Ordered {formatDate(order.createdAt)}</p>
          {order.purchaseOrder && <p>Your order: {order.purchaseOrder}</p>}
        </div>
      </header>

      <section aria-labelledby="slip-deliver" className="grid gap-4 sm:grid-cols-2 print:grid-cols-2">
        <div>
          <h2 id="slip-deliver" className="text-sm font-semibold uppercase tracking-wider text-cast">
            Deliver to
          </h2>
          <address className="text-lg not-italic">
            {order.dealer && <span className="block font-semibold">{order.dealer.companyName}</span>}
            {order.delivery.name !== order.dealer?.companyName && <span className="block">{order.delivery.name}</span>}
            <span className="block">{order.delivery.line1}</span>
            <span className="block">
              {order.delivery.city} {order.delivery.postcode}
            </span>
          </address>
        </div>
        <div>
          <h2 className="text-sm font-semibold uppercase tracking-wider text-cast">Shipment</h2>
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-lg">
            <dt className="text-cast">Cartons</dt>
            <dd className="tabular">{order.dispatch.cartons ?? '—'}</dd>
            <dt className="text-cast">Carrier</dt>
            <dd>{order.dispatch.carrier ?? 'not dispatched yet'}</dd>
            <dt className="text-cast">Tracking</dt>
            <dd className="part-no">{order.dispatch.trackingNumber ?? '—'}</dd>
          </dl>
        </div>
      </section>

      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Parts in this parcel</caption>
        <thead>
          <tr className="border-b-2 border-ink">
            <th scope="col" className="py-2 pr-3">Bin</th>
            <th scope="col" className="py-2 pr-3">Part number</th>
            <th scope="col" className="py-2 pr-3">Title</th>
            <th scope="col" className="py-2 pr-3 text-right">Quantity</th>
            <th scope="col" className="py-2 pr-3 text-right">Back-ordered</th>
            <th scope="col" className="py-2 text-right">In this parcel</th>
          </tr>
        </thead>
        <tbody>
          {order.lines.map((l) => (
            <tr key={l.id} className="border-b border-cast-line break-inside-avoid">
              <td className="part-no py-2 pr-3">{binFor(l.id) ?? '—'}</td>
              <td className="part-no py-2 pr-3 text-lg">{l.partNumber}</td>
              <td className="py-2 pr-3">
                {l.title}
                <OrientationNote orientation={l.orientation} className="text-base font-semibold" />
                {l.fitmentSummary && <span className="block text-sm text-cast">For: {l.fitmentSummary}</span>}
                {l.serials.length > 0 && (
                  <span className="block text-sm">
                    {l.serials.length === 1 ? 'Serial' : 'Serials'}: <span className="part-no">{l.serials.join(', ')}</span>
                  </span>
                )}
              </td>
              <td className="tabular py-2 pr-3 text-right">{l.quantity}</td>
              <td className="tabular py-2 pr-3 text-right">{l.quantityBackordered > 0 ? l.quantityBackordered : '—'}</td>
              <td className="tabular py-2 text-right text-lg font-semibold">{l.quantity - l.quantityBackordered}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {backordered.length > 0 && (
        <p className="text-lg">
          <span className="font-semibold">Back-ordered:</span> {backordered.map((l) => `${l.quantityBackordered} × ${l.partNumber}`).join(', ')} will follow when
          stock arrives; we will e-mail you when it ships.
        </p>
      )}

      <aside aria-label="Handling and fitting" className="flex gap-3 rounded-md border-2 border-amber-line bg-amber-tint p-4 print:border-ink print:bg-white">
        <TriangleAlert aria-hidden className="mt-0.5 size-6 shrink-0 text-amber print:text-ink" />
        <div>
          <p className="font-semibold">Handling and fitting</p>
          <p>
            A turbocharger runs very hot: let the engine cool before touching any part near it. Prime the oil supply before the first start, so the
            bearings never turn dry. Have the turbocharger fitted by a licensed mechanic, and follow your local codes.
          </p>
        </div>
      </aside>

      <footer className="border-t border-cast-line pt-3 text-sm text-cast">
        {DISTRIBUTOR.name} · {DISTRIBUTOR.address} · Questions about this parcel: quote {order.number}.
      </footer>
    </article>
  );
}
