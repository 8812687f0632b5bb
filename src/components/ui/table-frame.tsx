import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';
import { useFocusableWhenScrolling } from './scroll-focus';

// Plain table parts, apart from the sortable data table so a page with a simple table loads no table library.

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

export type Density = 'desk' | 'floor';

const cellPad: Record<Density, string> = { desk: 'px-3 py-2', floor: 'px-2 py-1' };

/** A heading cell: numbers right-aligned, never wrapped. */
export function Th({ numeric, density = 'desk', className = '', ...props }: ThHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean; density?: Density }) {
  return <th scope="col" {...props} className={`whitespace-nowrap border-b border-cast-line font-semibold ${cellPad[density]} ${numeric ? 'text-right' : ''} ${className}`} />;
}

/** A body cell: numbers right-aligned in tabular figures. */
export function Td({ numeric, density = 'desk', className = '', ...props }: TdHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean; density?: Density }) {
  return <td {...props} className={`${cellPad[density]} ${numeric ? 'tabular whitespace-nowrap text-right' : ''} ${className}`} />;
}
