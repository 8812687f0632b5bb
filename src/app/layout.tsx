import { Search } from 'lucide-react';
import { useEffect, useState, type FormEvent } from 'react';
import { Link, NavLink, Outlet, useNavigate, useNavigation, useSearchParams } from 'react-router-dom';

function HeaderSearch() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const current = params.get('q') ?? '';
  const [value, setValue] = useState(current);
  useEffect(() => setValue(current), [current]);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const q = value.trim();
    navigate(q ? `/catalogue?q=${encodeURIComponent(q)}` : '/catalogue');
  };
  return (
    <form role="search" onSubmit={submit} className="flex w-full max-w-xl items-stretch">
      <label htmlFor="header-search" className="sr-only">
        Search the catalogue
      </label>
      <input
        id="header-search"
        type="search"
        value={value}
        onChange={(e) => setValue(e.target.value)}
        placeholder="part number or words"
        maxLength={100}
        autoComplete="off"
        className="min-h-11 w-full rounded-l-md border border-cast-line bg-white px-3 text-ink placeholder:text-cast focus:border-temper"
      />
      <button type="submit" className="inline-flex min-h-11 items-center gap-1 rounded-r-md bg-temper px-4 font-semibold text-white hover:bg-temper-deep">
        <Search aria-hidden className="size-4" />
        Search
      </button>
    </form>
  );
}

const navClass = ({ isActive }: { isActive: boolean }) =>
  `rounded px-2 py-1 font-semibold ${isActive ? 'bg-temper-tint text-temper-deep' : 'text-ink hover:text-temper'}`;

export function Layout() {
  const navigation = useNavigation();
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:p-2">
        Skip to content
      </a>
      <header className="no-print border-b-4 border-temper bg-white">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-3 px-4 py-3">
          <Link to="/" className="flex items-baseline gap-2">
            <span className="text-2xl font-bold tracking-tight text-ink">Spoolyard</span>
            <span className="rounded bg-panel px-2 py-0.5 text-sm font-semibold uppercase tracking-wider text-cast" aria-label="Workspace: Counter">
              Counter
            </span>
          </Link>
          <HeaderSearch />
          <nav aria-label="Main" className="flex gap-2">
            <NavLink to="/catalogue" className={navClass}>
              Catalogue
            </NavLink>
            <NavLink to="/fitment" className={navClass}>
              Fitment check
            </NavLink>
          </nav>
        </div>
        {navigation.state === 'loading' && <div className="h-0.5 animate-pulse bg-temper" role="progressbar" aria-label="Loading page" />}
      </header>
      <main id="main" className="mx-auto w-full max-w-6xl flex-1 px-4 py-6">
        <Outlet />
      </main>
      <footer className="no-print border-t border-cast-line bg-panel">
        <div className="mx-auto grid max-w-6xl gap-2 px-4 py-6 text-sm text-cast sm:grid-cols-2">
          <p>
            <span className="font-semibold text-ink">Spoolyard Turbo Supply</span> · Unit 7, Foundry Row, Millbrook · trade counter Mon–Fri 8:00–17:00
          </p>
          <p className="sm:text-right">Vanecraft is our house brand. Fitting advice is general: have your installation checked by a licensed mechanic.</p>
        </div>
      </footer>
    </div>
  );
}
