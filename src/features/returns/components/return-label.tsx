import { Printer, Scissors } from 'lucide-react';
import { Link } from 'react-router-dom';
import { RETURN_KINDS, type ReturnLabel } from '../../../../shared/schemas/warehouse';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ParcelLabel } from '../../../components/ui/parcel-label';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useReturnLabel } from '../api/get-return-label';

const PACKING: Record<ReturnLabel['kind'], string[]> = {
  core: [
    'Let the old unit cool fully before you take it off: the turbine side stays hot long after the engine stops.',
    'Drain the oil, cap or tape the oil and water ports and the flanges, and bag the unit.',
    'Pack it in the box the exchange unit came in, with padding all round.',
  ],
  'wrong-part': ['Send it unfitted, in its own box, with every seal and fitting it came with.', 'Put that box inside an outer carton.'],
  faulty: ['Drain any oil and cap the ports so nothing leaks in transit.', 'Put a note in the box saying what happens, and when.'],
};

function Label({ label }: { label: ReturnLabel }) {
  return (
    <ParcelLabel heading="RETURN" what="Return" barcodeOf="return" reference={label.reference} createdAt={label.createdAt} desk="Returns desk" from={label.from} barcodeSvg={label.barcodeSvg} className="print:min-h-[150mm]">
      <dt className="font-semibold">Contents</dt>
      <dd>
        <span className="tabular">{label.quantity}</span> × <span className="part-no">{label.partNumber}</span>
      </dd>
      <dt className="sr-only">Description</dt>
      <dd className="col-start-2">{label.title}</dd>
      <dt className="font-semibold">Why</dt>
      <dd>{RETURN_KINDS[label.kind]}</dd>
      <dt className="font-semibold">Order</dt>
      <dd className="part-no">{label.orderNumber}</dd>
    </ParcelLabel>
  );
}

/** The return label page: how to pack, a print button, and the label itself (alone on paper). */
export function ReturnLabelPage({ reference }: { reference: string }) {
  const label = useReturnLabel(reference);
  if (label.isPending) return <LoadingState label={`Loading the label for ${reference}…`} />;
  if (label.isError) {
    const err = label.error;
    if (err instanceof ApiError && err.isUnauthorized) {
      return (
        <p className="py-6">
          <Link to={`/sign-in?next=${encodeURIComponent(`/returns/${reference}/label`)}`} className="font-semibold text-temper underline">
            Sign in
          </Link>{' '}
          to print this label.
        </p>
      );
    }
    return (
      <ErrorState
        title={err instanceof ApiError && err.isNotFound ? `No return ${reference} on your account` : err instanceof ApiError && err.status === 409 ? `${reference} needs no label now` : 'The label did not load'}
        message={err.message}
        onRetry={err instanceof ApiError && err.status < 500 ? undefined : () => void label.refetch()}
      />
    );
  }
  const l = label.data;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
      <style>{'@page { size: A4; margin: 12mm; } @media print { html, body { background: #fff; } }'}</style>
      <div className="no-print grid gap-4">
        <nav aria-label="Breadcrumb" className="text-sm text-cast">
          <Link to="/returns" className="hover:underline">
            Your returns
          </Link>{' '}
          / Label <span className="part-no">{l.reference}</span>
        </nav>
        <div className="flex flex-wrap items-end justify-between gap-3">
          <div>
            <h1 className="text-2xl font-bold">
              Return label <span className="part-no">{l.reference}</span>
            </h1>
            <p className="text-cast">Print it, cut along the dashed line and stick it flat on the biggest side of the parcel, away from any seams.</p>
          </div>
          <Button size="lg" onClick={() => window.print()}>
            <Printer aria-hidden className="size-5" /> Print the label
          </Button>
        </div>
        <Notice tone={l.kind === 'core' ? 'warning' : 'info'} title="Packing it" live="off">
          <ul className="list-disc pl-5">
            {PACKING[l.kind].map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        </Notice>
        <p className="flex items-center gap-2 text-sm text-cast">
          <Scissors aria-hidden className="size-4" /> One label per parcel. Keep the reference {l.reference} until we tell you the return is settled.
        </p>
      </div>
      <Label label={l} />
    </div>
  );
}
