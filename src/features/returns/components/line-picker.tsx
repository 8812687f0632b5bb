import { ChevronRight } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { formatDate } from '../../../../shared/format';
import { buttonClass } from '../../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { StatusBadge } from '../../../components/ui/status-badge';
import { useOrder, useOrders } from '../../../lib/orders';

function OrderLines({ number }: { number: string }) {
  const order = useOrder(number);
  if (order.isPending) return <LoadingState label={`Loading ${number}…`} />;
  if (order.isError) return <ErrorState title={`${number} did not load`} message={order.error.message} onRetry={() => order.refetch()} />;
  return (
    <ul aria-label={`Lines of ${number}`} className="grid gap-2">
      {order.data.lines.map((line) => {
        const left = line.quantityReturnable;
        return (
          <li key={line.id} className="flex flex-wrap items-center justify-between gap-3 rounded-md border border-cast-line bg-white p-3">
            <div className="min-w-0">
              <p>
                <span className="part-no">{line.partNumber}</span> {line.title}
              </p>
              <p className="text-sm text-cast">
                <span className="tabular">{line.quantityDispatched}</span> of <span className="tabular">{line.quantity}</span> dispatched · <span className="tabular">{formatPrice(line.unitPriceCents)}</span> each
                {line.condition === 'exchange' ? ' · exchange unit' : ''}
              </p>
            </div>
            {left > 0 ? (
              <Link to={`/returns/new?order=${encodeURIComponent(number)}&line=${line.id}`} className={buttonClass('secondary')}>
                Return this<span className="sr-only"> {line.partNumber}</span>
                <ChevronRight aria-hidden className="size-4" />
              </Link>
            ) : (
              <span className="text-sm text-cast">{line.quantityDispatched === 0 ? 'Not dispatched yet' : 'Already on a return'}</span>
            )}
          </li>
        );
      })}
    </ul>
  );
}

/** Choose a dispatched order, then the line to send back. */
export function LinePicker() {
  const orders = useOrders();
  const [chosen, setChosen] = useState<string | null>(null);
  if (orders.isPending) return <LoadingState label="Loading your orders…" />;
  if (orders.isError) return <ErrorState title="Your orders did not load" message={orders.error.message} onRetry={() => orders.refetch()} />;
  // Anything that has left the warehouse can come back, a partly shipped order's dispatched lines included.
  const dispatched = orders.data.items.filter((o) => o.unitsDispatched > 0);
  if (dispatched.length === 0) {
    return (
      <EmptyState title="Nothing to return yet">
        <p>Only parts that have been dispatched to you can come back. Orders still being picked or packed can be changed by calling the trade counter.</p>
        <p className="mt-2">
          <Link to="/orders" className="font-semibold text-temper underline underline-offset-2">
            See your orders
          </Link>
        </p>
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-4 md:grid-cols-[18rem_1fr]">
      <fieldset className="grid content-start gap-2">
        <legend className="mb-1 font-semibold">Dispatched orders</legend>
        {dispatched.map((o) => (
          <label
            key={o.number}
            className={`flex min-h-12 cursor-pointer items-center gap-3 rounded-md border bg-white px-3 py-2 ${chosen === o.number ? 'border-2 border-temper' : 'border-cast-line'}`}
          >
            <input type="radio" name="return-order" value={o.number} checked={chosen === o.number} onChange={() => setChosen(o.number)} className="accent-temper" />
            <span className="grid">
              <span className="part-no">{o.number}</span>
              <span className="text-sm text-cast">
                <time dateTime={o.createdAt}>{formatDate(o.createdAt)}</time> · <StatusBadge kind="order" status={o.status} look="plain" /> · {o.lineCount}{' '}
                {o.lineCount === 1 ? 'line' : 'lines'}
              </span>
            </span>
          </label>
        ))}
      </fieldset>
      <div aria-live="polite">{chosen ? <OrderLines number={chosen} /> : <p className="rounded-md border border-dashed border-cast-line p-4 text-cast">Choose an order to see its lines.</p>}</div>
    </div>
  );
}
