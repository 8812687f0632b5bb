import { Link, useParams } from 'react-router-dom';
import { LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { ServiceRequestDetail } from '../../features/service/components/request-detail';

export function ServiceRequestRoute() {
  const { reference = '' } = useParams();
  const me = useMe();
  if (me.isPending) return <LoadingState label="Checking your account…" />;
  const user = me.data?.user;
  if (!user) {
    return (
      <p className="py-6">
        <Link to={`/sign-in?next=${encodeURIComponent(`/service/${reference}`)}`} className="font-semibold text-temper underline">
          Sign in
        </Link>{' '}
        to see this service request.
      </p>
    );
  }
  const staff = user.role === 'workshop' || user.role === 'admin';
  return (
    <div className="grid gap-4">
      <nav aria-label="Breadcrumb" className="text-sm text-cast">
        <Link to={staff ? '/bench' : '/service'} className="hover:underline">
          {staff ? 'Bench' : 'Service and rebuilds'}
        </Link>{' '}
        / <span className="part-no">{reference.toUpperCase()}</span>
      </nav>
      <ServiceRequestDetail
        reference={reference.toUpperCase()}
        staff={staff}
        payer={{ testMethods: me.data?.payments.testMethods ?? [], live: me.data?.payments.mode === 'live', onAccount: user.dealer?.status === 'approved' }}
      />
    </div>
  );
}
