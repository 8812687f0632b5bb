import { useMe } from '../../features/auth/api/get-me';
import { CartPage } from '../../features/cart/components/cart-page';

export function CartRoute() {
  const me = useMe();
  const dealer = me.data?.user?.role === 'dealer' && me.data.user.dealer?.status === 'approved';
  return <CartPage tradeTools={dealer} />;
}
