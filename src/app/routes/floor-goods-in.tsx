import { Link } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { GoodsInPage } from '../../features/warehouse/components/goods-in-page';

export function FloorGoodsInRoute() {
  const me = useMe();
  return (
    <FloorGate me={me}>
      <h1 className="mb-2 text-2xl font-bold sm:mb-4 sm:text-3xl">Goods in</h1>
      <GoodsInPage />
      {/* After the form, so a handheld shows the scan field first. */}
      <p className="mt-6 text-lg text-cast">
        Stock received goes to waiting back-orders first, oldest order first. Count corrections are on{' '}
        <Link to="/floor/stock" className="font-semibold text-temper underline underline-offset-2">
          Stock
        </Link>
        .
      </p>
    </FloorGate>
  );
}
