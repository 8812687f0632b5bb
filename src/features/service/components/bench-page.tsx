import { FileText, PackageCheck, Undo2 } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { formatDateTime } from '../../../../shared/format';
import type { BenchRequest } from '../../../../shared/schemas/service';
import { BENCH_QUEUES, BENCH_QUEUE_KEYS, SERVICE_SYMPTOMS, WHEEL_DAMAGE, type BenchQueue } from '../../../../shared/service';
import { Button } from '../../../components/ui/button';
import { Pager } from '../../../components/ui/pager';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { TableFrame, Td, Th } from '../../../components/ui/table';
import { ApiError } from '../../../lib/api-client';
import { useReceive } from '../api/bench-actions';
import { useBenchQueue } from '../api/bench-queue';
import { useBenchRequest } from '../api/bench-request';
import { APPLICATION_WORDS } from './booking-form';
import { InspectForm, QuoteForm, RebuildForm, ShipForm } from './bench-steps';
import { QuoteTable } from './request-detail';
import { ServiceStatusBadge } from './status';

/** The Bench: the scan field on top, the open request's next step, and the queues by state. */
export function BenchPage({
  queue,
  page,
  openRef,
  scan,
  onQueue,
  onPage,
  onOpen,
}: {
  queue: BenchQueue;
  page: number;
  openRef: string | null;
  scan: ReactNode;
  onQueue: (q: BenchQueue) => void;
  onPage: (p: number) => void;
  onOpen: (ref: string | null) => void;
}) {
  const list = useBenchQueue(queue, page);
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      {scan}
      {openRef && <OpenRequest reference={openRef} onClose={() => onOpen(null)} />}
      <nav aria-label="Bench queues" className="flex flex-wrap gap-2">
        {BENCH_QUEUE_KEYS.map((k) => (
          <button
            key={k}
            type="button"
            aria-current={queue === k ? 'page' : undefined}
            onClick={() => onQueue(k)}
            className={`inline-flex min-h-12 items-center gap-2 rounded-md border-2 px-3 text-base font-semibold sm:text-lg ${
              queue === k ? 'border-temper bg-temper-tint text-temper-deep' : 'border-cast-line bg-white text-ink hover:border-temper'
            }`}
          >
            {BENCH_QUEUES[k].label}
            <span className="tabular rounded-full bg-white px-2 text-base text-ink ring-1 ring-cast-line">{list.data?.counts[k] ?? '·'}</span>
          </button>
        ))}
      </nav>
      {list.isPending ? (
        <LoadingState label="Loading the queue…" />
      ) : list.isError ? (
        <ErrorState title="The queue did not load" message={list.error.message} onRetry={() => void list.refetch()} />
      ) : list.data.items.length === 0 ? (
        <EmptyState title="Nothing here">Requests appear here as they reach this step.</EmptyState>
      ) : (
        <>
          <TableFrame>
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">{BENCH_QUEUES[queue].label}, newest first</caption>
              <thead className="bg-panel">
                <tr>
                  <Th density="floor">Request</Th>
                  <Th density="floor">Unit</Th>
                  <Th density="floor">Customer</Th>
                  <Th density="floor">Status</Th>
                  <Th density="floor">
                    <span className="sr-only">Actions</span>
                  </Th>
                </tr>
              </thead>
              <tbody>
                {list.data.items.map((r) => (
                  <tr key={r.reference} className={`border-t border-cast-line ${r.reference === openRef ? 'bg-temper-tint/60' : ''}`}>
                    <Td density="floor" className="part-no">
                      {r.reference}
                    </Td>
                    <Td density="floor">
                      <span className="part-no">{r.serial}</span> <span className="text-cast">{r.frameCode}</span>
                    </Td>
                    <Td density="floor">
                      {r.companyName ?? r.customer}
                      <span className="block text-sm text-cast">{formatDateTime(r.updatedAt)}</span>
                    </Td>
                    <Td density="floor">
                      <ServiceStatusBadge status={r.status} />
                    </Td>
                    <Td density="floor" className="text-right">
                      <Button variant="secondary" className="min-h-12" onClick={() => onOpen(r.reference)} aria-label={`Open ${r.reference}`}>
                        Open
                      </Button>
                    </Td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableFrame>
          <Pager label="Pages of this queue" size="lg" page={list.data.page} pageSize={list.data.pageSize} total={list.data.total} onPage={onPage} />
        </>
      )}
    </div>
  );
}

function OpenRequest({ reference, onClose }: { reference: string; onClose: () => void }) {
  const q = useBenchRequest(reference);
  if (q.isPending) return <LoadingState label={`Opening ${reference}…`} />;
  if (q.isError) {
    return <ErrorState title={q.error instanceof ApiError && q.error.isNotFound ? `No service request ${reference}` : `${reference} did not load`} message={q.error.message} />;
  }
  const data = q.data;
  const r = data.request;
  return (
    <section aria-labelledby="bench-open" className="grid gap-5 rounded-lg border-4 border-temper bg-white p-4 sm:p-5">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id="bench-open" className="text-2xl font-bold">
            <span className="part-no">{r.reference}</span> · unit <span className="part-no">{r.serial}</span>
          </h2>
          <p className="text-lg text-cast">
            {r.companyName ?? r.customer} · {r.frameName} ({r.frameCode}), {r.bearing} bearing · {APPLICATION_WORDS[r.application]}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <ServiceStatusBadge status={r.status} />
          <Button variant="quiet" size="lg" onClick={onClose}>
            <Undo2 aria-hidden className="size-5" /> Close
          </Button>
        </div>
      </div>
      <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
        <dt className="font-semibold text-cast">Customer says</dt>
        <dd>
          {[...r.symptoms.map((s) => SERVICE_SYMPTOMS[s]), r.symptomNotes && `“${r.symptomNotes}”`].filter(Boolean).join(' · ') || '—'}
        </dd>
        {r.receivedAt && (
          <>
            <dt className="font-semibold text-cast">Received</dt>
            <dd>
              {formatDateTime(r.receivedAt)} by {r.receivedBy}
            </dd>
          </>
        )}
        {r.inspection && (
          <>
            <dt className="font-semibold text-cast">Inspection</dt>
            <dd>
              Axial {r.inspection.axialPlayMm} mm {r.inspection.axialOver ? '(OVER)' : '(ok)'}, radial {r.inspection.radialPlayMm} mm {r.inspection.radialOver ? '(OVER)' : '(ok)'}; compressor{' '}
              {WHEEL_DAMAGE[r.inspection.compressorWheel].toLowerCase()}, turbine {WHEEL_DAMAGE[r.inspection.turbineWheel].toLowerCase()}
            </dd>
          </>
        )}
        {r.decision && (
          <>
            <dt className="font-semibold text-cast">Customer decided</dt>
            <dd>
              {r.decision === 'approve' ? 'Approved' : 'Declined'} · {formatPrice(r.chargeCents)} {r.paymentState === 'paid' ? 'paid by card' : 'on account'}
            </dd>
          </>
        )}
      </dl>
      {r.photos.length > 0 && (
        <ul aria-label="Photos" className="flex flex-wrap gap-2">
          {r.photos.map((p, i) => (
            <li key={p.name}>
              <a href={`/api/service/photos/${p.name}`} target="_blank" rel="noreferrer" className="block rounded border border-cast-line p-1">
                <img src={`/api/service/photos/${p.name}`} alt={`Photo ${i + 1} (${p.stage})`} className="h-28 w-auto" loading="lazy" />
              </a>
            </li>
          ))}
        </ul>
      )}
      <NextStep data={data} />
    </section>
  );
}

function NextStep({ data }: { data: BenchRequest }) {
  const r = data.request;
  const receive = useReceive();
  switch (r.status) {
    case 'booked':
      return (
        <div className="grid gap-2">
          <p className="text-lg">Not received yet. Scan its label when the box arrives, or receive it here.</p>
          <div>
            <Button size="lg" onClick={() => receive.mutate(r.reference)} disabled={receive.isPending}>
              <PackageCheck aria-hidden className="size-5" /> Receive {r.reference}
            </Button>
          </div>
        </div>
      );
    case 'received':
      return <InspectForm data={data} />;
    case 'inspected':
      return (
        <div className="grid gap-8">
          <QuoteForm data={data} />
          <details className="rounded-md border border-cast-line p-3">
            <summary className="min-h-11 cursor-pointer text-lg font-semibold">Correct the inspection</summary>
            <InspectForm data={data} />
          </details>
        </div>
      );
    case 'quoted':
      return (
        <div className="grid gap-3">
          <p className="rounded-md bg-amber-tint p-3 text-lg">Waiting for the customer to approve or decline. They have been e-mailed.</p>
          <QuoteTable r={r} />
        </div>
      );
    case 'approved':
      return <RebuildForm data={data} />;
    case 'rebuilt':
    case 'declined':
      return <ShipForm data={data} />;
    case 'shipped':
      return (
        <div className="grid gap-2 text-lg">
          <p>
            Shipped with {r.shipment?.carrier} <span className="part-no">{r.shipment?.trackingNumber}</span>.
          </p>
          {r.invoiceNumber && (
            <p>
              <Link to={`/service/${r.reference}/invoice`} className="inline-flex min-h-11 items-center gap-1 font-semibold text-temper underline underline-offset-2">
                <FileText aria-hidden className="size-5" /> Invoice {r.invoiceNumber}
              </Link>
            </p>
          )}
        </div>
      );
  }
}
