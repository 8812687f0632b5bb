import { useSearchParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { parseOrdersParam, PickListPage } from '../../features/warehouse/components/pick-list-page';

export function FloorPickRoute() {
  const me = useMe();
  const [params] = useSearchParams();
  const orders = parseOrdersParam(params.get('orders'));
  return (
    <FloorGate me={me}>
      <PickListPage key={orders.join(',')} orders={orders} />
    </FloorGate>
  );
}
