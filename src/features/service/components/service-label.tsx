import { Printer } from 'lucide-react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { ParcelLabel } from '../../../components/ui/parcel-label';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useServiceLabel } from '../api/get-label';

/** The printable label of a booked unit: where it goes, the request's Code 128, and how to pack it. */
export function ServiceLabelPage({ reference }: { reference: string }) {
  const label = useServiceLabel(reference);
  if (label.isPending) return <LoadingState label={`Loading the label for ${reference}…`} />;
  if (label.isError) {
    const err = label.error;
    return (
      <ErrorState
        title={err instanceof ApiError && err.isNotFound ? `No service request ${reference} on your account` : err instanceof ApiError && err.status === 409 ? `${reference} needs no label now` : 'The label did not load'}
        message={err.message}
      />
    );
  }
  const l = label.data;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
      <style>{'@page { size: A4; margin: 12mm; } @media print { html, body { background: #fff; } }'}</style>
      <div className="no-print grid gap-4">
        <nav aria-label="Breadcrumb" className="text-sm text-cast">
          <Link to={`/service/${l.reference}`} className="hover:underline">
            Service request {l.reference}
          </Link>{' '}
          / Label
        </nav>
        <div className="flex flex-wrap items-end justify-between gap-3">
          <div>
            <h1 className="text-2xl font-bold">
              Service label <span className="part-no">{l.reference}</span>
            </h1>
            <p className="text-cast">Print it and stick it flat on the biggest side of the box. The Bench scans its code when the box arrives.</p>
          </div>
          <Button size="lg" onClick={() => window.print()}>
            <Printer aria-hidden className="size-5" /> Print the label
          </Button>
        </div>
        <Caution title="Packing the unit">
          <ul className="list-disc pl-5">
            <li>Let it cool fully, then drain the oil and cap the oil feed and drain ports.</li>
            <li>Pack it so nothing can touch or strike the wheels: blank the inlet and outlet, pad all round.</li>
            <li>Large units weigh up to about 40 kg: lift those with two people (a {l.frameName} weighs about {l.weightKg} kg).</li>
          </ul>
        </Caution>
      </div>
      <ParcelLabel heading="SERVICE" what="Service" barcodeOf="service request" reference={l.reference} createdAt={l.createdAt} desk="The Bench (workshop)" from={l.from} barcodeSvg={l.barcodeSvg}>
        <dt className="font-semibold">Unit</dt>
        <dd className="part-no">{l.serial}</dd>
        <dt className="font-semibold">Frame</dt>
        <dd>{l.frameName}</dd>
        <dt className="font-semibold">Handle</dt>
        <dd>Oil drained · wheels guarded · {l.weightKg >= 20 ? 'TWO-PERSON LIFT' : 'lift with care'}</dd>
      </ParcelLabel>
    </div>
  );
}
