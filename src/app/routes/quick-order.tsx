import { useQueryClient } from '@tanstack/react-query';
import { useMe } from '../../features/auth/api/get-me';
import { cartKeys } from '../../features/cart/api/keys';
import { QuickOrderPad } from '../../features/trade/components/quick-order-pad';
import { TradeOnly } from '../../features/trade/components/trade-only';

export function QuickOrderRoute() {
  const me = useMe();
  const qc = useQueryClient();
  return (
    <div className="grid min-w-0 gap-4">
      <h1 className="text-3xl font-bold">Quick order</h1>
      <TradeOnly me={me} path="/trade/quick-order" what="The quick-order pad">
        <QuickOrderPad onAdded={() => void qc.invalidateQueries({ queryKey: cartKeys.all })} />
      </TradeOnly>
    </div>
  );
}
