import { Bell } from 'lucide-react';
import { NavLink } from 'react-router-dom';
import { useUnreadNotices } from '../api/get-unread-notices';

/** The header's way to the buyer's notices, with the unread count in figures and in words. */
export function NoticesBell() {
  const unread = useUnreadNotices(true).data?.unread ?? 0;
  return (
    <NavLink
      to="/notices"
      aria-label={unread > 0 ? `Notices, ${unread} unread` : 'Notices, none unread'}
      className={({ isActive }) =>
        `relative inline-flex min-h-11 min-w-11 items-center justify-center gap-1 rounded-md border px-2 font-semibold ${
          isActive ? 'border-temper bg-temper-tint text-temper-deep' : 'border-cast-line bg-white text-ink hover:border-temper'
        }`
      }
    >
      <Bell aria-hidden className="size-5 text-temper" />
      {unread > 0 && <span className="tabular min-w-6 rounded-full bg-oxide px-1.5 text-center text-sm text-white">{unread > 99 ? '99+' : unread}</span>}
    </NavLink>
  );
}
