import { Printer, Scissors } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatDate } from '../../../../shared/format';
import { RETURN_KINDS, type ReturnLabel } from '../../../../shared/schemas/warehouse';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useReturnLabel } from '../api/get-return-label';

/** Where returns go: the distributor's returns desk. */
const RETURNS_DESK = { name: 'Spoolyard Turbo Supply', desk: 'Returns desk', address: 'Unit 7, Foundry Row, Quenchfold' } as const;

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
  // The server draws the bars (bwip-js, Code 128 of the reference); shown as an image so it prints sharp at any size.
  const barcode = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(label.barcodeSvg)}`;
  return (
    <article
      aria-label={`Return label ${label.reference}`}
      className="mx-auto grid w-full max-w-[100mm] gap-3 border-2 border-dashed border-cast bg-white p-4 text-ink print:min-h-[150mm] print:border-ink"
    >
      <header className="flex items-baseline justify-between gap-3 border-b-4 border-ink pb-2">
        <p className="text-3xl font-bold tracking-wide">RETURN</p>
        <p className="text-sm">{formatDate(label.createdAt)}</p>
      </header>
      <section aria-label="Deliver to">
        <p className="text-xs font-semibold uppercase tracking-wider">To</p>
        <p className="text-lg font-bold leading-tight">{RETURNS_DESK.name}</p>
        <p className="leading-tight">{RETURNS_DESK.desk}</p>
        <p className="leading-tight">{RETURNS_DESK.address}</p>
      </section>
      <section aria-label="From">
        <p className="text-xs font-semibold uppercase tracking-wider">From</p>
        <p className="leading-tight">{label.from.name}</p>
        <p className="leading-tight">{label.from.line1}</p>
        <p className="leading-tight">
          {label.from.city} {label.from.postcode}
        </p>
      </section>
      <figure className="grid justify-items-center gap-1 border-y-2 border-ink py-3">
        <img src={barcode} alt={`Barcode of return ${label.reference}`} className="h-24 w-full max-w-[80mm] object-contain [image-rendering:crisp-edges]" />
        <figcaption className="part-no text-2xl tracking-widest">{label.reference}</figcaption>
      </figure>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
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
      </dl>
    </article>
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
