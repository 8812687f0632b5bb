import { useQueryClient } from '@tanstack/react-query';
import { useParams, useSearchParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { useCart } from '../../features/cart/api/get-cart';
import { cartKeys } from '../../features/cart/api/keys';
import { AddToList } from '../../features/lists/components/add-to-list';
import { OrderPage } from '../../features/orders/components/order-page';

export function OrderRoute() {
  const { number = '' } = useParams();
  const [params] = useSearchParams();
  const qc = useQueryClient();
  const me = useMe();
  const dealer = me.data?.user?.role === 'dealer' && me.data.user.dealer?.status === 'approved';
  const role = me.data?.user?.role;
  const cart = useCart();
  return (
    <OrderPage
      number={number}
      placed={params.get('placed') === '1'}
      onReorderAdded={() => void qc.invalidateQueries({ queryKey: cartKeys.all })}
      saveToList={dealer ? <AddToList source={{ kind: 'order', orderNumber: number }} label="Save the order to a list" /> : undefined}
      canReturn={role === 'customer' || role === 'dealer'}
      cartLines={cart.data?.lines}
    />
  );
}
