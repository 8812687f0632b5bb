import { Link, useParams } from 'react-router-dom';
import { LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { UnitHistoryPage } from '../../features/units/components/unit-history';

/** /units/:serial — one unit's history, for its owner (and their trade account) and for staff. */
export function UnitRoute() {
  const me = useMe();
  const serial = (useParams().serial ?? '').toUpperCase();
  if (me.isPending) return <LoadingState label="Checking your account…" />;
  if (!me.data?.user) {
    return (
      <div className="grid gap-2 py-6">
        <h1 className="text-2xl font-bold">Unit {serial}</h1>
        <p>
          <Link to={`/sign-in?next=${encodeURIComponent(`/units/${serial}`)}`} className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>{' '}
          with the account that bought the unit to see its history.
        </p>
      </div>
    );
  }
  return <UnitHistoryPage serial={serial} />;
}
