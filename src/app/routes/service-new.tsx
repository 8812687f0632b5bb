import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { useFrames } from '../../features/catalog/api/get-frames';
import { BookingForm } from '../../features/service/components/booking-form';

export function ServiceNewRoute() {
  const me = useMe();
  const frames = useFrames();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  if (me.isPending || frames.isPending) return <LoadingState label="Loading the booking form…" />;
  if (frames.isError) return <ErrorState title="The frames did not load" message={frames.error.message} onRetry={() => void frames.refetch()} />;
  const user = me.data?.user;
  if (!user) {
    return (
      <p className="py-6">
        <Link to="/sign-in?next=/service/new" className="font-semibold text-temper underline">
          Sign in
        </Link>{' '}
        to book a unit in for service.
      </p>
    );
  }
  if (user.role !== 'customer' && user.role !== 'dealer') return <ErrorState title="Booking in is for buyers" message="Sign in with a buyer's account to book a unit in." />;
  const address = user.dealer?.status === 'approved' ? user.dealer.address : null;
  return (
    <div className="mx-auto grid max-w-3xl gap-5">
      <nav aria-label="Breadcrumb" className="text-sm text-cast">
        <Link to="/service" className="hover:underline">
          Service and rebuilds
        </Link>{' '}
        / Book a unit in
      </nav>
      <div>
        <h1 className="text-2xl font-bold">Book a unit in for service</h1>
        <p className="text-cast">We inspect it, quote the rebuild and wait for your approval before any work. Declined quotes pay only the inspection fee.</p>
      </div>
      <BookingForm
        frames={frames.data.items}
        defaults={{
          serial: params.get('serial') ?? '',
          returnName: user.dealer?.status === 'approved' ? user.dealer.companyName : user.name,
          returnLine1: address?.line1 ?? '',
          returnCity: address?.city ?? '',
          returnPostcode: address?.postcode ?? '',
        }}
        onBooked={(r) => void navigate(`/service/${r.reference}`)}
      />
    </div>
  );
}
