import { useSearchParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { ReturnsPage } from '../../features/warehouse/components/returns-page';

export function FloorReturnsRoute() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const status = params.get('status') === 'all' ? 'all' : 'requested';
  const id = Number(params.get('id'));
  const openId = Number.isInteger(id) && id > 0 ? id : null;
  const set = (next: { status: 'requested' | 'all'; id: number | null }) => {
    const p: Record<string, string> = {};
    if (next.status === 'all') p.status = 'all';
    if (next.id !== null) p.id = String(next.id);
    setParams(p);
  };
  return (
    <FloorGate me={me}>
      <h1 className="mb-1 text-3xl font-bold">Returns and cores</h1>
      <p className="mb-4 text-lg text-cast">Receive what came back, grade it and decide. Card orders are refunded to the card; on-account orders get a credit note.</p>
      <ReturnsPage status={status} openId={openId} onStatus={(s) => set({ status: s, id: null })} onOpen={(i) => set({ status, id: i })} />
    </FloorGate>
  );
}
