import { useParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { PackPage } from '../../features/warehouse/components/pack-page';

export function FloorPackRoute() {
  const me = useMe();
  const number = (useParams().number ?? '').toUpperCase();
  return (
    <FloorGate me={me}>
      <PackPage key={number} number={number} />
    </FloorGate>
  );
}
