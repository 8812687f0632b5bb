import { Link } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { ApplicationState } from '../../features/auth/components/account-details';
import { DealerApplicationForm } from '../../features/auth/components/dealer-application-form';
import { signInHref } from '../../features/auth/next-path';
import { ROLE_LABELS } from '../../features/auth/roles';

export function DealerApplyRoute() {
  const me = useMe();

  const body = () => {
    if (me.isPending) return <LoadingState />;
    if (me.isError) return <ErrorState message={me.error.message} onRetry={() => me.refetch()} />;
    const user = me.data.user;
    if (!user) {
      return (
        <div className="rounded-md border border-cast-line bg-white p-4">
          <p>Sign in first, or create a retail account: the application is attached to it.</p>
          <div className="mt-3 flex flex-wrap gap-3">
            <Link to={signInHref('/account/trade-application')} className={buttonClass('primary')}>
              Sign in
            </Link>
            <Link to="/sign-up?next=%2Faccount%2Ftrade-application" className={buttonClass('secondary')}>
              Create an account
            </Link>
          </div>
        </div>
      );
    }
    if (user.dealer) {
      return (
        <div className="grid gap-4">
          <ApplicationState dealer={user.dealer} />
          <Link to="/account" className="font-semibold text-temper underline underline-offset-2">
            Back to your account
          </Link>
        </div>
      );
    }
    if (user.role !== 'customer') {
      return (
        <p className="rounded-md border border-cast-line bg-white p-4">
          Your account is a {ROLE_LABELS[user.role].toLowerCase()} account. Trade applications are made from a retail buyer account.
        </p>
      );
    }
    // After sending, /me is read again and shows the pending application above.
    return <DealerApplicationForm contactName={user.name} onApplied={() => window.scrollTo({ top: 0 })} />;
  };

  return (
    <div className="mx-auto grid max-w-3xl grid-cols-[minmax(0,1fr)] gap-6">
      <div>
        <h1 className="text-3xl font-bold">Apply for a trade account</h1>
        <p className="mt-1 text-cast">
          Tell us about the business. The office checks each application, sets your trade tier, credit limit and payment terms, and e-mails you the
          decision.
        </p>
      </div>
      {body()}
    </div>
  );
}
