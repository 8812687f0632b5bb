import { Inbox, Search, ShoppingCart } from 'lucide-react';
import { lazy, Suspense, useEffect, useState, type FormEvent } from 'react';
import { Link, NavLink, useLocation, useNavigate, useSearchParams, type NavigateOptions } from 'react-router-dom';
import { useMe } from '../features/auth/api/get-me';
// The account menu (and the accessible-menu library it needs) loads only for signed-in users.
const AccountMenu = lazy(() => import('../features/auth/components/account-menu').then((m) => ({ default: m.AccountMenu })));
// So does the notices bell, for signed-in buyers only.
const NoticesBell = lazy(() => import('../features/notices/components/notices-bell').then((m) => ({ default: m.NoticesBell })));
import { signInHref } from '../features/auth/next-path';
import type { Role } from '../features/auth/roles';
import { useCart } from '../features/cart/api/get-cart';
import { useNavigationPending } from './navigation-pending';
import { loadOnIntent } from '../lib/load-on-intent';
import { PageOutlet } from './page-outlet';

declare module 'react-aria-components' {
  interface RouterConfig {
    routerOptions: NavigateOptions;
  }
}

// Search as you type: the combobox (and the accessible-list library, a good third of a first page's script) loads
// when someone shows they mean to search: the pointer comes over the field, or it is touched or focused. Until then a
// plain field of the same size stands in, and a search typed there works as a form. Loaded once, kept for every page.
type SearchBox = typeof import('../components/ui/part-search-box').PartSearchBox;
const searchBox = loadOnIntent(() => import('../components/ui/part-search-box').then((m) => m.PartSearchBox));
const headerInputClass = 'min-h-11 w-full rounded-l-md border border-cast-line bg-white px-3 text-ink placeholder:text-cast focus:border-temper';

