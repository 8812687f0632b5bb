import { Plus } from 'lucide-react';
import { Link, useSearchParams } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { ServiceRequestList } from '../../features/service/components/request-list';

export function ServiceRoute() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const page = Math.max(1, Math.trunc(Number(params.get('page'))) || 1);
  if (me.isPending) return <LoadingState label="Checking your account…" />;
  if (!me.data?.user) {
    return (
      <div className="grid gap-2 py-6">
        <h1 className="text-2xl font-bold">Service and rebuilds</h1>
        <p>
          <Link to="/sign-in?next=/service" className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>{' '}
          to book a unit in or follow one on the Bench.
        </p>
      </div>
    );
  }
  return (
    <div className="grid gap-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">Service and rebuilds</h1>
          <p className="text-cast">Units you sent to our workshop: inspected, quoted, rebuilt, balanced, tested and sent back.</p>
        </div>
        <Link to="/service/new" className={buttonClass('primary')}>
          <Plus aria-hidden className="size-4" /> Book a unit in
        </Link>
      </div>
      <ServiceRequestList page={page} onPage={(p) => setParams(p > 1 ? { page: String(p) } : {})} />
    </div>
  );
}
