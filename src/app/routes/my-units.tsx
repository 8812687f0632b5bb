import { Link, useSearchParams } from 'react-router-dom';
import { LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { MyUnitsList } from '../../features/units/components/my-units-list';

/** /account/units — "My units": serials, service dates and a way to book each in. */
export function MyUnitsRoute() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const page = Math.max(1, Math.trunc(Number(params.get('page'))) || 1);
  if (me.isPending) return <LoadingState label="Checking your account…" />;
  if (!me.data?.user) {
    return (
      <div className="grid gap-2 py-6">
        <h1 className="text-2xl font-bold">My units</h1>
        <p>
          <Link to="/sign-in?next=/account/units" className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>{' '}
          to see the turbochargers and cartridges you bought from us.
        </p>
      </div>
    );
  }
  const company = me.data.user.dealer?.status === 'approved' ? me.data.user.dealer.companyName : null;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
      <div>
        <h1 className="text-2xl font-bold">My units</h1>
        <p className="text-cast">
          Complete turbochargers and cartridges {company ? `bought by you or anyone at ${company}` : 'you bought from us'}, by serial: when each was last serviced,
          when the next service is due for its bearing and use, and a link to book it in.
        </p>
      </div>
      <MyUnitsList page={page} onPage={(p) => setParams(p > 1 ? { page: String(p) } : {})} />
    </div>
  );
}