function HeaderSearch() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const current = params.get('q') ?? '';
  const [value, setValue] = useState(current);
  const [Box, setBox] = useState<SearchBox | null>(() => searchBox.loaded());
  // Whether the stand-in field had focus when the combobox arrived, so typing carries on in it.
  const [typing, setTyping] = useState(false);
  useEffect(() => setValue(current), [current]);
  const want = () => {
    if (Box) return;
    searchBox.load().then(
      (loaded) => setBox(() => loaded),
      () => undefined,
    );
  };
  const search = () => {
    const q = value.trim();
    navigate(q ? `/catalogue?q=${encodeURIComponent(q)}` : '/catalogue');
  };
  const submit = (e: FormEvent) => {
    e.preventDefault();
    search();
  };
  return (
    <form role="search" onSubmit={submit} className="flex w-full max-w-xl items-stretch">
      {Box ? (
        <Box
          id="header-search"
          label="Search the catalogue"
          labelHidden
          value={value}
          onChange={setValue}
          onPick={(s) => navigate(`/parts/${encodeURIComponent(s.partNumber)}`)}
          onEnter={search}
          placeholder="part number or words"
          maxLength={100}
          autoFocus={typing}
          inputClassName={headerInputClass}
        />
      ) : (
        // The same box as the combobox's own wrapper, so nothing moves when it takes this field's place.
        <div className="relative w-full min-w-0">
          <input
            id="header-search"
            // It is the combobox, before its list can open: the same name and role either side of the swap.
            role="combobox"
            aria-expanded={false}
            aria-autocomplete="list"
            aria-label="Search the catalogue"
            value={value}
            onChange={(e) => setValue(e.target.value)}
            onPointerEnter={want}
            onPointerDown={want}
            onFocus={() => {
              setTyping(true);
              want();
            }}
            onBlur={() => setTyping(false)}
            placeholder="part number or words"
            maxLength={100}
            autoComplete="off"
            spellCheck={false}
            className={headerInputClass}
          />
        </div>
      )}
      <button type="submit" className="inline-flex min-h-11 items-center gap-1 rounded-r-md bg-temper px-4 font-semibold text-white hover:bg-temper-deep">
        <Search aria-hidden className="size-4" />
        Search
      </button>
    </form>
  );
}

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded px-2 py-1 font-semibold ${isActive ? 'bg-temper-tint text-temper-deep' : 'text-ink hover:text-temper'}`;

type Workspace = 'Counter' | 'Floor' | 'Office' | 'Bench';

/** The building a path belongs to (DESIGN.md: Counter, Floor, Office, Bench). */
function workspaceOf(pathname: string): Workspace {
  if (pathname === '/floor' || pathname.startsWith('/floor/')) return 'Floor';
  if (pathname === '/office' || pathname.startsWith('/office/')) return 'Office';
  if (pathname === '/bench' || pathname.startsWith('/bench/')) return 'Bench';
  return 'Counter';
}

/** The workspaces a role may enter besides the Counter; the server checks each route too. */
const WORKSPACE_LINKS: Record<Role, Array<{ name: Workspace; to: string }>> = {
  customer: [],
  dealer: [],
  warehouse: [{ name: 'Floor', to: '/floor' }],
  workshop: [{ name: 'Bench', to: '/bench' }],
  admin: [{ name: 'Office', to: '/office' }],
};

function WorkspaceNav({ role, current }: { role: Role; current: Workspace }) {
  const extra = WORKSPACE_LINKS[role];
  if (extra.length === 0) return null;
  const links = [{ name: 'Counter' as Workspace, to: '/' }, ...extra];
  return (
    <nav aria-label="Workspaces" className="flex items-center gap-1 rounded-md bg-panel p-1">
      {links.map((l) => (
        <Link
          key={l.name}
          to={l.to}
          aria-current={l.name === current ? 'page' : undefined}
          className={`rounded px-2 py-1 text-sm font-semibold ${l.name === current ? 'bg-white text-temper-deep shadow-sm' : 'text-ink hover:text-temper'}`}
        >
          {l.name}
        </Link>
      ))}
    </nav>
  );
}

function CartLink() {
  const cart = useCart();
  const count = cart.data?.lines.length;
  return (
    <NavLink
      to="/cart"
      className={({ isActive }) =>
        `inline-flex min-h-11 items-center gap-2 rounded-md border px-3 font-semibold ${isActive ? 'border-temper bg-temper-tint text-temper-deep' : 'border-cast-line bg-white text-ink hover:border-temper'}`
      }
    >
      <ShoppingCart aria-hidden className="size-5 text-temper" />
      Cart
      {count !== undefined && (
        <span className="tabular min-w-6 rounded-full bg-temper px-1.5 text-center text-sm text-white">
          {count}
          <span className="sr-only">{count === 1 ? ' line' : ' lines'}</span>
        </span>
      )}
    </NavLink>
  );
}

function AccountArea() {
  const me = useMe();
  const location = useLocation();
  const navigate = useNavigate();
  const here = `${location.pathname}${location.search}`;
  if (me.isPending) return <span className="inline-block min-h-11 w-28" aria-hidden />;
  const user = me.data?.user;
  if (!user) {
    return (
      <Link to={signInHref(location.pathname.startsWith('/sign-') ? '/' : here)} className="inline-flex min-h-11 items-center rounded-md bg-temper px-4 font-semibold text-white hover:bg-temper-deep">
        Sign in
      </Link>
    );
  }
  return (
    <Suspense fallback={<span className="inline-block min-h-11 w-40" aria-hidden />}>
      {/* The sign-out resets every cached query, the cart included, then goes back to the counter. */}
      <AccountMenu user={user} onSignedOut={() => navigate('/')} />
    </Suspense>
  );
}

/**
 * The Floor's own header: the workspace, the way back to the Counter and the account, in one short row, so a
 * handheld shows the scan field without scrolling. Shop search and cart belong to the Counter.
 */
function FloorHeader({ role, loading }: { role: Role; loading: boolean }) {
  return (
    <header className="no-print border-b-4 border-temper bg-white">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-3 gap-y-2 px-4 py-1.5">
        <Link to="/" className="flex items-baseline gap-2">
          <span className="text-lg font-bold tracking-tight text-ink sm:text-2xl">Spoolyard</span>
          <span className="rounded bg-panel px-2 py-0.5 text-sm font-semibold uppercase tracking-wider text-cast" aria-label="Workspace: Floor">
            Floor
          </span>
        </Link>
        <div className="ml-auto flex items-center gap-3">
          <div className="hidden sm:block">
            <WorkspaceNav role={role} current="Floor" />
          </div>
          <AccountArea />
        </div>
      </div>
      {loading && <div className="h-0.5 animate-pulse bg-temper" role="progressbar" aria-label="Loading page" />}
    </header>
  );
}

export function Layout() {
  const loading = useNavigationPending();
  const location = useLocation();
  const me = useMe();
  const role = me.data?.user?.role;
  const inPath = workspaceOf(location.pathname);
  // Someone who may not enter the Floor or Office is still at the Counter, whatever the address says.
  const workspace: Workspace = inPath === 'Counter' || (role && WORKSPACE_LINKS[role].some((w) => w.name === inPath)) ? inPath : 'Counter';
  // Development tools are on when the server lists its test payment methods or demo accounts.
  const devTools = Boolean(me.data?.payments.testMethods || me.data?.demoAccounts);
  return (
      <div className="flex min-h-screen flex-col">
        <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:p-2">
          Skip to content
        </a>
        {workspace === 'Floor' && role ? (
          <FloorHeader role={role} loading={loading} />
        ) : (
        <header className="no-print border-b-4 border-temper bg-white">
          <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 gap-y-3 px-4 py-3">
            <Link to="/" className="flex items-baseline gap-2">
              <span className="text-2xl font-bold tracking-tight text-ink">Spoolyard</span>
              <span className="rounded bg-panel px-2 py-0.5 text-sm font-semibold uppercase tracking-wider text-cast" aria-label={`Workspace: ${workspace}`}>
                {workspace}
              </span>
            </Link>
            <div className="order-last w-full lg:order-none lg:w-auto lg:flex-1">
              <HeaderSearch />
            </div>
            <div className="ml-auto flex flex-wrap items-center justify-end gap-2">
              <CartLink />
              {(role === 'customer' || role === 'dealer') && (
                <Suspense fallback={<span className="inline-block min-h-11 min-w-11" aria-hidden />}>
                  <NoticesBell />
                </Suspense>
              )}
              <AccountArea />
            </div>
          </div>
          <div className="border-t border-cast-line/70">
            <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-4 gap-y-2 px-4 py-1.5">
              <nav aria-label="Main" className="flex gap-2">
                <NavLink to="/catalogue" className={navClass}>
                  Catalogue
                </NavLink>
                <NavLink to="/fitment" className={navClass}>
                  Fitment check
                </NavLink>
              </nav>
              <div className="ml-auto flex items-center gap-3">
                {role && <WorkspaceNav role={role} current={workspace} />}
                {devTools && role === 'admin' && (
                  <Link to="/dev/inbox" className="inline-flex items-center gap-1 rounded border border-dashed border-amber-line px-2 py-0.5 text-sm font-semibold text-amber hover:bg-amber-tint">
                    <Inbox aria-hidden className="size-4" />
                    Inbox <span className="sr-only">(development mail catcher)</span>
                  </Link>
                )}
              </div>
            </div>
          </div>
          {loading && <div className="h-0.5 animate-pulse bg-temper" role="progressbar" aria-label="Loading page" />}
        </header>
        )}
        {/* At least a screen tall, so the footer never sits in the first view only to be pushed down as the page arrives. */}
        <main id="main" className={`mx-auto min-h-screen w-full max-w-6xl flex-1 px-4 print:min-h-0 ${workspace === 'Floor' ? 'py-2 sm:py-6' : 'py-6'}`}>
          <PageOutlet />
        </main>
        <footer className="no-print border-t border-cast-line bg-panel">
          <div className="mx-auto grid max-w-6xl gap-2 px-4 py-6 text-sm text-cast sm:grid-cols-2">
            <p>
              <span className="font-semibold text-ink">Spoolyard Turbo Supply</span> · Unit 7, Foundry Row, Quenchfold · trade counter Mon–Fri 8:00–17:00
            </p>
            <p className="sm:text-right">Vanecraft is our house brand. Fitting advice is general: have your installation checked by a licensed mechanic.</p>
          </div>
        </footer>
      </div>
  );
}
