import { FileText, Printer, Truck } from 'lucide-react';
import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { formatDateTime } from '../../../../shared/format';
import type { ServiceRequestView } from '../../../../shared/schemas/service';
import { SERVICE_SYMPTOMS, WHEEL_DAMAGE } from '../../../../shared/service';
import { Button, buttonClass } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { Notice } from '../../../components/ui/notice';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useDecideServiceQuote } from '../api/decide';
import { useServiceRequest } from '../api/get-request';
import { APPLICATION_WORDS } from './booking-form';
import { ServiceStatusBadge } from './status';

export interface Payer {
  testMethods: Array<{ id: string; label: string }>;
  live: boolean;
  /** An approved trade account may put service work on account. */
  onAccount: boolean;
}

/** One service request as its customer follows it: the unit, the timeline, the quote to decide on, the way back. */
export function ServiceRequestDetail({ reference, payer, staff }: { reference: string; payer: Payer; staff: boolean }) {
  const q = useServiceRequest(reference);
  if (q.isPending) return <LoadingState label={`Loading ${reference}…`} />;
  if (q.isError) {
    const nf = q.error instanceof ApiError && q.error.isNotFound;
    return <ErrorState title={nf ? `No service request ${reference} on your account` : `${reference} did not load`} message={q.error.message} onRetry={nf ? undefined : () => void q.refetch()} />;
  }
  const r = q.data;
  return (
    <div className="grid gap-6">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-2xl font-bold">
            Service request <span className="part-no">{r.reference}</span>
          </h1>
          <p className="text-cast">
            Unit <span className="part-no">{r.serial}</span> · {r.frameName} ({r.frameCode}), {r.bearing} bearing · {APPLICATION_WORDS[r.application]} · booked {formatDateTime(r.createdAt)}
          </p>
        </div>
        <ServiceStatusBadge status={r.status} />
      </div>

      {r.status === 'booked' && (
        <Notice tone="info" title="Send the unit to the Bench">
          <p>Print the label and fix it to the box. We inspect the unit when it arrives and send you a quote before any work is done.</p>
          <p className="mt-3">
            <Link to={`/service/${r.reference}/label`} className={buttonClass('primary')}>
              <Printer aria-hidden className="size-4" /> Print the label
            </Link>
          </p>
        </Notice>
      )}

      {r.status === 'quoted' && r.quote && !staff && <DecisionPanel r={r} payer={payer} />}

      {r.shipment && (
        <Notice tone="done" title="On its way back">
          <p className="flex flex-wrap items-center gap-2">
            <Truck aria-hidden className="size-5" /> {r.shipment.carrier} <span className="part-no">{r.shipment.trackingNumber}</span>, shipped {formatDateTime(r.shipment.shippedAt)}.
            {r.shipment.trackingUrl && (
              <a href={r.shipment.trackingUrl} className="font-semibold text-temper underline underline-offset-2" rel="noreferrer" target="_blank">
                Track the parcel
              </a>
            )}
          </p>
          {r.invoiceNumber && (
            <p className="mt-3">
              <Link to={`/service/${r.reference}/invoice`} className={buttonClass('secondary')}>
                <FileText aria-hidden className="size-4" /> Invoice {r.invoiceNumber}
              </Link>
            </p>
          )}
        </Notice>
      )}
      {r.shipment && r.decision === 'approve' && (
        <Caution title="Fitting the rebuilt unit">
          <p>Prime the oil supply before the first start. Never touch the wheels: they are sharp and spin past 100,000 rpm. Have a licensed mechanic fit it, to local rules.</p>
        </Caution>
      )}

      <section aria-labelledby="svc-what" className="grid gap-2 rounded-md border border-cast-line bg-white p-4">
        <h2 id="svc-what" className="text-lg font-bold">
          What you told us
        </h2>
        {r.symptoms.length > 0 && (
          <ul className="list-disc pl-5">
            {r.symptoms.map((s) => (
              <li key={s}>{SERVICE_SYMPTOMS[s]}</li>
            ))}
          </ul>
        )}
        {r.symptomNotes && <p>“{r.symptomNotes}”</p>}
        <p className="text-sm text-cast">
          Goes back to {r.returnAddress.name}, {r.returnAddress.line1}, {r.returnAddress.city} {r.returnAddress.postcode}
        </p>
      </section>

      {r.inspection && (
        <section aria-labelledby="svc-found" className="grid gap-2 rounded-md border border-cast-line bg-white p-4">
          <h2 id="svc-found" className="text-lg font-bold">
            What we found
          </h2>
          <dl className="grid gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
            <dt className="font-semibold text-cast">Shaft play, axial</dt>
            <dd className="tabular">
              {r.inspection.axialPlayMm} mm (limit {r.inspection.limits.axial} mm){r.inspection.axialOver ? ' — over the limit' : ' — within'}
            </dd>
            <dt className="font-semibold text-cast">Shaft play, radial</dt>
            <dd className="tabular">
              {r.inspection.radialPlayMm} mm (limit {r.inspection.limits.radial} mm){r.inspection.radialOver ? ' — over the limit' : ' — within'}
            </dd>
            <dt className="font-semibold text-cast">Wheels</dt>
            <dd>
              Compressor: {WHEEL_DAMAGE[r.inspection.compressorWheel]}; turbine: {WHEEL_DAMAGE[r.inspection.turbineWheel]}
            </dd>
            {r.inspection.notes && (
              <>
                <dt className="font-semibold text-cast">Notes</dt>
                <dd>{r.inspection.notes}</dd>
              </>
            )}
          </dl>
        </section>
      )}

      {r.quote && <QuoteTable r={r} />}

      <section aria-labelledby="svc-timeline" className="grid gap-2">
        <h2 id="svc-timeline" className="text-lg font-bold">
          Timeline
        </h2>
        <ol className="grid gap-2 border-l-4 border-cast-line pl-4">
          {r.timeline.map((e, i) => (
            <li key={i} className="relative">
              <span aria-hidden className="absolute -left-[1.45rem] top-1.5 size-3 rounded-full border-2 border-white bg-temper" />
              <p className="font-semibold capitalize">{e.status}</p>
              <p className="text-sm">{e.note}</p>
              <p className="text-sm text-cast">{formatDateTime(e.at)}</p>
            </li>
          ))}
        </ol>
      </section>
    </div>
  );
}

