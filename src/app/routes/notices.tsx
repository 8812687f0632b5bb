import { Link, useSearchParams } from 'react-router-dom';
import { LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { NoticesList } from '../../features/notices/components/notices-list';

export function NoticesRoute() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const page = Math.max(1, Math.trunc(Number(params.get('page'))) || 1);
  if (me.isPending) return <LoadingState label="Checking your account…" />;
  if (!me.data?.user) {
    return (
      <div className="grid gap-2 py-6">
        <h1 className="text-2xl font-bold">Notices</h1>
        <p>
          <Link to="/sign-in?next=/notices" className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>{' '}
          to see what changed on your orders and returns.
        </p>
      </div>
    );
  }
  return (
    <div className="grid gap-5">
      <div>
        <h1 className="text-2xl font-bold">Notices</h1>
        <p className="text-cast">What changed on your orders, returns and units: payments, picking, back-orders, dispatches, return decisions, service steps and service reminders.</p>
      </div>
      <NoticesList page={page} onPage={(p) => setParams(p > 1 ? { page: String(p) } : {})} />
    </div>
  );
}
