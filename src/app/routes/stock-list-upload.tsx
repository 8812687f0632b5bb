import { useQueryClient } from '@tanstack/react-query';
import { useMe } from '../../features/auth/api/get-me';
import { cartKeys } from '../../features/cart/api/keys';
import { StockListUpload } from '../../features/trade/components/stock-list-upload';
import { TradeOnly } from '../../features/trade/components/trade-only';

export function StockListUploadRoute() {
  const me = useMe();
  const qc = useQueryClient();
  return (
    <div className="grid min-w-0 gap-4">
      <h1 className="text-3xl font-bold">Upload a stock list</h1>
      <TradeOnly me={me} path="/trade/stock-list" what="Stock-list upload">
        <p className="max-w-3xl text-cast">Order a whole list at once: upload it, check every row, fix what needs fixing, then add the good rows to your cart in one step.</p>
        <StockListUpload onAdded={() => void qc.invalidateQueries({ queryKey: cartKeys.all })} />
      </TradeOnly>
    </div>
  );
}