export function QuoteTable({ r }: { r: ServiceRequestView }) {
  const q = r.quote;
  if (!q) return null;
  return (
    <section aria-labelledby="svc-quote" className="grid gap-2 rounded-md border border-cast-line bg-white p-4">
      <h2 id="svc-quote" className="text-lg font-bold">
        Quote
      </h2>
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Quote lines and totals</caption>
        <thead>
          <tr className="border-b border-cast-line">
            <th scope="col" className="py-1 pr-2">
              Item
            </th>
            <th scope="col" className="py-1 pr-2 text-right">
              Qty
            </th>
            <th scope="col" className="py-1 text-right">
              Amount
            </th>
          </tr>
        </thead>
        <tbody className="tabular">
          {q.lines.map((l) => (
            <tr key={l.partNumber} className="border-b border-cast-line/60">
              <td className="py-1 pr-2">
                <span className="part-no">{l.partNumber}</span> {l.title}
              </td>
              <td className="py-1 pr-2 text-right">{l.quantity}</td>
              <td className="py-1 text-right">{formatPrice(l.lineCents)}</td>
            </tr>
          ))}
          <tr className="border-b border-cast-line/60">
            <td className="py-1 pr-2">
              Labour, {q.labourHours} h at {formatPrice(q.labourRateCents)}/h (return carriage included)
            </td>
            <td />
            <td className="py-1 text-right">{formatPrice(q.labourCents)}</td>
          </tr>
          {q.balancingCents > 0 && (
            <tr className="border-b border-cast-line/60">
              <td className="py-1 pr-2">Balancing of the rotating assembly</td>
              <td />
              <td className="py-1 text-right">{formatPrice(q.balancingCents)}</td>
            </tr>
          )}
        </tbody>
        <tfoot className="tabular">
          {q.discountCents > 0 && (
            <tr>
              <th scope="row" colSpan={2} className="py-1 pr-2 text-right font-normal">
                Trade discount on parts (included above)
              </th>
              <td className="py-1 text-right">−{formatPrice(q.discountCents)}</td>
            </tr>
          )}
          <tr>
            <th scope="row" colSpan={2} className="py-1 pr-2 text-right font-normal">
              Tax
            </th>
            <td className="py-1 text-right">{formatPrice(q.taxCents)}</td>
          </tr>
          <tr>
            <th scope="row" colSpan={2} className="py-1 pr-2 text-right">
              Total
            </th>
            <td className="py-1 text-right text-lg font-bold">{formatPrice(q.totalCents)}</td>
          </tr>
        </tfoot>
      </table>
      {q.notes && <p className="text-sm">{q.notes}</p>}
      <p className="text-sm text-cast">
        If the quote is declined, the unit comes back unrepaired and only the inspection fee is charged: {formatPrice(r.inspectionFee.totalCents)} with tax.
      </p>
    </section>
  );
}

