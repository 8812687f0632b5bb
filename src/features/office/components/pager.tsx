import { Button } from '../../../components/ui/button';

/** "Page 2 of 5 · 213 entries" with previous and next; nothing when everything fits on one page. */
export function Pager({ page, pageSize, total, noun, onPage, place }: { page: number; pageSize: number; total: number; noun: readonly [one: string, many: string]; onPage: (page: number) => void; place?: 'above' | 'below' }) {
  const pages = Math.max(1, Math.ceil(total / pageSize));
  return (
    <nav aria-label={`Pages of ${noun[1]}${place ? `, ${place} the list` : ''}`} className="flex flex-wrap items-center justify-between gap-3">
      <p className="tabular text-cast">
        {total.toLocaleString('en-US')} {total === 1 ? noun[0] : noun[1]}
        {pages > 1 ? ` · page ${page} of ${pages}` : ''}
      </p>
      {pages > 1 && (
        <div className="flex gap-2">
          <Button variant="secondary" disabled={page <= 1} onClick={() => onPage(page - 1)}>
            Previous page
          </Button>
          <Button variant="secondary" disabled={page >= pages} onClick={() => onPage(page + 1)}>
            Next page
          </Button>
        </div>
      )}
    </nav>
  );
}
