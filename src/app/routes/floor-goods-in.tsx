import { Link } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { GoodsInPage } from '../../features/warehouse/components/goods-in-page';

export function FloorGoodsInRoute() {
  const me = useMe();
  return (
    <FloorGate me={me}>
      <h1 className="mb-1 text-3xl font-bold">Goods in</h1>
      <p className="mb-4 text-lg text-cast">
        Stock received goes to waiting back-orders first, oldest order first. Count corrections are on{' '}
        <Link to="/floor/stock" className="font-semibold text-temper underline underline-offset-2">
          Stock
        </Link>
        .
      </p>
      <GoodsInPage />
    </FloorGate>
  );
}
