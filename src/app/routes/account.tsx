import { ArrowRight } from 'lucide-react';
import { Link, Navigate, useLocation } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { AccountDetails, ApplicationState, DealerTerms } from '../../features/auth/components/account-details';
import { signInHref } from '../../features/auth/next-path';

export function AccountRoute() {
  const me = useMe();
  const location = useLocation();
  const welcome = (location.state as { welcome?: boolean } | null)?.welcome === true;

  if (me.isPending) return <LoadingState label="Loading your account…" />;
  if (me.isError) return <ErrorState title="Your account did not load" message={me.error.message} onRetry={() => me.refetch()} />;
  const user = me.data.user;
  if (!user) return <Navigate to={signInHref('/account')} replace />;
  const dealer = user.dealer;

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <h1 className="text-3xl font-bold">Your account</h1>
      {welcome && (
        <Notice tone="done">
          <span className="font-semibold">Welcome, {user.name}.</span> Your account is ready and you are signed in.
        </Notice>
      )}
      <div className="grid items-start gap-6 md:grid-cols-[repeat(2,minmax(0,1fr))]">
        <AccountDetails user={user} />
        {dealer?.status === 'approved' ? (
          <DealerTerms dealer={dealer} />
        ) : user.role === 'customer' ? (
          <section aria-labelledby="account-trade" className="grid gap-3 rounded-md border border-cast-line bg-white p-4">
            <h2 id="account-trade" className="text-xl font-bold">
              Trade account
            </h2>
            {dealer ? (
              <ApplicationState dealer={dealer} />
            ) : (
              <>
                <p>Workshops, tuners and resellers buy at trade prices, on account with payment terms, and get the quick-order pad and stock-list upload.</p>
                <Link to="/account/trade-application" className={`${buttonClass('primary')} justify-self-start`}>
                  Apply for a trade account
                  <ArrowRight aria-hidden className="size-4" />
                </Link>
              </>
            )}
          </section>
        ) : null}
      </div>
      <nav aria-label="Your things" className="flex flex-wrap gap-3">
        <Link to="/orders" className={buttonClass('secondary')}>
          Orders
        </Link>
        <Link to="/fitment/saved" className={buttonClass('secondary')}>
          Saved fitment checks
        </Link>
        {user.role === 'dealer' && (
          <>
            <Link to="/trade/quick-order" className={buttonClass('secondary')}>
              Quick order
            </Link>
            <Link to="/trade/stock-list" className={buttonClass('secondary')}>
              Stock-list upload
            </Link>
            <Link to="/trade/lists" className={buttonClass('secondary')}>
              Parts lists
            </Link>
          </>
        )}
        {user.role === 'warehouse' && (
          <Link to="/floor" className={buttonClass('secondary')}>
            Go to the Floor
          </Link>
        )}
        {user.role === 'admin' && (
          <Link to="/office/dealers" className={buttonClass('secondary')}>
            Office: dealer accounts
          </Link>
        )}
      </nav>
    </div>
  );
}
