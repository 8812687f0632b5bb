import { useSearchParams } from 'react-router-dom';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { usePriceImport } from '../../features/office/api/get-price-import';
import { OfficeGate, OfficeNav } from '../../features/office/components/office-shell';
import { PriceImportHistoryList } from '../../features/office/components/price-import-history';
import { PriceImportPreview } from '../../features/office/components/price-import-preview';
import { PriceImportUpload } from '../../features/office/components/price-import-upload';
import { officeAccess } from '../../features/office/lib/office-access';

function PriceImports() {
  // The import's id lives in the address so a reload keeps the preview.
  const [params, setParams] = useSearchParams();
  const raw = Number(params.get('import'));
  const id = Number.isInteger(raw) && raw > 0 ? raw : null;
  const current = usePriceImport(id);
  const startOver = () => setParams({});
  const historyPage = Math.max(1, Number(params.get('page')) || 1);

  if (id === null) {
    return (
      <div className="grid gap-8">
        <PriceImportUpload onUploaded={(r) => setParams({ import: String(r.id) })} />
        <PriceImportHistoryList page={historyPage} onPage={(page) => setParams({ page: String(page) })} />
      </div>
    );
  }
  if (current.isPending) return <LoadingState label="Loading the preview…" />;
  if (current.isError) return <ErrorState title="This import did not load" message={current.error.message} onRetry={() => current.refetch()} />;
  return <PriceImportPreview key={current.data.id} result={current.data} onStartOver={startOver} />;
}

export function OfficePriceImportsRoute() {
  const me = useMe();
  return (
    <OfficeGate access={officeAccess(me)}>
      <div className="grid gap-5">
        <OfficeNav />
        <div>
          <h1 className="text-2xl font-bold">Price list import</h1>
          <p className="text-cast">
            Upload a CSV, check what it would change, fix or drop rows in error, look at every flagged price, then apply it all at once.
          </p>
        </div>
        <PriceImports />
      </div>
    </OfficeGate>
  );
}
