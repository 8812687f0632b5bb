import { HardHat, LogIn } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link, NavLink, useLocation } from 'react-router-dom';
import type { Me } from '../../../../shared/schemas/accounts';
import { buttonClass } from '../../../components/ui/button';
import { ErrorState, LoadingState } from '../../../components/ui/states';

/** Who may work the Floor. The API lets administrators in as well, so the screens do too. */
export const FLOOR_ROLES: ReadonlyArray<NonNullable<Me['user']>['role']> = ['warehouse', 'admin'];

const tabs = [
  { to: '/floor', label: 'Pick queue', end: true },
  { to: '/floor/goods-in', label: 'Goods in', end: false },
  { to: '/floor/stock', label: 'Stock', end: false },
  { to: '/floor/returns', label: 'Returns and cores', end: false },
  { to: '/floor/labels', label: 'Labels', end: false },
];

const tabClass = ({ isActive }: { isActive: boolean }) =>
  `inline-flex min-h-12 items-center whitespace-nowrap rounded-t-md border-b-4 px-3 text-lg font-semibold sm:px-4 ${
    isActive ? 'border-temper bg-white text-temper-deep' : 'border-transparent text-ink hover:border-cast-line hover:text-temper'
  }`;

export function FloorNav() {
  return (
    <nav aria-label="Floor" className="no-print -mx-4 mb-3 overflow-x-auto border-b border-cast-line px-4 sm:mb-6">
      <ul className="flex gap-1">
        {tabs.map((t) => (
          <li key={t.to}>
            <NavLink to={t.to} end={t.end} className={tabClass}>
              {t.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

interface MeQuery {
  data: Me | undefined;
  isPending: boolean;
  error: Error | null;
  refetch: () => unknown;
}

/** Lets warehouse staff through to a Floor screen; everyone else gets a plain answer, not a broken page. */
export function FloorGate({ me, children, nav = true }: { me: MeQuery; children: ReactNode; nav?: boolean }) {
  const location = useLocation();
  if (me.isPending) return <LoadingState label="Checking who is signed in…" />;
  if (me.error) return <ErrorState message={me.error.message} onRetry={() => void me.refetch()} />;
  const user = me.data?.user ?? null;
  if (!user) {
    const here = `${location.pathname}${location.search}`;
    return (
      <NotForYou title="Sign in to use the Floor">
        <p>The Floor is where warehouse staff pick, pack and dispatch orders. Sign in with your warehouse account.</p>
        <Link to={`/sign-in?next=${encodeURIComponent(here)}`} className={`${buttonClass('primary', 'lg')} mt-4`}>
          <LogIn aria-hidden className="size-5" />
          Sign in
        </Link>
      </NotForYou>
    );
  }
  if (!FLOOR_ROLES.includes(user.role)) {
    return (
      <NotForYou title="Floor is for warehouse staff">
        <p>
          You are signed in as {user.name}. Picking, packing, goods-in and returns are done by warehouse staff; your orders and returns are on the
          Counter.
        </p>
        <div className="mt-4 flex flex-wrap gap-3">
          <Link to="/orders" className={buttonClass('primary', 'lg')}>
            Your orders
          </Link>
          <Link to="/catalogue" className={buttonClass('secondary', 'lg')}>
            Catalogue
          </Link>
        </div>
      </NotForYou>
    );
  }
  return (
    <>
      {nav && <FloorNav />}
      {children}
    </>
  );
}

function NotForYou({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-labelledby="floor-closed" className="mx-auto my-10 flex max-w-2xl gap-4 rounded-md border-2 border-cast-line bg-white p-6">
      <HardHat aria-hidden className="size-10 shrink-0 text-cast" />
      <div>
        <h1 id="floor-closed" className="text-2xl font-bold">
          {title}
        </h1>
        <div className="mt-2 text-lg text-ink">{children}</div>
      </div>
    </section>
  );
}
