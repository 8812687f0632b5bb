import { ChevronLeft, ChevronRight } from 'lucide-react';
import { buttonClass } from './button';

/** Previous / next through a server-paged list, with where the reader is and how many there are. */
export function PageNav({ page, pageSize, total, onPage, label, size = 'md' }: { page: number; pageSize: number; total: number; onPage: (page: number) => void; label: string; size?: 'md' | 'lg' }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  if (pages <= 1) return null;
  const first = (page - 1) * pageSize + 1;
  const last = Math.min(total, page * pageSize);
  return (
    <nav aria-label={label} className="flex flex-wrap items-center gap-3">
      <button type="button" className={buttonClass('secondary', size)} disabled={page <= 1} onClick={() => onPage(page - 1)}>
        <ChevronLeft aria-hidden className="size-4" /> Previous
      </button>
      <p className="tabular" aria-live="polite">
        {first}–{last} of {total} · page {page} of {pages}
      </p>
      <button type="button" className={buttonClass('secondary', size)} disabled={page >= pages} onClick={() => onPage(page + 1)}>
        Next <ChevronRight aria-hidden className="size-4" />
      </button>
    </nav>
  );
}
