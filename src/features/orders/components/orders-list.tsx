import { Clock } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useOrders } from '../../../lib/orders';
import { formatDate } from '../../../../shared/format';
import { StatusBadge } from '../../../components/ui/status-badge';
import { ReorderButton } from './reorder-button';

export function OrdersList({ onReorderAdded, trade }: { onReorderAdded: () => void; trade: boolean }) {
  const orders = useOrders();
  if (orders.isPending) return <LoadingState label="Loading your orders…" />;
  if (orders.isError) {
    if (orders.error instanceof ApiError && orders.error.isUnauthorized) {
      return (
        <p className="py-4">
          <Link to="/sign-in?next=/orders" className="font-semibold text-temper underline">
            Sign in
          </Link>{' '}
          to see your orders.
        </p>
      );
    }
    return <ErrorState title="Your orders did not load" message={orders.error.message} onRetry={() => orders.refetch()} />;
  }
  const items = orders.data.items;
  if (items.length === 0) {
    return (
      <EmptyState title="No orders yet">
        <p>
          Orders you place appear here with their progress.{' '}
          <Link to="/catalogue" className="font-semibold text-temper underline">
            Browse the catalogue
          </Link>
          .
        </p>
      </EmptyState>
    );
  }
  const th = 'sticky top-0 bg-paper px-3 py-2 text-left font-semibold';
  return (
    <div className="grid min-w-0 gap-2">
      <p className="text-sm text-cast">
        <span className="tabular">{items.length}</span> {items.length === 1 ? 'order' : 'orders'}, newest first
      </p>
      <div className="min-w-0 overflow-x-auto">
        <table className="w-full border-collapse">
          <caption className="sr-only">Your orders</caption>
          <thead className="border-b-2 border-ink text-sm">
            <tr>
              <th scope="col" className={th}>
                Order
              </th>
              <th scope="col" className={th}>
                Date
              </th>
              <th scope="col" className={th}>
                Status
              </th>
              {trade && (
                <th scope="col" className={th}>
                  Purchase order
                </th>
              )}
              <th scope="col" className={`${th} text-right`}>
                Lines
              </th>
              <th scope="col" className={`${th} text-right`}>
                Total
              </th>
              <th scope="col" className={th}>
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {items.map((o) => (
              <tr key={o.number} className="border-b border-cast-line align-top">
                <td className="px-3 py-3">
                  <Link to={`/orders/${encodeURIComponent(o.number)}`} className="part-no text-temper underline">
                    {o.number}
                  </Link>
                </td>
                <td className="tabular whitespace-nowrap px-3 py-3">
                  <time dateTime={o.createdAt}>{formatDate(o.createdAt)}</time>
                </td>
                <td className="px-3 py-3">
                  <div className="grid justify-items-start gap-1">
                    <StatusBadge kind="order" status={o.status} />
                    {o.hasBackorder && o.status !== 'back_ordered' && (
                      <span className="inline-flex items-center gap-1 text-sm text-amber">
                        <Clock aria-hidden className="size-4" /> part back-ordered
                      </span>
                    )}
                  </div>
                </td>
                {trade && <td className="part-no px-3 py-3">{o.purchaseOrder ?? '—'}</td>}
                <td className="tabular px-3 py-3 text-right">{o.lineCount}</td>
                <td className="tabular px-3 py-3 text-right font-semibold">{formatPrice(o.totalCents)}</td>
                <td className="px-3 py-2">{o.status !== 'pending_payment' && <ReorderButton number={o.number} onAdded={onReorderAdded} compact />}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
