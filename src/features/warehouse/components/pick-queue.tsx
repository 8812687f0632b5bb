import { createColumnHelper, getCoreRowModel, useReactTable, type RowSelectionState } from '@tanstack/react-table';
import { CreditCard, Layers, Landmark, RefreshCw } from 'lucide-react';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { z } from 'zod';
import { PICK_QUEUE_PAGE_SIZE, type PickQueueItemSchema, type PickQueueQuery } from '../../../../shared/schemas/warehouse';
import { Button, buttonClass } from '../../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { usePickQueue } from '../api/get-pick-queue';
import { orderAge } from '../lib/age';
import { StatusBadge } from '../../../components/ui/status-badge';
import { QUEUE_STATE_LABELS, queueState, type QueueState } from './queue-state';
import { DataTable } from '../../../components/ui/table';
import { Pager, pageSpan } from '../../../components/ui/pager';

type QueueItem = z.infer<typeof PickQueueItemSchema>;

/** Where "open" takes an order: picking while there is something to pick, else packing and dispatch. */
export const openHref = (item: QueueItem) =>
  item.ready === 'pick' ? `/floor/pick?orders=${encodeURIComponent(item.number)}` : `/floor/orders/${encodeURIComponent(item.number)}/pack`;

const column = createColumnHelper<QueueItem>();

const paymentLabel = (m: QueueItem['paymentMethod']) => (m === 'card' ? 'Card paid' : 'On account');

/** What is typed, once typing pauses: the queue is filtered on the server, not on every key. */
function useSettled(value: string, ms: number) {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, ms]);
  return settled;
}

/**
 * The pick queue a page at a time, oldest first. The filters go to the server, so they cover the whole queue and the
 * count is the whole queue's; a batch is ticked on one page (changing page or filter clears the ticks).
 */
