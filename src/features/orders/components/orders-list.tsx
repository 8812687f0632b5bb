import { Clock } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useOrders } from '../../../lib/orders';
import { formatDate } from '../../../../shared/format';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableFrame, Td, Th } from '../../../components/ui/table';
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
  return (
    <div className="grid min-w-0 gap-2">
      <p className="text-sm text-cast">
        <span className="tabular">{items.length}</span> {items.length === 1 ? 'order' : 'orders'}, newest first
      </p>
      <TableFrame maxHeight="max-h-[70vh]">
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Your orders</caption>
          <thead className="sticky top-0 z-10 bg-panel text-sm">
            <tr>
              <Th>Order</Th>
              <Th>Date</Th>
              <Th>Status</Th>
              {trade && <Th>Purchase order</Th>}
              <Th numeric>Lines</Th>
              <Th numeric>Total</Th>
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            </tr>
          </thead>
          <tbody>
            {items.map((o) => (
              <tr key={o.number} className="border-t border-cast-line align-top first:border-t-0">
                <Td>
                  <Link to={`/orders/${encodeURIComponent(o.number)}`} className="part-no text-temper underline">
                    {o.number}
                  </Link>
                </Td>
                <Td className="tabular whitespace-nowrap">
                  <time dateTime={o.createdAt}>{formatDate(o.createdAt)}</time>
                </Td>
                <Td>
                  <div className="grid justify-items-start gap-1">
                    <StatusBadge kind="order" status={o.status} />
                    {o.hasBackorder && o.status !== 'back_ordered' && (
                      <span className="inline-flex items-center gap-1 text-sm text-amber">
                        <Clock aria-hidden className="size-4" /> part back-ordered
                      </span>
                    )}
                  </div>
                </Td>
                {trade && <Td className="part-no">{o.purchaseOrder ?? '—'}</Td>}
                <Td numeric>{o.lineCount}</Td>
                <Td numeric className="font-semibold">
                  {formatPrice(o.totalCents)}
                </Td>
                <Td>{o.status !== 'pending_payment' && <ReorderButton number={o.number} onAdded={onReorderAdded} compact />}</Td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableFrame>
    </div>
  );
}
