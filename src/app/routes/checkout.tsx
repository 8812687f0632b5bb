import { useQueryClient } from '@tanstack/react-query';
import { Navigate, useNavigate } from 'react-router-dom';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { authKeys } from '../../features/auth/api/keys';
import { CheckoutForm } from '../../features/cart/components/checkout-form';

export function CheckoutRoute() {
  const me = useMe();
  const navigate = useNavigate();
  const qc = useQueryClient();
  if (me.isPending) return <LoadingState label="Loading checkout…" />;
  if (me.isError) return <ErrorState title="Checkout did not load" message={me.error.message} onRetry={() => me.refetch()} />;
  // The server merges the guest cart into the account at sign-in, so nothing is lost on the way.
  if (!me.data.user) return <Navigate to="/sign-in?next=/checkout" replace />;
  if (me.data.user.role === 'warehouse' || me.data.user.role === 'workshop') {
    return (
      <div className="grid gap-3">
        <h1 className="text-3xl font-bold">Checkout</h1>
        <p>Staff accounts do not place orders. Sign in with a buyer's account to order.</p>
      </div>
    );
  }
  return (
    <div className="grid gap-6">
      <h1 className="text-3xl font-bold">Checkout</h1>
      <CheckoutForm
        me={me.data}
        onPlaced={(number) => {
          // The open balance on a trade account changes with an order on account.
          void qc.invalidateQueries({ queryKey: authKeys.me() });
          navigate(`/orders/${encodeURIComponent(number)}?placed=1`);
        }}
      />
    </div>
  );
}