function DecisionPanel({ r, payer }: { r: ServiceRequestView; payer: Payer }) {
  const decide = useDecideServiceQuote();
  const [decision, setDecision] = useState<'approve' | 'decline'>('approve');
  const [method, setMethod] = useState<'card' | 'account'>(payer.onAccount ? 'account' : 'card');
  const [card, setCard] = useState(payer.testMethods[0]?.id ?? '');
  const [po, setPo] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const amount = decision === 'approve' ? (r.quote?.totalCents ?? 0) : r.inspectionFee.totalCents;
  const submit = (e: React.FormEvent) => {
    e.preventDefault();
    if (method === 'account' && po.trim() === '') return setProblem('Enter your purchase-order number.');
    if (method === 'card' && card === '') return setProblem('Choose a card.');
    setProblem(null);
    decide.mutate(
      { reference: r.reference, decision: method === 'card' ? { decision, method, paymentMethod: card } : { decision, method, purchaseOrder: po.trim() } },
      { onError: (err) => setProblem(err.message) },
    );
  };
  return (
    <form onSubmit={submit} noValidate aria-labelledby="svc-decide" className="grid gap-4 rounded-md border-2 border-temper bg-white p-4">
      <h2 id="svc-decide" className="text-lg font-bold">
        Your decision
      </h2>
      {problem && (
        <p role="alert" className="rounded border-l-4 border-oxide bg-oxide-tint p-3 font-semibold text-oxide">
          {problem}
        </p>
      )}
      <fieldset className="grid gap-2">
        <legend className="font-semibold">Approve or decline</legend>
        <label className="flex min-h-11 items-center gap-3 rounded-md border border-cast-line px-3 has-[:checked]:border-2 has-[:checked]:border-temper">
          <input type="radio" name="svc-decision" checked={decision === 'approve'} onChange={() => setDecision('approve')} className="size-5 accent-temper" />
          <span>
            Approve the rebuild — <span className="tabular font-semibold">{formatPrice(r.quote?.totalCents ?? 0)}</span>
          </span>
        </label>
        <label className="flex min-h-11 items-center gap-3 rounded-md border border-cast-line px-3 has-[:checked]:border-2 has-[:checked]:border-temper">
          <input type="radio" name="svc-decision" checked={decision === 'decline'} onChange={() => setDecision('decline')} className="size-5 accent-temper" />
          <span>
            Decline: send it back unrepaired — inspection fee <span className="tabular font-semibold">{formatPrice(r.inspectionFee.totalCents)}</span>
          </span>
        </label>
      </fieldset>
      <fieldset className="grid gap-2">
        <legend className="font-semibold">Pay</legend>
        {payer.onAccount && (
          <label className="flex min-h-11 items-center gap-3">
            <input type="radio" name="svc-method" checked={method === 'account'} onChange={() => setMethod('account')} className="size-5 accent-temper" />
            On account (within your credit limit)
          </label>
        )}
        <label className="flex min-h-11 items-center gap-3">
          <input type="radio" name="svc-method" checked={method === 'card'} onChange={() => setMethod('card')} className="size-5 accent-temper" />
          By card, charged now
        </label>
      </fieldset>
      {method === 'account' && (
        <div className="grid max-w-sm gap-1">
          <label htmlFor="svc-po" className="font-semibold">
            Purchase-order number
          </label>
          <input id="svc-po" value={po} onChange={(e) => setPo(e.target.value)} maxLength={40} className="min-h-11 rounded-md border border-cast bg-white px-3" />
        </div>
      )}
      {method === 'card' &&
        (payer.live ? (
          <p className="text-sm">Card payment of service work is not offered online yet: pay on account, or contact the Bench.</p>
        ) : (
          <fieldset className="grid gap-2">
            <legend className="text-sm text-cast">Test mode: choose one of the provider's test cards. No money moves.</legend>
            {payer.testMethods.map((m) => (
              <label key={m.id} className="flex min-h-11 items-center gap-3 rounded-md border border-cast-line px-3 has-[:checked]:border-2 has-[:checked]:border-temper">
                <input type="radio" name="svc-card" value={m.id} checked={card === m.id} onChange={() => setCard(m.id)} className="size-5 accent-temper" />
                {m.label}
              </label>
            ))}
          </fieldset>
        ))}
      <div>
        <Button type="submit" size="lg" disabled={decide.isPending || (method === 'card' && payer.live)}>
          {decide.isPending ? 'Recording…' : `${decision === 'approve' ? 'Approve' : 'Decline'} and ${method === 'card' ? 'pay' : 'put on account'} ${formatPrice(amount)}`}
        </Button>
      </div>
    </form>
  );
}
