import { Printer } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatDate } from '../../../../shared/format';
import { Button } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useServiceLabel } from '../api/get-label';

const BENCH = { name: 'Spoolyard Turbo Supply', desk: 'The Bench (workshop)', address: 'Unit 7, Foundry Row, Quenchfold' } as const;

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
  const barcode = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(l.barcodeSvg)}`;
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
            <li>Large units weigh up to about 40 kg (a {l.frameName} about {l.weightKg} kg): lift with two people.</li>
          </ul>
        </Caution>
      </div>
      <article aria-label={`Service label ${l.reference}`} className="mx-auto grid w-full max-w-[100mm] gap-3 border-2 border-dashed border-cast bg-white p-4 text-ink print:border-ink">
        <header className="flex items-baseline justify-between gap-3 border-b-4 border-ink pb-2">
          <p className="text-3xl font-bold tracking-wide">SERVICE</p>
          <p className="text-sm">{formatDate(l.createdAt)}</p>
        </header>
        <section aria-label="Deliver to">
          <p className="text-xs font-semibold uppercase tracking-wider">To</p>
          <p className="text-lg font-bold leading-tight">{BENCH.name}</p>
          <p className="leading-tight">{BENCH.desk}</p>
          <p className="leading-tight">{BENCH.address}</p>
        </section>
        <section aria-label="From">
          <p className="text-xs font-semibold uppercase tracking-wider">From</p>
          <p className="leading-tight">{l.from.name}</p>
          <p className="leading-tight">{l.from.line1}</p>
          <p className="leading-tight">
            {l.from.city} {l.from.postcode}
          </p>
        </section>
        <figure className="grid justify-items-center gap-1 border-y-2 border-ink py-3">
          <img src={barcode} alt={`Barcode of service request ${l.reference}`} className="h-24 w-full max-w-[80mm] object-contain [image-rendering:crisp-edges]" />
          <figcaption className="part-no text-2xl tracking-widest">{l.reference}</figcaption>
        </figure>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="font-semibold">Unit</dt>
          <dd className="part-no">{l.serial}</dd>
          <dt className="font-semibold">Frame</dt>
          <dd>{l.frameName}</dd>
          <dt className="font-semibold">Handle</dt>
          <dd>Oil drained · wheels guarded · {l.weightKg >= 20 ? 'TWO-PERSON LIFT' : 'lift with care'}</dd>
        </dl>
      </article>
    </div>
  );
}
