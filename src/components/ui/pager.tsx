import { buttonClass } from './button';

/**
 * Previous and next for a list the server sends a page at a time, with where the reader is: "Page 2 of 7". Nothing
 * when everything fits on one page. `size="lg"` gives the floor's 48 px targets.
 */
export function Pager({ page, pageSize, total, onPage, size = 'md', label = 'Pages' }: { page: number; pageSize: number; total: number; onPage: (page: number) => void; size?: 'md' | 'lg'; label?: string }) {
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  if (pageCount <= 1) return null;
  return (
    <nav aria-label={label} className="flex flex-wrap items-center gap-3">
      <button type="button" disabled={page <= 1} onClick={() => onPage(page - 1)} className={`${buttonClass('secondary', size)} disabled:opacity-50`}>
        Previous
      </button>
      <span className="tabular">
        Page {page} of {pageCount}
      </span>
      <button type="button" disabled={page >= pageCount} onClick={() => onPage(page + 1)} className={`${buttonClass('secondary', size)} disabled:opacity-50`}>
        Next
      </button>
    </nav>
  );
}

/** "26–50 of 112": the rows on this page of a list the server pages. */
export function pageSpan(page: number, pageSize: number, total: number): string {
  if (total === 0) return '0';
  return `${((page - 1) * pageSize + 1).toLocaleString('en-US')}–${Math.min(page * pageSize, total).toLocaleString('en-US')} of ${total.toLocaleString('en-US')}`;
}
