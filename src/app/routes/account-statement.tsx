import { Link, Navigate, useSearchParams } from 'react-router-dom';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { signInHref } from '../../features/auth/next-path';
import { AccountStatementView, StatementUnavailable } from '../../features/orders/components/account-statement';

export function AccountStatementRoute() {
  const me = useMe();
  // The period lives in the address, so a reload or a saved link shows the same statement.
  const [params, setParams] = useSearchParams();
  const from = /^\d{4}-\d{2}-\d{2}$/.test(params.get('from') ?? '') ? params.get('from') : null;
  if (me.isPending) return <LoadingState label="Loading your account…" />;
  if (me.isError) return <ErrorState title="Your account did not load" message={me.error.message} onRetry={() => me.refetch()} />;
  const user = me.data.user;
  if (!user) return <Navigate to={signInHref('/account/statement')} replace />;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <p className="no-print">
        <Link to="/account" className="font-semibold text-temper underline">
          Your account
        </Link>
      </p>
      {user.dealer?.status === 'approved' ? <AccountStatementView from={from} onFrom={(f) => setParams({ from: f })} /> : <StatementUnavailable />}
    </div>
  );
}
