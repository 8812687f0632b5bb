import { useSearchParams } from 'react-router-dom';
import { useMe } from '../../features/auth/api/get-me';
import { OfficeGate, OfficeNav } from '../../features/office/components/office-shell';
import { PartsTable } from '../../features/office/components/parts-table';
import { officeAccess } from '../../features/office/lib/office-access';

export function OfficePartsRoute() {
  const me = useMe();
  const [params, setParams] = useSearchParams();
  const q = params.get('q') ?? '';
  return (
    <OfficeGate access={officeAccess(me)}>
      <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
        <OfficeNav />
        <div>
          <h1 className="text-2xl font-bold">Catalogue upkeep</h1>
          <p className="text-cast">Find a part to edit its details, price, specification, photos and links, or create a new one.</p>
        </div>
        <PartsTable key={q} q={q} onSearch={(next) => setParams(next ? { q: next } : {})} />
      </div>
    </OfficeGate>
  );
}
