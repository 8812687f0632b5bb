import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { LabelsPage } from '../../features/warehouse/components/labels-page';

export function FloorLabelsRoute() {
  const me = useMe();
  return (
    <FloorGate me={me}>
      <h1 className="no-print mb-2 text-2xl font-bold sm:mb-4 sm:text-3xl">Label sheets</h1>
      <LabelsPage />
    </FloorGate>
  );
}
