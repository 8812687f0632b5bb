import { useSearchParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { FloorGate } from '../../features/warehouse/components/floor-shell';
import { ReturnsPage } from '../../features/warehouse/components/returns-page';
import { normalizeReturnReference } from '../../../shared/schemas/warehouse';

export function FloorReturnsRoute() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const status = params.get('status') === 'all' ? 'all' : 'requested';
  const page = Math.max(1, Math.trunc(Number(params.get('page'))) || 1);
  const openRef = normalizeReturnReference(params.get('ref') ?? '');
  const set = (next: { status: 'requested' | 'all'; page: number; ref: string | null }) => {
    const p: Record<string, string> = {};
    if (next.status === 'all') p.status = 'all';
    if (next.page > 1) p.page = String(next.page);
    if (next.ref !== null) p.ref = next.ref;
    setParams(p);
  };
  return (
    <FloorGate me={me}>
      <h1 className="mb-1 text-3xl font-bold">Returns and cores</h1>
      <p className="mb-4 text-lg text-cast">Scan the label on what came back, grade it and decide. Card orders are refunded to the card; on-account orders get a credit note.</p>
      <ReturnsPage
        status={status}
        page={page}
        openRef={openRef}
        onStatus={(s) => set({ status: s, page: 1, ref: null })}
        onPage={(p) => set({ status, page: p, ref: openRef })}
        onOpen={(ref) => set({ status, page, ref })}
      />
    </FloorGate>
  );
}
