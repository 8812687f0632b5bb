import { Link } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { useSavedFitments } from '../../features/fitment/api/get-saved-fitments';
import { SavedFitmentList } from '../../features/fitment/components/saved-fitment-list';

export function SavedFitmentsRoute() {
  const me = useMe();
  const signedIn = Boolean(me.data?.user);
  const saved = useSavedFitments(signedIn);

  const body = () => {
    if (me.isPending) return <LoadingState label="Checking who is signed in…" />;
    if (me.isError) return <ErrorState title="We could not tell who is signed in" message={me.error.message} onRetry={() => me.refetch()} />;
    if (!signedIn) {
      return (
        <EmptyState title="Sign in to see your saved checks">
          Saved fitment checks belong to your account.{' '}
          <Link to="/sign-in" className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>{' '}
          or{' '}
          <Link to="/fitment" className="font-semibold text-temper underline underline-offset-2">
            run a check without saving
          </Link>
          .
        </EmptyState>
      );
    }
    if (saved.isPending) return <LoadingState label="Loading your saved checks…" />;
    if (saved.isError) return <ErrorState title="Your saved checks did not load" message={saved.error.message} onRetry={() => saved.refetch()} />;
    if (saved.data.items.length === 0) {
      return (
        <EmptyState title="No saved checks yet">
          Run a{' '}
          <Link to="/fitment" className="font-semibold text-temper underline underline-offset-2">
            fitment check
          </Link>{' '}
          and save it under a name, such as “customer’s 2.0 L street car”.
        </EmptyState>
      );
    }
    return (
      <>
        <p className="tabular text-cast">
          {saved.data.items.length} saved {saved.data.items.length === 1 ? 'check' : 'checks'}, newest first. Opening one runs it again against
          today’s frames.
        </p>
        <SavedFitmentList items={saved.data.items} />
      </>
    );
  };

  return (
    <div className="grid gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="text-3xl font-bold">Saved fitment checks</h1>
        <Link to="/fitment" className={buttonClass('secondary')}>
          New check
        </Link>
      </div>
      {body()}
    </div>
  );
}
