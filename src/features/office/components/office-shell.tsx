import { Ban } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link, NavLink } from 'react-router-dom';
import { LoadingState } from '../../../components/ui/states';

const tab = ({ isActive }: { isActive: boolean }) =>
  `inline-flex min-h-10 items-center rounded-t-md border-b-4 px-3 font-semibold ${isActive ? 'border-temper text-temper-deep' : 'border-transparent text-ink hover:text-temper'}`;

/** The Office workspace's own tabs, above each Office page. */
export function OfficeNav() {
  return (
    <nav aria-label="Office" className="flex flex-wrap gap-2 border-b border-cast-line">
      <NavLink to="/office" end className={tab}>
        Overview
      </NavLink>
      <NavLink to="/office/parts" className={tab}>
        Catalogue
      </NavLink>
      <NavLink to="/office/price-imports" className={tab}>
        Price list import
      </NavLink>
      <NavLink to="/office/dealers" className={tab}>
        Dealer accounts
      </NavLink>
      <NavLink to="/office/payment-alerts" className={tab}>
        Payment alerts
      </NavLink>
      <NavLink to="/office/mail" className={tab}>
        Mail
      </NavLink>
      <NavLink to="/office/service-intervals" className={tab}>
        Service intervals
      </NavLink>
      <NavLink to="/office/audit" className={tab}>
        Audit log
      </NavLink>
    </nav>
  );
}

/** The heading of an Office page: the workspace's name, the page's title and what the page is for. */
export function OfficePageHeader({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div>
      <p className="text-sm font-semibold uppercase tracking-wider text-cast">Office</p>
      <h1 className="text-3xl font-bold">{title}</h1>
      <p className="mt-1 text-cast">{children}</p>
    </div>
  );
}

type Access = { state: 'loading' } | { state: 'signed-out' } | { state: 'denied'; roleLabel: string } | { state: 'allowed' };

/** Admins only: anybody else gets a plain answer and a way on, never a broken page. */
export function OfficeGate({ access, children }: { access: Access; children: ReactNode }) {
  if (access.state === 'loading') return <LoadingState label="Checking your account…" />;
  if (access.state === 'allowed') return <>{children}</>;
  return (
    <section aria-labelledby="not-allowed-heading" className="my-8 flex max-w-2xl gap-4 rounded-lg border-2 border-oxide bg-oxide-tint p-6">
      <Ban aria-hidden className="mt-1 size-6 shrink-0 text-oxide" />
      <div className="grid gap-2">
        <h1 id="not-allowed-heading" className="text-2xl font-bold">
          Not allowed: Office is for administrators
        </h1>
        {access.state === 'signed-out' ? (
          <>
            <p>Sign in with an administrator account to keep the catalogue and prices.</p>
            <p>
              <Link to="/sign-in" className="font-semibold text-temper underline underline-offset-2">
                Sign in
              </Link>
            </p>
          </>
        ) : (
          <>
            <p>You are signed in as {access.roleLabel}. Catalogue upkeep and price imports need an administrator account.</p>
            <p>
              <Link to="/catalogue" className="font-semibold text-temper underline underline-offset-2">
                Back to the catalogue
              </Link>
            </p>
          </>
        )}
      </div>
    </section>
  );
}

export type { Access as OfficeAccess };
