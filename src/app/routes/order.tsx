import { useQueryClient } from '@tanstack/react-query';
import { useParams, useSearchParams } from 'react-router-dom';
import { useCart } from '../../features/cart/api/get-cart';
import { cartKeys } from '../../features/cart/api/keys';
import { OrderPage } from '../../features/orders/components/order-page';

export function OrderRoute() {
  const { number = '' } = useParams();
  const [params] = useSearchParams();
  const qc = useQueryClient();
  const cart = useCart();
  return <OrderPage number={number} placed={params.get('placed') === '1'} onReorderAdded={() => void qc.invalidateQueries({ queryKey: cartKeys.all })} cartLines={cart.data?.lines} />;
}
