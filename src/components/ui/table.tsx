import { flexRender, type Row, type Table } from '@tanstack/react-table';
import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';
import { useFocusableWhenScrolling } from './scroll-focus';
import { SortableColumnHeader } from './sort-header';

/**
 * The box every table sits in: it scrolls sideways (and down, with a height) inside itself, so a wide table never
 * makes the page wider than a phone's screen. `min-w-0` lets it shrink inside grid and flex parents.
 */
export function TableFrame({ children, maxHeight, className = '' }: { children: ReactNode; /** e.g. "max-h-[70vh]": the header then sticks while rows scroll. */ maxHeight?: string; className?: string }) {
  const ref = useFocusableWhenScrolling<HTMLDivElement>();
  return (
    <div ref={ref} className={`relative min-w-0 max-w-full overflow-auto rounded-md border border-cast-line bg-white focus-visible:outline-3 focus-visible:outline-temper ${maxHeight ?? ''} ${className}`}>
      {children}
    </div>
  );
}

type Density = 'desk' | 'floor';

const cellPad: Record<Density, string> = { desk: 'px-3 py-2', floor: 'px-2 py-1' };

/** A heading cell: numbers right-aligned, never wrapped. */
export function Th({ numeric, density = 'desk', className = '', ...props }: ThHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean; density?: Density }) {
  return <th scope="col" {...props} className={`whitespace-nowrap border-b border-cast-line font-semibold ${cellPad[density]} ${numeric ? 'text-right' : ''} ${className}`} />;
}

/** A body cell: numbers right-aligned in tabular figures. */
export function Td({ numeric, density = 'desk', className = '', ...props }: TdHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean; density?: Density }) {
  return <td {...props} className={`${cellPad[density]} ${numeric ? 'tabular whitespace-nowrap text-right' : ''} ${className}`} />;
}

const isNumeric = (meta: unknown) => Boolean((meta as { numeric?: boolean } | undefined)?.numeric);

interface DataTableProps<T> {
  table: Table<T>;
  /** Read by screen readers: what the rows are and that the headings sort. */
  caption: string;
  /** `floor`: tighter cells and 48 px sort buttons for the warehouse. */
  density?: Density;
  maxHeight?: string;
  unsortedAsNone?: boolean;
  rowClassName?: (row: Row<T>) => string;
  /** Row actions, in a last column after the data. */
  actions?: { label: string; cell: (row: Row<T>) => ReactNode };
}

/**
 * A TanStack table as the design sets tables: in a frame that scrolls on its own, sticky header, sortable headings
 * (`SortableColumnHeader`), numbers right-aligned (`meta: { numeric: true }`), row actions at the end.
 */
export function DataTable<T>({ table, caption, density = 'desk', maxHeight, unsortedAsNone, rowClassName, actions }: DataTableProps<T>) {
  return (
    <TableFrame maxHeight={maxHeight}>
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">{caption}</caption>
        <thead className="sticky top-0 z-10 bg-panel">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => (
                <SortableColumnHeader key={header.id} header={header} variant={density} unsortedAsNone={unsortedAsNone} />
              ))}
              {actions && (
                <Th density={density}>
                  <span className="sr-only">{actions.label}</span>
                </Th>
              )}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr key={row.id} className={`border-t border-cast-line align-top first:border-t-0 ${rowClassName?.(row) ?? ''}`}>
              {row.getVisibleCells().map((cell) => (
                <Td key={cell.id} density={density} numeric={isNumeric(cell.column.columnDef.meta)}>
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </Td>
              ))}
              {actions && (
                <Td density={density} className="text-right">
                  {actions.cell(row)}
                </Td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </TableFrame>
  );
}
