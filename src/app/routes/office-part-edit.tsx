import { Link, useNavigate, useParams } from 'react-router-dom';
import { ApiError } from '../../lib/api-client';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { useAdminPart } from '../../features/office/api/get-admin-part';
import { OfficeGate, OfficeNav } from '../../features/office/components/office-shell';
import { PartFormView } from '../../features/office/components/part-form';
import { LinksPanel, PhotosPanel, SupersedePanel } from '../../features/office/components/part-extras';
import { officeAccess } from '../../features/office/lib/office-access';

function EditPart({ partNumber }: { partNumber: string | undefined }) {
  const navigate = useNavigate();
  const part = useAdminPart(partNumber);
  const onSaved = (saved: string, created: boolean) => {
    if (created) navigate(`/office/parts/${encodeURIComponent(saved)}`, { replace: true });
  };

  if (!partNumber) {
    return (
      <>
        <h1 className="text-2xl font-bold">New part</h1>
        <p className="text-cast">Photos, links and supersession can be added once the part is created.</p>
        <PartFormView onSaved={onSaved} />
      </>
    );
  }
  if (part.isPending) return <LoadingState label={`Loading ${partNumber}…`} />;
  if (part.isError) {
    return part.error instanceof ApiError && part.error.isNotFound ? (
      <div className="grid gap-2">
        <h1 className="text-2xl font-bold">No part {partNumber}</h1>
        <p className="text-cast">There is no part with that number.</p>
        <p className="flex gap-4">
          <Link to={`/office/parts?q=${encodeURIComponent(partNumber)}`} className="font-semibold text-temper underline underline-offset-2">
            Search for it
          </Link>
          <Link to="/office/parts/new" className="font-semibold text-temper underline underline-offset-2">
            Create it as a new part
          </Link>
        </p>
      </div>
    ) : (
      <ErrorState title="This part did not load" message={part.error.message} onRetry={() => part.refetch()} />
    );
  }
  const p = part.data;
  return (
    <>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="part-no text-lg text-cast">{p.partNumber}</p>
          <h1 className="text-2xl font-bold">Edit {p.title}</h1>
        </div>
        <Link to={`/parts/${encodeURIComponent(p.partNumber)}`} className="font-semibold text-temper underline underline-offset-2">
          See it as buyers do
        </Link>
      </div>
      <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
        <PartFormView key={p.partNumber} part={p} onSaved={onSaved} />
        <div className="grid content-start gap-6">
          <PhotosPanel part={p} />
          <LinksPanel key={p.goesWith.join(',')} part={p} />
          <SupersedePanel key={p.supersededBy ?? ''} part={p} />
        </div>
      </div>
    </>
  );
}

export function OfficePartEditRoute() {
  const me = useMe();
  const { partNumber } = useParams();
  return (
    <OfficeGate access={officeAccess(me)}>
      <div className="grid gap-5">
        <OfficeNav />
        <nav aria-label="Breadcrumb" className="text-sm text-cast">
          <Link to="/office/parts" className="hover:underline">
            Catalogue upkeep
          </Link>{' '}
          / {partNumber ?? 'New part'}
        </nav>
        <EditPart key={partNumber ?? 'new'} partNumber={partNumber} />
      </div>
    </OfficeGate>
  );
}
