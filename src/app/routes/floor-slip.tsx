import { useParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { PackingSlipPage } from '../../features/warehouse/components/packing-slip';

export function FloorSlipRoute() {
  const me = useMe();
  const number = (useParams().number ?? '').toUpperCase();
  return (
    <FloorGate me={me} nav={false}>
      <PackingSlipPage number={number} />
    </FloorGate>
  );
}
