import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { PickQueue } from '../../features/warehouse/components/pick-queue';

export function FloorQueueRoute() {
  const me = useMe();
  return (
    <FloorGate me={me}>
      <h1 className="mb-1 text-3xl font-bold">Pick queue</h1>
      <p className="mb-4 text-lg text-cast">Oldest first. Open one order, or tick several to pick them in one walk of the bins.</p>
      <PickQueue />
    </FloorGate>
  );
}