export function PickQueue() {
  const navigate = useNavigate();
  const filterRef = useRef<HTMLInputElement>(null);
  const [typed, setTyped] = useState('');
  const text = useSettled(typed.trim(), 250);
  const [stateFilter, setStateFilter] = useState<QueueState | ''>('');
  const [paymentFilter, setPaymentFilter] = useState<QueueItem['paymentMethod'] | ''>('');
  const [page, setPage] = useState(1);
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  const query: PickQueueQuery = { page, pageSize: PICK_QUEUE_PAGE_SIZE, q: text || undefined, state: stateFilter || undefined, payment: paymentFilter || undefined };
  const queue = usePickQueue(query);
  const items = useMemo(() => queue.data?.items ?? [], [queue.data]);
  const filtered = Boolean(text || stateFilter || paymentFilter);
  const now = Date.now();

  // A new search, filter or page starts from its first page (for filters) and with nothing ticked.
  useEffect(() => {
    setPage(1);
  }, [text, stateFilter, paymentFilter]);
  useEffect(() => {
    setRowSelection({});
  }, [text, stateFilter, paymentFilter, page]);

  const columns = useMemo(
    () => [
      column.display({
        id: 'select',
        header: () => <span className="sr-only">Select for a batch pick</span>,
        cell: ({ row }) =>
          row.getCanSelect() ? (
            <label className="flex min-h-12 min-w-12 cursor-pointer items-center justify-center">
              <input
                type="checkbox"
                checked={row.getIsSelected()}
                onChange={row.getToggleSelectedHandler()}
                aria-label={`Select ${row.original.number} for a batch pick`}
                className="size-6 accent-temper"
              />
            </label>
          ) : (
            <span className="sr-only">Not for batch picking</span>
          ),
      }),
      column.accessor('number', {
        header: 'Order',
        cell: (c) => (
          <Link to={openHref(c.row.original)} className="part-no text-lg text-temper underline-offset-2 hover:underline">
            {c.getValue()}
          </Link>
        ),
      }),
      column.accessor('customer', { header: 'Customer', cell: (c) => <span className="font-semibold">{c.getValue()}</span> }),
      // Age sorts by when the order was placed: older is "more" age.
      column.accessor((i) => -Date.parse(i.createdAt), {
        id: 'age',
        header: 'Age',
        cell: (c) => <span className="tabular">{orderAge(c.row.original.createdAt, now)}</span>,
        meta: { numeric: true },
      }),
      column.accessor('lines', { header: 'Lines', cell: (c) => <span className="tabular">{c.getValue()}</span>, meta: { numeric: true } }),
      column.accessor('unitsToPick', { header: 'Units', cell: (c) => <span className="tabular text-lg font-bold">{c.getValue()}</span>, meta: { numeric: true } }),
      column.accessor('paymentMethod', {
        header: 'Payment',
        cell: (c) => (
          <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
            {c.getValue() === 'card' ? <CreditCard aria-hidden className="size-4 text-cast" /> : <Landmark aria-hidden className="size-4 text-cast" />}
            {paymentLabel(c.getValue())}
          </span>
        ),
      }),
      column.accessor((i) => queueState(i), {
        id: 'state',
        header: 'State',
        cell: (c) => <StatusBadge kind="queue" status={c.getValue()} size="md" />,
      }),
      column.display({
        id: 'open',
        header: () => <span className="sr-only">Actions</span>,
        cell: ({ row }) => (
          <Link to={openHref(row.original)} className={`${buttonClass('secondary')} min-h-12 whitespace-nowrap`} aria-label={`Open ${row.original.number}`}>
            {row.original.ready === 'pick' ? 'Pick' : row.original.ready === 'pack' ? 'Pack' : 'Dispatch'}
          </Link>
        ),
      }),
    ],
    [now],
  );

  // The server's order (oldest first) holds across pages, so the headings do not re-sort one page.
  const table = useReactTable({
    data: items,
    columns,
    state: { rowSelection },
    enableSorting: false,
    getRowId: (r) => r.number,
    enableRowSelection: (row) => row.original.ready === 'pick',
    onRowSelectionChange: setRowSelection,
    getCoreRowModel: getCoreRowModel(),
  });

  const selected = table.getSelectedRowModel().rows.map((r) => r.original.number);

  const startBatch = () => {
    // Batch picks walk the bins once for all; keep the queue's oldest-first order in the address.
    const ordered = items.map((i) => i.number).filter((n) => selected.includes(n));
    navigate(`/floor/pick?orders=${ordered.map(encodeURIComponent).join(',')}`);
  };

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <div className="flex flex-wrap items-end gap-4" role="search" aria-label="Filter the pick queue">
        <div className="grid gap-1">
          <label htmlFor="queue-filter" className="font-semibold">
            Order or customer
          </label>
          <input
            ref={filterRef}
            id="queue-filter"
            type="search"
            value={typed}
            onChange={(e) => setTyped(e.target.value)}
            placeholder="SY-… or name"
            autoComplete="off"
            className="min-h-12 w-64 rounded-md border border-cast-line bg-white px-3 text-lg"
          />
        </div>
        <div className="grid gap-1">
          <label htmlFor="queue-state" className="font-semibold">
            State
          </label>
          <select id="queue-state" value={stateFilter} onChange={(e) => setStateFilter(e.target.value as QueueState | '')} className="min-h-12 rounded-md border border-cast-line bg-white px-3 text-lg">
            <option value="">All states</option>
            {stateOrder.map((s) => (
              <option key={s} value={s}>
                {QUEUE_STATE_LABELS[s]}
              </option>
            ))}
          </select>
        </div>
        <div className="grid gap-1">
          <label htmlFor="queue-payment" className="font-semibold">
            Payment
          </label>
          <select
            id="queue-payment"
            value={paymentFilter}
            onChange={(e) => setPaymentFilter(e.target.value as QueueItem['paymentMethod'] | '')}
            className="min-h-12 rounded-md border border-cast-line bg-white px-3 text-lg"
          >
            <option value="">Card and account</option>
            <option value="card">Card paid</option>
            <option value="account">On account</option>
          </select>
        </div>
        <Button variant="quiet" size="lg" onClick={() => void queue.refetch()} disabled={queue.isFetching}>
          <RefreshCw aria-hidden className={`size-5 ${queue.isFetching ? 'animate-spin' : ''}`} />
          {queue.isFetching ? 'Refreshing…' : 'Refresh'}
        </Button>
      </div>

      <div className="flex flex-wrap items-center justify-between gap-3 rounded-md bg-panel px-3 py-2" aria-live="polite">
        <p className="text-lg">
          <span className="tabular font-semibold">{pageSpan(page, PICK_QUEUE_PAGE_SIZE, queue.data?.total ?? 0)}</span> orders{filtered ? ' matching' : ''}
          {selected.length > 0 && (
            <>
              {' '}
              · <span className="tabular font-semibold">{selected.length}</span> selected
            </>
          )}
        </p>
        <Button size="lg" disabled={selected.length === 0} onClick={startBatch}>
          <Layers aria-hidden className="size-5" />
          {selected.length > 1 ? `Batch pick ${selected.length} orders` : selected.length === 1 ? 'Pick the selected order' : 'Tick orders to batch-pick'}
        </Button>
      </div>

      {queue.isPending ? (
        <LoadingState label="Loading the pick queue…" />
      ) : queue.isError ? (
        <ErrorState title="The pick queue did not load" message={queue.error.message} onRetry={() => void queue.refetch()} />
      ) : queue.data.total === 0 && !filtered ? (
        <EmptyState title="Nothing to pick">New card-paid and on-account orders appear here, oldest first, along with back-orders whose stock has arrived.</EmptyState>
      ) : queue.data.total === 0 ? (
        <EmptyState title="No order matches these filters">Clear the search or choose “All states” and “Card and account”.</EmptyState>
      ) : items.length === 0 ? (
        <EmptyState title="No orders on this page">
          The queue is shorter now.{' '}
          <button type="button" onClick={() => setPage(1)} className="font-semibold text-temper underline">
            Back to the first page
          </button>
        </EmptyState>
      ) : (
        <>
          <DataTable
            table={table}
            caption="Pick queue, oldest first. Units are still to pick."
            density="floor"
            maxHeight="max-h-[70vh]"
            rowClassName={(row) => (row.getIsSelected() ? 'bg-temper-tint/60' : '')}
          />
          <Pager page={page} pageSize={PICK_QUEUE_PAGE_SIZE} total={queue.data.total} onPage={setPage} size="lg" label="Pick queue pages" />
        </>
      )}
    </div>
  );
}

const stateOrder: QueueState[] = ['pick', 'released', 'pack', 'dispatch'];
