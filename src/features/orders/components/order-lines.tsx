import { Clock, Gauge, Truck } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { DELIVERY_ZONES, type DeliveryZone } from '../../../../shared/pricing';
import type { OrderDetail } from '../../../../shared/schemas/orders';
import { useFocusableWhenScrolling } from '../../../components/ui/scroll-focus';
import { OrientationNote } from '../../../components/ui/orientation-note';

export function zoneLabel(zone: string) {
  return DELIVERY_ZONES[zone as DeliveryZone] ?? zone;
}

/** The order's lines as sold: prices are the ones stored on the order, not today's. */
export function OrderLinesTable({ order, print = false, lineAction }: { order: OrderDetail; print?: boolean; /** A last column of per-line actions (not on paper). */ lineAction?: (line: OrderDetail['lines'][number]) => ReactNode }) {
  const th = 'px-2 py-2 font-semibold';
  const scrollRef = useFocusableWhenScrolling<HTMLDivElement>();
  return (
    <div ref={print ? undefined : scrollRef} className={print ? '' : 'overflow-x-auto focus-visible:outline-3 focus-visible:outline-temper'}>
      <table className={`w-full border-collapse text-left ${print ? '' : 'min-w-[34rem]'}`}>
        <caption className="sr-only">Lines of order {order.number}</caption>
        <thead className="border-b-2 border-ink text-sm">
          <tr>
            <th scope="col" className={th}>
              Part
            </th>
            <th scope="col" className={`${th} text-right`}>
              Qty
            </th>
            <th scope="col" className={`${th} text-right`}>
              Unit price
            </th>
            <th scope="col" className={`${th} text-right`}>
              Core deposit
            </th>
            <th scope="col" className={`${th} text-right`}>
              Line total
            </th>
            {lineAction && !print && (
              <th scope="col" className={`${th} hidden sm:table-cell`}>
                <span className="sr-only">Actions</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {order.lines.map((l) => (
            <tr key={l.id} className="border-b border-cast-line align-top">
              <td className="px-2 py-2">
                <span className="part-no">{l.partNumber}</span>
                <span className="block">{l.title}</span>
                <OrientationNote orientation={l.orientation} className="mt-0.5 text-sm" />
                {l.fitmentSummary && (
                  <span className="mt-0.5 flex items-start gap-1 text-sm text-cast">
                    <Gauge aria-hidden className="mt-0.5 size-4 shrink-0 print:hidden" />
                    Chosen for: {l.fitmentSummary}
                  </span>
                )}
                {l.serials.length > 0 && (
                  <span className="mt-0.5 block text-sm">
                    <span className="text-cast">{l.serials.length === 1 ? 'Serial' : 'Serials'}: </span>
                    {l.serials.map((serial, i) => (
                      <span key={serial}>
                        {i > 0 && ', '}
                        {print ? (
                          <span className="part-no">{serial}</span>
                        ) : (
                          <Link to={`/units/${encodeURIComponent(serial)}`} className="part-no text-temper underline underline-offset-2">
                            {serial}
                          </Link>
                        )}
                      </span>
                    ))}
                  </span>
                )}
                {l.quantityBackordered > 0 && (
                  <span className="mt-0.5 flex items-center gap-1 text-sm font-semibold text-amber">
                    <Clock aria-hidden className="size-4" />
                    <span className="tabular">
                      {l.quantity - l.quantityBackordered} reserved · {l.quantityBackordered} on back-order, awaiting stock
                    </span>
                  </span>
                )}
                {!print && l.quantityDispatched > 0 && l.quantityDispatched < l.quantity && (
                  <span className="mt-0.5 flex items-center gap-1 text-sm text-cast">
                    <Truck aria-hidden className="size-4" />
                    <span className="tabular">
                      {l.quantityDispatched} of {l.quantity} dispatched
                    </span>
                  </span>
                )}
                {/* On a phone the table scrolls sideways: the action sits under the part, where it is seen. */}
                {lineAction && !print && <span className="mt-2 block sm:hidden">{lineAction(l)}</span>}
              </td>
              <td className="tabular px-2 py-2 text-right">{l.quantity}</td>
              <td className="tabular px-2 py-2 text-right">{formatPrice(l.unitPriceCents)}</td>
              <td className="tabular px-2 py-2 text-right">{l.coreDepositCents > 0 ? `${formatPrice(l.coreDepositCents * l.quantity)}` : '—'}</td>
              <td className="tabular px-2 py-2 text-right font-semibold">{formatPrice(l.lineCents)}</td>
              {lineAction && !print && <td className="hidden px-2 py-2 text-right sm:table-cell">{lineAction(l)}</td>}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export function OrderTotals({ order }: { order: OrderDetail }) {
  const t = order.totals;
  const row = 'flex items-baseline justify-between gap-6 py-1';
  return (
    <dl className="grid divide-y divide-cast-line/60">
      <div className={row}>
        <dt>Goods</dt>
        <dd className="tabular">{formatPrice(t.goodsCents)}</dd>
      </div>
      {t.discountCents > 0 && (
        <div className={row}>
          <dt>Trade discount (included above)</dt>
          <dd className="tabular">−{formatPrice(t.discountCents)}</dd>
        </div>
      )}
      {t.coreDepositCents > 0 && (
        <div className={row}>
          <dt>Core deposits (refundable)</dt>
          <dd className="tabular">{formatPrice(t.coreDepositCents)}</dd>
        </div>
      )}
      <div className={row}>
        <dt>
          Freight ({zoneLabel(order.delivery.zone)}, <span className="tabular">{(t.weightGrams / 1000).toFixed(1)}</span> kg)
        </dt>
        <dd className="tabular">{formatPrice(t.freightCents)}</dd>
      </div>
      <div className={row}>
        <dt>Tax</dt>
        <dd className="tabular">{formatPrice(t.taxCents)}</dd>
      </div>
      <div className={`${row} pt-2 text-xl font-bold`}>
        <dt>Total</dt>
        <dd className="tabular">{formatPrice(t.totalCents)}</dd>
      </div>
      {t.refundedCents > 0 && (
        <div className={row}>
          <dt>Refunded</dt>
          <dd className="tabular">−{formatPrice(t.refundedCents)}</dd>
        </div>
      )}
    </dl>
  );
}
