import {
  createColumnHelper,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type FilterFn,
  type RowSelectionState,
  type SortingState,
} from '@tanstack/react-table';
import { CreditCard, Layers, Landmark, RefreshCw } from 'lucide-react';
import { useMemo, useRef, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import type { z } from 'zod';
import type { PickQueueItemSchema } from '../../../../shared/schemas/warehouse';
import { Button, buttonClass } from '../../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { usePickQueue } from '../api/get-pick-queue';
import { orderAge } from '../lib/age';
import { StatusBadge } from '../../../components/ui/status-badge';
import { QUEUE_STATE_LABELS, queueState, type QueueState } from './queue-state';
import { DataTable } from '../../../components/ui/table';

type QueueItem = z.infer<typeof PickQueueItemSchema>;

/** Where "open" takes an order: picking while there is something to pick, else packing and dispatch. */
export const openHref = (item: QueueItem) =>
  item.ready === 'pick' ? `/floor/pick?orders=${encodeURIComponent(item.number)}` : `/floor/orders/${encodeURIComponent(item.number)}/pack`;

const column = createColumnHelper<QueueItem>();

const equalsFilter: FilterFn<QueueItem> = (row, id, value) => !value || row.getValue(id) === value;

const paymentLabel = (m: QueueItem['paymentMethod']) => (m === 'card' ? 'Card paid' : 'On account');

export function PickQueue() {
  const queue = usePickQueue();
  if (queue.isPending) return <LoadingState label="Loading the pick queue…" />;
  if (queue.error) return <ErrorState title="The pick queue did not load" message={queue.error.message} onRetry={() => void queue.refetch()} />;
  return <QueueTable items={queue.data.items} refreshing={queue.isFetching} onRefresh={() => void queue.refetch()} />;
}

function QueueTable({ items, refreshing, onRefresh }: { items: QueueItem[]; refreshing: boolean; onRefresh: () => void }) {
  const navigate = useNavigate();
  const filterRef = useRef<HTMLInputElement>(null);
  const [sorting, setSorting] = useState<SortingState>([{ id: 'age', desc: true }]);
  const [globalFilter, setGlobalFilter] = useState('');
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const [rowSelection, setRowSelection] = useState<RowSelectionState>({});
  const now = Date.now();

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
        filterFn: equalsFilter,
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
        filterFn: equalsFilter,
        sortingFn: (a, b) => stateOrder.indexOf(a.getValue('state')) - stateOrder.indexOf(b.getValue('state')),
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

  const table = useReactTable({
    data: items,
    columns,
    state: { sorting, globalFilter, columnFilters, rowSelection },
    getRowId: (r) => r.number,
    enableRowSelection: (row) => row.original.ready === 'pick',
    onSortingChange: setSorting,
    onGlobalFilterChange: setGlobalFilter,
    onColumnFiltersChange: setColumnFilters,
    onRowSelectionChange: setRowSelection,
    globalFilterFn: (row, _id, value: string) => {
      const q = value.trim().toLowerCase();
      return !q || row.original.number.toLowerCase().includes(q) || row.original.customer.toLowerCase().includes(q);
    },
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const rows = table.getRowModel().rows;
  const selected = table.getSelectedRowModel().rows.map((r) => r.original.number);
  const stateFilter = (columnFilters.find((f) => f.id === 'state')?.value as string | undefined) ?? '';
  const paymentFilter = (columnFilters.find((f) => f.id === 'paymentMethod')?.value as string | undefined) ?? '';
  const setFilter = (id: string, value: string) => setColumnFilters((fs) => [...fs.filter((f) => f.id !== id), ...(value ? [{ id, value }] : [])]);

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
            value={globalFilter}
            onChange={(e) => setGlobalFilter(e.target.value)}
            placeholder="SY-… or name"
            autoComplete="off"
            className="min-h-12 w-64 rounded-md border border-cast-line bg-white px-3 text-lg"
          />
        </div>
        <div className="grid gap-1">
          <label htmlFor="queue-state" className="font-semibold">
            State
          </label>
          <select id="queue-state" value={stateFilter} onChange={(e) => setFilter('state', e.target.value)} className="min-h-12 rounded-md border border-cast-line bg-white px-3 text-lg">
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
            onChange={(e) => setFilter('paymentMethod', e.target.value)}
            className="min-h-12 rounded-md border border-cast-line bg-white px-3 text-lg"
          >
            <option value="">Card and account</option>
            <option value="card">Card paid</option>
            <option value="account">On account</option>
          </select>
        </div>
        <Button variant="quiet" size="lg" onClick={onRefresh} disabled={refreshing}>
          <RefreshCw aria-hidden className={`size-5 ${refreshing ? 'animate-spin' : ''}`} />
          {refreshing ? 'Refreshing…' : 'Refresh'}
        </Button>
      </div>

      <div className="flex flex-wrap items-center justify-between gap-3 rounded-md bg-panel px-3 py-2" aria-live="polite">
        <p className="text-lg">
          <span className="tabular font-semibold">{rows.length}</span> of <span className="tabular">{items.length}</span> orders
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

      {items.length === 0 ? (
        <EmptyState title="Nothing to pick">New card-paid and on-account orders appear here, oldest first, along with back-orders whose stock has arrived.</EmptyState>
      ) : rows.length === 0 ? (
        <EmptyState title="No order matches these filters">Clear the filter or choose “All states”.</EmptyState>
      ) : (
        <DataTable
          table={table}
          caption="Pick queue, oldest first. Column headers sort. Units are still to pick."
          density="floor"
          maxHeight="max-h-[70vh]"
          rowClassName={(row) => (row.getIsSelected() ? 'bg-temper-tint/60' : '')}
        />
      )}
    </div>
  );
}

const stateOrder: QueueState[] = ['pick', 'released', 'pack', 'dispatch'];
