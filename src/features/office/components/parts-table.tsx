import { createColumnHelper, getCoreRowModel, useReactTable, type SortingState } from '@tanstack/react-table';
import { Plus } from 'lucide-react';
import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { categoryLabel, formatPrice } from '../../../../shared/catalog';
import type { PartSummary } from '../../../../shared/schemas/parts';
import { buttonClass } from '../../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { OFFICE_PAGE_SIZE, useOfficeParts, type OfficeSort } from '../api/search-parts';
import { DataTable } from '../../../components/ui/table';

const column = createColumnHelper<PartSummary>();

const STATUS_WORD: Record<PartSummary['status'], string> = { active: 'Active', superseded: 'Superseded', discontinued: 'Discontinued' };

const columns = [
  column.accessor('partNumber', {
    header: 'Part number',
    cell: (c) => (
      <Link to={`/office/parts/${encodeURIComponent(c.getValue())}`} className="part-no text-temper underline underline-offset-2 hover:text-temper-deep">
        {c.getValue()}
      </Link>
    ),
  }),
  column.accessor('title', { header: 'Title', cell: (c) => <span className="block min-w-48">{c.getValue()}</span> }),
  column.accessor('category', { header: 'Category', enableSorting: false, cell: (c) => categoryLabel(c.getValue()) }),
  column.accessor('status', {
    header: 'Status',
    enableSorting: false,
    cell: (c) => (
      <span className={c.getValue() === 'active' ? '' : 'font-semibold text-amber'}>
        {c.getValue() === 'active' ? '● ' : '◐ '}
        {STATUS_WORD[c.getValue()]}
        {c.row.original.supersededBy ? ` by ${c.row.original.supersededBy}` : ''}
      </span>
    ),
  }),
  column.accessor('priceCents', {
    header: 'Price',
    meta: { numeric: true },
    cell: (c) => (
      <span className="tabular">
        {formatPrice(c.getValue())}
        {c.row.original.coreDepositCents > 0 && <span className="block text-sm text-cast">+ {formatPrice(c.row.original.coreDepositCents)} core</span>}
      </span>
    ),
  }),
  column.accessor((p) => p.stock.available, { id: 'available', header: 'Available', enableSorting: false, meta: { numeric: true }, cell: (c) => <span className="tabular">{c.getValue()}</span> }),
  column.display({
    id: 'actions',
    header: () => <span className="sr-only">Actions</span>,
    cell: (c) => (
      <span className="flex justify-end gap-3 whitespace-nowrap">
        <Link to={`/office/parts/${encodeURIComponent(c.row.original.partNumber)}`} className="font-semibold text-temper underline underline-offset-2">
          Edit<span className="sr-only"> {c.row.original.partNumber}</span>
        </Link>
        <Link to={`/parts/${encodeURIComponent(c.row.original.partNumber)}`} className="text-temper underline underline-offset-2">
          View<span className="sr-only"> {c.row.original.partNumber} as buyers see it</span>
        </Link>
      </span>
    ),
  }),
];

/** Table sorting maps onto the search's own sort, so a sort covers every match, not just the page on screen. */
function toServerSort(sorting: SortingState): OfficeSort {
  const s = sorting[0];
  if (!s) return 'relevance';
  if (s.id === 'partNumber') return 'number';
  if (s.id === 'title') return 'title';
  if (s.id === 'priceCents') return s.desc ? 'price-desc' : 'price-asc';
  return 'relevance';
}

export function PartsTable({ q, onSearch }: { q: string; onSearch: (q: string) => void }) {
  const [sorting, setSorting] = useState<SortingState>([{ id: 'partNumber', desc: false }]);
  const [page, setPage] = useState(1);
  const [draft, setDraft] = useState(q);
  const sort = toServerSort(sorting);
  const parts = useOfficeParts(q, sort, page);
  const data = parts.data;
  const table = useReactTable({
    data: data?.items ?? [],
    columns,
    state: { sorting },
    manualSorting: true,
    enableSortingRemoval: true,
    // Titles and numbers only sort one way on the server.
    isMultiSortEvent: () => false,
    onSortingChange: (updater) => {
      setSorting((old) => {
        const next = typeof updater === 'function' ? updater(old) : updater;
        const first = next[0];
        return first && (first.id === 'partNumber' || first.id === 'title') ? [{ id: first.id, desc: false }] : next;
      });
      setPage(1);
    },
    getCoreRowModel: getCoreRowModel(),
  });
  const pageCount = data ? Math.max(1, Math.ceil(data.total / OFFICE_PAGE_SIZE)) : 1;

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setPage(1);
    onSearch(draft.trim());
  };

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <form role="search" aria-label="Search parts" onSubmit={submit} className="flex w-full max-w-lg items-end gap-2">
          <div className="grid flex-1 gap-1">
            <label htmlFor="office-part-search" className="font-semibold">
              Find a part
            </label>
            <input
              id="office-part-search"
              type="search"
              value={draft}
              onChange={(e) => setDraft(e.target.value)}
              placeholder="part number or words"
              maxLength={100}
              autoComplete="off"
              className="min-h-11 w-full rounded-md border border-cast-line bg-white px-3 focus:border-temper"
            />
          </div>
          <button type="submit" className={buttonClass('secondary')}>
            Search
          </button>
        </form>
        <Link to="/office/parts/new" className={buttonClass('primary')}>
          <Plus aria-hidden className="size-4" /> New part
        </Link>
      </div>

      {parts.isPending ? (
        <LoadingState label="Loading parts…" />
      ) : parts.isError ? (
        <ErrorState title="The parts did not load" message={parts.error.message} onRetry={() => parts.refetch()} />
      ) : data && data.items.length === 0 ? (
        <EmptyState title={q ? `No parts match “${q}”` : 'The catalogue is empty'}>
          <p>{q ? 'Check the number or try fewer words.' : 'Create the first part.'}</p>
        </EmptyState>
      ) : (
        data && (
          <>
            <p className="text-cast" aria-live="polite">
              <span className="tabular">
                {(page - 1) * OFFICE_PAGE_SIZE + 1}–{Math.min(page * OFFICE_PAGE_SIZE, data.total)} of {data.total.toLocaleString('en-US')}
              </span>{' '}
              {data.total === 1 ? 'part' : 'parts'}
              {q ? ` matching “${q}”` : ''}
              {parts.isFetching ? ' · updating…' : ''}
            </p>
            <DataTable table={table} caption="Parts, sortable by part number, title and price" maxHeight="max-h-[70vh]" unsortedAsNone rowClassName={() => 'hover:bg-paper'} />
            {pageCount > 1 && (
              <nav aria-label="Pages" className="flex items-center gap-3">
                <button type="button" disabled={page <= 1} onClick={() => setPage(page - 1)} className={`${buttonClass('secondary')} disabled:opacity-50`}>
                  Previous
                </button>
                <span className="tabular">
                  Page {page} of {pageCount}
                </span>
                <button type="button" disabled={page >= pageCount} onClick={() => setPage(page + 1)} className={`${buttonClass('secondary')} disabled:opacity-50`}>
                  Next
                </button>
              </nav>
            )}
          </>
        )
      )}
    </div>
  );
}
