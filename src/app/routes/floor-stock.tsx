import { useSearchParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { StockPage } from '../../features/warehouse/components/stock-page';

export function FloorStockRoute() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const part = params.get('part')?.trim().toUpperCase() || null;
  return (
    <FloorGate me={me}>
      <h1 className="mb-2 text-2xl font-bold sm:mb-4 sm:text-3xl">Stock</h1>
      <StockPage part={part} onLookUp={(p) => setParams(p ? { part: p } : {})} />
    </FloorGate>
  );
}
