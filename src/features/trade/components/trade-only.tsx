import type { UseQueryResult } from '@tanstack/react-query';
import { Lock } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { Me } from '../../../../shared/schemas/accounts';
import { ErrorState, LoadingState } from '../../../components/ui/states';

/** Trade tools show to approved dealers; everyone else gets a note saying how to get them. */
export function TradeOnly({ me, path, what, children }: { me: UseQueryResult<Me>; path: string; what: string; children: ReactNode }) {
  if (me.isPending) return <LoadingState />;
  if (me.isError) return <ErrorState message={me.error.message} onRetry={() => me.refetch()} />;
  const user = me.data.user;
  if (user?.role === 'dealer' && user.dealer?.status === 'approved') return <>{children}</>;
  return (
    <div className="flex max-w-2xl gap-3 rounded-md border border-cast-line bg-white p-5">
      <Lock aria-hidden className="mt-0.5 size-5 shrink-0 text-cast" />
      <div className="grid gap-2">
        <p className="font-semibold">{what} is for trade accounts.</p>
        {!user ? (
          <p>
            <Link to={`/sign-in?next=${encodeURIComponent(path)}`} className="font-semibold text-temper underline">
              Sign in
            </Link>{' '}
            with your trade account to use it.
          </p>
        ) : user.dealer?.status === 'pending' ? (
          <p>Your trade application is with us; you can use it once it is approved.</p>
        ) : (
          <p>
            Workshops and resellers can{' '}
            <Link to="/account/trade-application" className="font-semibold text-temper underline">
              apply for a trade account
            </Link>
            . Until then, add parts from the{' '}
            <Link to="/catalogue" className="font-semibold text-temper underline">
              catalogue
            </Link>
            .
          </p>
        )}
      </div>
    </div>
  );
}
