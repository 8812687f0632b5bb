import { useQueryClient } from '@tanstack/react-query';
import { useMe } from '../../features/auth/api/get-me';
import { cartKeys } from '../../features/cart/api/keys';
import { OrdersList } from '../../features/orders/components/orders-list';

export function OrdersRoute() {
  const qc = useQueryClient();
  const me = useMe();
  return (
    <div className="grid min-w-0 gap-4">
      <h1 className="text-3xl font-bold">Your orders</h1>
      <OrdersList trade={me.data?.user?.role === 'dealer'} onReorderAdded={() => void qc.invalidateQueries({ queryKey: cartKeys.all })} />
    </div>
  );
}
