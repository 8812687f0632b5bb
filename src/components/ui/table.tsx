import { flexRender, type Row, type Table } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import { SortableColumnHeader } from './sort-header';

import { TableFrame, Td, Th, type Density } from './table-frame';

export { TableFrame, Td, Th };

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
