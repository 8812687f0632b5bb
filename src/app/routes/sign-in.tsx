import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { authKeys } from '../../features/auth/api/keys';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { meQueryOptions, useMe } from '../../features/auth/api/get-me';
import { landingPath } from '../../features/auth/next-path';
import { ROLE_HOME, ROLE_LABELS } from '../../features/auth/roles';
import { cartKeys } from '../../features/cart/api/keys';

export function SignInRoute() {
  const [params] = useSearchParams();
  const nextParam = params.get('next');
  const navigate = useNavigate();
  const client = useQueryClient();
  const me = useMe();

  const onSignedIn = async () => {
    // The server joins a guest cart to the user's on the next cart request, so both are read again.
    await Promise.all([client.invalidateQueries({ queryKey: authKeys.all }), client.invalidateQueries({ queryKey: cartKeys.all })]);
    const role = (await client.fetchQuery(meQueryOptions())).user?.role;
    navigate(landingPath(nextParam, role ? ROLE_HOME[role] : '/'), { replace: true });
  };

  return (
    <div className="mx-auto grid max-w-2xl grid-cols-[minmax(0,1fr)] gap-6">
      <div>
        <h1 className="text-3xl font-bold">Sign in</h1>
        <p className="mt-1 text-cast">Sign in to see your orders and, for trade accounts, your prices and account balance.</p>
      </div>
      {me.isPending ? (
        <LoadingState />
      ) : me.isError ? (
        <ErrorState message={me.error.message} onRetry={() => me.refetch()} />
      ) : me.data.user ? (
        <Notice tone="info">
          <p>
            You are signed in as <span className="font-semibold">{me.data.user.name}</span> ({ROLE_LABELS[me.data.user.role]}).
          </p>
          <Link to={landingPath(nextParam, ROLE_HOME[me.data.user.role])} className={`${buttonClass('primary')} mt-3`}>
            Continue
          </Link>
        </Notice>
      ) : (
        <SignInForm demoAccounts={me.data.demoAccounts} onSignedIn={() => void onSignedIn()} />
      )}
    </div>
  );
}
