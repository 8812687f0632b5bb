import { flexRender, type Header } from '@tanstack/react-table';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';

interface SortableColumnHeaderProps<T> {
  header: Header<T, unknown>;
  /** `floor`: tighter cells with 48 px sort buttons, and on numeric columns the arrow before the heading so the words line up right. */
  variant?: 'desk' | 'floor';
  /** Mark sortable columns that are not sorted with aria-sort="none" rather than leaving the attribute off. */
  unsortedAsNone?: boolean;
}

/** A column heading of a TanStack table (`meta.numeric` right-aligns it): a sort button with an arrow where the column sorts. */
export function SortableColumnHeader<T>({ header, variant = 'desk', unsortedAsNone = false }: SortableColumnHeaderProps<T>) {
  const numeric = (header.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
  const sorted = header.column.getIsSorted();
  const canSort = header.column.getCanSort();
  const floor = variant === 'floor';
  const icon = floor ? 'size-4 shrink-0' : 'size-4';
  const label = flexRender(header.column.columnDef.header, header.getContext());
  return (
    <th
      scope="col"
      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : unsortedAsNone && canSort ? 'none' : undefined}
      className={`whitespace-nowrap border-b border-cast-line ${floor ? 'px-2 py-1' : 'px-3 py-2'} font-semibold ${numeric ? 'text-right' : ''}`}
    >
      {canSort ? (
        <button
          type="button"
          onClick={header.column.getToggleSortingHandler()}
          className={floor ? `inline-flex min-h-12 items-center gap-1 font-semibold hover:text-temper ${numeric ? 'flex-row-reverse' : ''}` : 'inline-flex min-h-9 items-center gap-1 hover:text-temper'}
        >
          {label}
          {sorted === 'asc' ? <ArrowUp aria-hidden className={icon} /> : sorted === 'desc' ? <ArrowDown aria-hidden className={icon} /> : <ArrowUpDown aria-hidden className={`${icon} text-cast`} />}
        </button>
      ) : (
        label
      )}
    </th>
  );
}
