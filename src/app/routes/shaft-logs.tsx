import { ArrowLeft } from 'lucide-react';
import { Link, useParams, useSearchParams } from 'react-router-dom';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { ApiError } from '../../lib/api-client';
import { useMe } from '../../features/auth/api/get-me';
import { useSavedFitment } from '../../features/fitment/api/get-saved-fitment';
import { ShaftLogsPanel } from '../../features/fitment/components/shaft-logs-panel';

const idFrom = (raw: string | null | undefined) => (raw && /^\d{1,12}$/.test(raw) ? Number(raw) : null);

/** /fitment/saved/:id/logs — a saved check's shaft-speed logs on the compressor map; ?log= picks the one shown. */
export function ShaftLogsRoute() {
  const params = useParams();
  const [search, setSearch] = useSearchParams();
  const savedId = idFrom(params.id);
  const me = useMe();
  const signedIn = Boolean(me.data?.user);
  const saved = useSavedFitment(signedIn ? savedId : null);

  const body = () => {
    if (me.isPending) return <LoadingState label="Checking who is signed in…" />;
    if (me.isError) return <ErrorState title="We could not tell who is signed in" message={me.error.message} onRetry={() => void me.refetch()} />;
    if (!signedIn) {
      return (
        <EmptyState title="Sign in to see this check’s logs">
          Logs belong to the saved check, and saved checks to your account.{' '}
          <Link to="/sign-in" className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>
          .
        </EmptyState>
      );
    }
    if (savedId === null) return <ErrorState title="That is not a saved check" message="The address has no check number in it." />;
    if (saved.isPending) return <LoadingState label="Loading the saved check…" />;
    if (saved.isError) {
      const missing = saved.error instanceof ApiError && saved.error.isNotFound;
      return (
        <ErrorState
          title={missing ? 'No such saved check' : 'The saved check did not load'}
          message={missing ? 'We have no saved check with that number on your account.' : saved.error.message}
          onRetry={missing ? undefined : () => void saved.refetch()}
        />
      );
    }
    return (
      <>
        <p className="max-w-4xl">
          <span className="font-semibold">{saved.data.name}</span>
          <span className="text-cast"> — {saved.data.summary}</span>
        </p>
        <ShaftLogsPanel
          saved={saved.data}
          selectedId={idFrom(search.get('log'))}
          onSelect={(logId) => setSearch(logId === null ? {} : { log: String(logId) }, { replace: true })}
        />
      </>
    );
  };

  return (
    <div className="grid min-w-0 gap-4">
      <Link to="/fitment/saved" className="inline-flex w-fit items-center gap-1 font-semibold text-temper underline underline-offset-2">
        <ArrowLeft aria-hidden className="size-4" />
        Saved fitment checks
      </Link>
      <h1 className="text-3xl font-bold">Shaft-speed logs</h1>
      <p className="max-w-3xl text-cast">
        Lay a plug-in logger’s shaft speed, boost and revs on the frame’s compressor map: see where the engine really ran beside where the check put
        it, and whether the shaft came near its speed limit or the compressor near surge.
      </p>
      {body()}
    </div>
  );
}
