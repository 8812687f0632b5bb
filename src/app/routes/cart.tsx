import { useMe } from '../../features/auth/api/get-me';
import { CartPage } from '../../features/cart/components/cart-page';
import { AddToList } from '../../features/lists/components/add-to-list';

export function CartRoute() {
  const me = useMe();
  const dealer = me.data?.user?.role === 'dealer' && me.data.user.dealer?.status === 'approved';
  return <CartPage tradeTools={dealer} saveToList={dealer ? <AddToList source={{ kind: 'cart' }} label="Save the cart to a list" /> : undefined} />;
}
