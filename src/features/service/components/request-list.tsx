import { Link } from 'react-router-dom';
import { formatDate } from '../../../../shared/format';
import { Pager } from '../../../components/ui/pager';
import { TableFrame, Td, Th } from '../../../components/ui/table';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { useServiceRequests } from '../api/get-requests';
import { ServiceStatusBadge } from './status';

/** The buyer's service requests, newest first, a page at a time. */
export function ServiceRequestList({ page, onPage }: { page: number; onPage: (p: number) => void }) {
  const list = useServiceRequests(page);
  if (list.isPending) return <LoadingState label="Loading your service requests…" />;
  if (list.isError) return <ErrorState title="Your service requests did not load" message={list.error.message} onRetry={() => void list.refetch()} />;
  if (list.data.items.length === 0) {
    return (
      <EmptyState title="No service requests yet">
        <p>Book a unit in and it shows here, from the label you print to the unit coming back rebuilt.</p>
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-3">
      <TableFrame>
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Your service requests, newest first</caption>
          <thead className="bg-panel">
            <tr>
              <Th>Request</Th>
              <Th>Unit</Th>
              <Th className="hidden sm:table-cell">Booked</Th>
              <Th>Where it stands</Th>
            </tr>
          </thead>
          <tbody>
            {list.data.items.map((r) => (
              <tr key={r.reference} className="border-t border-cast-line">
                <Td>
                  <Link to={`/service/${r.reference}`} className="part-no font-semibold text-temper underline underline-offset-2">
                    {r.reference}
                  </Link>
                </Td>
                <Td>
                  <span className="part-no">{r.serial}</span> <span className="text-cast">{r.frameCode}</span>
                  <span className="block text-sm text-cast sm:hidden">booked {formatDate(r.createdAt)}</span>
                </Td>
                <Td className="hidden whitespace-nowrap sm:table-cell">{formatDate(r.createdAt)}</Td>
                <Td>
                  <ServiceStatusBadge status={r.status} />
                </Td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableFrame>
      <Pager label="Pages of service requests" page={list.data.page} pageSize={list.data.pageSize} total={list.data.total} onPage={onPage} />
    </div>
  );
}
