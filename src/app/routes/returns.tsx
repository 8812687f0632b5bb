import { ChevronDown, PackageOpen } from 'lucide-react';
import { useState } from 'react';
import { Printer } from 'lucide-react';
import { Link, useLocation, useSearchParams } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { LinePicker } from '../../features/returns/components/line-picker';
import { ReturnsList } from '../../features/returns/components/returns-list';

export function ReturnsRoute() {
  const me = useMe();
  const location = useLocation();
  const created = (location.state as { created?: string } | null)?.created ?? null;
  const [params, setParams] = useSearchParams();
  const page = Math.max(1, Math.trunc(Number(params.get('page'))) || 1);
  const highlight = created ?? params.get('ref');
  const [picking, setPicking] = useState(false);

  if (me.isPending) return <LoadingState label="Checking your account…" />;
  if (!me.data?.user) {
    return (
      <div className="grid gap-2 py-6">
        <h1 className="text-2xl font-bold">Your returns</h1>
        <p>
          <Link to="/sign-in?next=/returns" className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>{' '}
          to see your returns or send a part back.
        </p>
      </div>
    );
  }

  return (
    <div className="grid gap-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Your returns</h1>
          <p className="text-cast">Wrong parts, faulty parts and exchange cores on their way back, and what we decided.</p>
        </div>
        <button
          type="button"
          aria-expanded={picking}
          aria-controls="return-picker"
          onClick={() => setPicking(!picking)}
          className="inline-flex min-h-11 items-center gap-2 rounded-md bg-temper px-4 font-semibold text-white hover:bg-temper-deep"
        >
          <PackageOpen aria-hidden className="size-5" /> Return a part
          <ChevronDown aria-hidden className={`size-4 transition-transform ${picking ? 'rotate-180' : ''}`} />
        </button>
      </div>
      {created && (
        <Notice tone="done" title={`Return ${created} is authorised`}>
          <p>Print the return label and stick it on the parcel: the warehouse scans its code when the parcel arrives. We tell you when it has been inspected.</p>
          <p className="mt-3">
            <Link to={`/returns/${encodeURIComponent(created)}/label`} className={buttonClass('primary')}>
              <Printer aria-hidden className="size-4" /> Print the return label
            </Link>
          </p>
        </Notice>
      )}
      {picking && (
        <section id="return-picker" aria-labelledby="return-picker-heading" className="grid gap-3 rounded-lg bg-panel p-4">
          <h2 id="return-picker-heading" className="text-lg font-bold">
            Which part is coming back?
          </h2>
          <LinePicker />
        </section>
      )}
      <ReturnsList highlight={highlight} page={page} onPage={(p) => setParams(p > 1 ? { page: String(p) } : {})} />
    </div>
  );
}
