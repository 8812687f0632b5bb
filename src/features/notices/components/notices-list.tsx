import { BellRing, Check, CheckCheck, ClipboardList, CreditCard, Landmark, PackageCheck, RotateCcw, Truck, Wrench, type LucideIcon } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { NoticeKind } from '../../../../shared/allowed-values';
import { formatDateTime } from '../../../../shared/format';
import { Button } from '../../../components/ui/button';
import { PageNav } from '../../../components/ui/page-nav';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { useNotices } from '../api/get-notices';
import { useMarkRead } from '../api/mark-read';

const ICONS: Record<NoticeKind, LucideIcon> = {
  paid: CreditCard,
  'on-account': Landmark,
  picking: ClipboardList,
  'back-ordered': BellRing,
  dispatched: Truck,
  'return-decided': RotateCcw,
  'service-due': Wrench,
  service: Wrench,
};

/** The buyer's notices, newest first; unread ones carry a marker and the word "New", and open or mark read one by one. */
export function NoticesList({ page, onPage }: { page: number; onPage: (page: number) => void }) {
  const notices = useNotices(page);
  const mark = useMarkRead();
  if (notices.isPending) return <LoadingState label="Loading your notices…" />;
  if (notices.isError) return <ErrorState title="Your notices did not load" message={notices.error.message} onRetry={() => void notices.refetch()} />;
  const { items, unread } = notices.data;
  if (items.length === 0) {
    return (
      <EmptyState title="No notices yet">
        <p>When an order is paid, picked, back-ordered or dispatched, a return is decided, a unit you sent in moves on at the Bench, or a unit is due for service, it shows here as well as in your e-mail.</p>
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-cast" aria-live="polite">
          {unread === 0 ? 'All read.' : `${unread} unread.`}
        </p>
        {unread > 0 && (
          <Button variant="secondary" disabled={mark.isPending} onClick={() => mark.mutate('all')}>
            <CheckCheck aria-hidden className="size-4" /> Mark all read
          </Button>
        )}
      </div>
      {mark.isError && <ErrorState title="That did not go through" message={mark.error.message} />}
      <ul aria-label="Notices" className="grid gap-2">
        {items.map((n) => {
          const Icon = ICONS[n.kind];
          return (
            <li
              key={n.id}
              aria-label={`${n.read ? '' : 'Unread: '}${n.title}`}
              className={`grid grid-cols-[auto_minmax(0,1fr)] gap-3 rounded-lg p-4 sm:grid-cols-[auto_minmax(0,1fr)_auto] ${n.read ? 'bg-white ring-1 ring-cast-line' : 'bg-temper-tint/50 ring-2 ring-temper'}`}
            >
              <Icon aria-hidden className={`mt-0.5 size-6 ${n.read ? 'text-cast' : 'text-temper'}`} />
              <div className="grid min-w-0 gap-1">
                <p className="flex flex-wrap items-center gap-2">
                  {!n.read && <span className="rounded bg-temper px-1.5 text-xs font-bold uppercase tracking-wide text-white">New</span>}
                  <Link to={n.link} onClick={() => !n.read && mark.mutate(n.id)} className={`underline-offset-2 hover:underline ${n.read ? 'font-semibold' : 'font-bold'} text-ink`}>
                    {n.title}
                  </Link>
                </p>
                <p>{n.body}</p>
                <p className="text-sm text-cast">
                  <time dateTime={n.createdAt}>{formatDateTime(n.createdAt)}</time>
                </p>
              </div>
              <div className="col-start-2 sm:col-start-3">
                {n.read ? (
                  <span className="inline-flex items-center gap-1 text-sm text-cast">
                    <PackageCheck aria-hidden className="size-4" /> Read
                  </span>
                ) : (
                  <Button variant="quiet" disabled={mark.isPending} onClick={() => mark.mutate(n.id)}>
                    <Check aria-hidden className="size-4" /> Mark read<span className="sr-only">: {n.title}</span>
                  </Button>
                )}
              </div>
            </li>
          );
        })}
      </ul>
      <PageNav label="Pages of notices" page={notices.data.page} pageSize={notices.data.pageSize} total={notices.data.total} onPage={onPage} />
    </div>
  );
}
