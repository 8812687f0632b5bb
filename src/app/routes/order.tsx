import { useQueryClient } from '@tanstack/react-query';
import { useParams, useSearchParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { cartKeys } from '../../features/cart/api/keys';
import { OrderPage } from '../../features/orders/components/order-page';

export function OrderRoute() {
  const { number = '' } = useParams();
  const [params] = useSearchParams();
  const qc = useQueryClient();
  const role = useMe().data?.user?.role;
  return (
    <OrderPage
      number={number}
      placed={params.get('placed') === '1'}
      canReturn={role === 'customer' || role === 'dealer'}
      onReorderAdded={() => void qc.invalidateQueries({ queryKey: cartKeys.all })}
    />
  );
}
