import { zodResolver } from '@hookform/resolvers/zod';
import { FileText, ListChecks, PackageCheck, Truck, Undo2 } from 'lucide-react';
import { useState, type FormEvent } from 'react';
import { useForm } from 'react-hook-form';
import { Link, useLocation } from 'react-router-dom';
import type { OrderDetail } from '../../../../shared/schemas/orders';
import { CARRIERS, DispatchSchema, PackSchema } from '../../../../shared/schemas/warehouse';
import { Button, buttonClass } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { TableFrame, Td, Th } from '../../../components/ui/table';
import { ApiError } from '../../../lib/api-client';
import { useDispatchOrder } from '../api/dispatch-order';
import { useOrder } from '../../../lib/orders';
import { usePackOrder } from '../api/pack-order';
import type { DispatchReply } from '../api/reply-schemas';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, SelectField, TextField } from '../../../components/ui/form';
import { ScanField } from './scan-field';
import { ScanFeedback, type ScanOutcome } from './scan-feedback';
import { resolveScan } from '../api/resolve-scan';

const PackDispatchFormSchema = PackSchema.extend({ carrier: DispatchSchema.shape.carrier, trackingNumber: DispatchSchema.shape.trackingNumber });
type PackDispatchForm = { cartons: number; weightKg: number; carrier: (typeof CARRIERS)[number]; trackingNumber: string };

const FIELDS = [
  { name: 'cartons', id: 'pack-cartons', label: 'Cartons' },
  { name: 'weightKg', id: 'pack-weight', label: 'Packed weight' },
  { name: 'carrier', id: 'pack-carrier', label: 'Carrier' },
  { name: 'trackingNumber', id: 'pack-tracking', label: 'Tracking number' },
] as const;

/** Lines with units still on the shelf: picked less than ordered, less what is back-ordered. */
export const unpickedLines = (order: OrderDetail) => order.lines.filter((l) => l.quantityPicked < l.quantity - l.quantityBackordered);

export function PackPage({ number }: { number: string }) {
  const order = useOrder(number);
  const location = useLocation();
  const flash = (location.state as { flash?: string } | null)?.flash;
  const [dispatched, setDispatched] = useState<DispatchReply | null>(null);

  if (order.isPending) return <LoadingState label={`Loading ${number}…`} />;
  if (order.error)
    return (
      <>
        <h1 className="text-3xl font-bold">Pack and dispatch {number}</h1>
        <ErrorState
          title={order.error instanceof ApiError && order.error.isNotFound ? `There is no order ${number}` : 'The order did not load'}
          message={order.error.message}
          onRetry={() => void order.refetch()}
        />
      </>
    );

  const o = order.data;
  if (dispatched) return <Dispatched order={o} reply={dispatched} />;
  const waiting = unpickedLines(o);
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold sm:text-3xl">
            Pack and dispatch <span className="tabular whitespace-nowrap">{o.number}</span>
          </h1>
          <p className="text-lg text-cast">
            {o.dealer?.companyName ?? o.delivery.name} · {o.delivery.city} · {o.lines.length} {o.lines.length === 1 ? 'line' : 'lines'}
          </p>
        </div>
        <div className="flex flex-wrap gap-3">
          <Link to={`/floor/orders/${encodeURIComponent(o.number)}/slip`} className={buttonClass('secondary', 'lg')}>
            <FileText aria-hidden className="size-5" />
            Packing slip
          </Link>
          <Link to="/floor" className={buttonClass('quiet', 'lg')}>
            <Undo2 aria-hidden className="size-5" />
            Queue
          </Link>
        </div>
      </div>

      {flash && (
        <Notice tone="done" size="floor" title={flash} />
      )}

      <PackedLines order={o} />

      {o.status === 'dispatched' ? (
        <AlreadyDispatched order={o} />
      ) : waiting.length > 0 ? (
        <Notice tone="warning" size="floor" live="off" title="Still to pick">
          <p className="text-ink">{waiting.map((l) => l.partNumber).join(', ')}. Pick every line before packing.</p>
          <Link to={`/floor/pick?orders=${encodeURIComponent(o.number)}`} className={`${buttonClass('primary', 'lg')} mt-3`}>
            <ListChecks aria-hidden className="size-5" />
            Open the pick list
          </Link>
        </Notice>
      ) : (
        <>
          <PackCheck order={o} />
          <PackForm order={o} onDispatched={setDispatched} />
        </>
      )}
    </div>
  );
}

function PackedLines({ order }: { order: OrderDetail }) {
  return (
    <TableFrame>
      <table className="w-full border-collapse text-left">
        <caption className="sr-only">Lines in this order</caption>
        <thead className="bg-panel">
          <tr>
            <Th>Part number</Th>
            <Th>Title</Th>
            <Th numeric>Ordered</Th>
            <Th numeric>Picked</Th>
            <Th numeric>Back-ordered</Th>
          </tr>
        </thead>
        <tbody>
          {order.lines.map((l) => (
            <tr key={l.id} className="border-t border-cast-line first:border-t-0">
              <Td className="part-no text-lg">{l.partNumber}</Td>
              <Td>
                {l.title}
                {l.serials.length > 0 && (
                  <span className="block text-sm">
                    {l.serials.length === 1 ? 'Serial' : 'Serials'}: <span className="part-no">{l.serials.join(', ')}</span>
                  </span>
                )}
              </Td>
              <Td numeric>{l.quantity}</Td>
              <Td numeric className="font-semibold">
                {l.quantityPicked}
              </Td>
              <Td numeric>{l.quantityBackordered > 0 ? <span className="font-semibold text-amber">{l.quantityBackordered}</span> : '—'}</Td>
            </tr>
          ))}
        </tbody>
      </table>
    </TableFrame>
  );
}

/**
 * A last check at the bench: scan each part (its number or the GTIN on its label) as it goes into the carton, and
 * the screen says whether it belongs to this order. Nothing is recorded; the pick already was.
 */
function PackCheck({ order }: { order: OrderDetail }) {
  const [code, setCode] = useState('');
  const [outcome, setOutcome] = useState<ScanOutcome | null>(null);
  const [stamp, setStamp] = useState(0);
  const show = (o: ScanOutcome) => {
    setOutcome(o);
    setStamp((s) => s + 1);
  };
  const onScan = (e: FormEvent) => {
    e.preventDefault();
    const typed = code.trim();
    setCode('');
    if (!typed) return;
    resolveScan(typed, ['part']).then(
      (found) => {
        if (found.kind !== 'part') return;
        const line = order.lines.find((l) => l.partNumber === found.part.partNumber);
        if (line) show({ kind: 'ok', title: `${found.part.partNumber} belongs in this carton`, detail: `${line.quantityPicked} picked for ${order.number}: ${line.title}` });
        else show({ kind: 'refused', title: `${found.part.partNumber} is not on ${order.number}`, detail: 'Put it aside and check the pick.' });
      },
      (err: unknown) => show({ kind: 'refused', title: err instanceof Error ? err.message : 'That scan could not be read' }),
    );
  };
  return (
    <form onSubmit={onScan} aria-label="Check a part before packing" className="grid gap-3 rounded-lg border-2 border-cast-line bg-white p-4">
      <ScanField
        id="pack-check"
        label="Check a part going into the carton"
        keepFocus={false}
        value={code}
        onChange={(e) => setCode(e.target.value)}
        hint="Its part number or GTIN; the scanner ends with Enter. Nothing is recorded."
      />
      <ScanFeedback outcome={outcome} stamp={stamp} label="Last check" idle="Scan a part to check it against this order." />
    </form>
  );
}

function PackForm({ order, onDispatched }: { order: OrderDetail; onDispatched: (r: DispatchReply) => void }) {
  const goodsKg = Math.round(order.totals.weightGrams / 100) / 10;
  const form = useForm<PackDispatchForm>({
    resolver: zodResolver(PackDispatchFormSchema),
    defaultValues: { cartons: order.dispatch.cartons ?? 1, weightKg: goodsKg > 0 ? goodsKg : undefined, trackingNumber: '' },
  });
  const pack = usePackOrder();
  const dispatch = useDispatchOrder();
  const summary = useErrorSummary(form, FIELDS);
  const errors = form.formState.errors;
  const busy = pack.isPending || dispatch.isPending;

  const onSubmit = summary.handleSubmit(
    async (values) => {
      try {
        // Packing records cartons and weight; an order already packed goes straight to dispatch.
        if (order.status !== 'packed') await pack.mutateAsync({ orderNumber: order.number, pack: { cartons: values.cartons, weightKg: values.weightKg } });
        const reply = await dispatch.mutateAsync({ orderNumber: order.number, dispatch: values });
        onDispatched(reply);
      } catch (err) {
        summary.showServerError(err);
      }
    },
  );

  return (
    <form noValidate onSubmit={onSubmit} aria-labelledby="pack-heading" className="grid gap-5 rounded-lg border-2 border-cast-line bg-white p-5">
      <h2 id="pack-heading" className="flex items-center gap-2 text-2xl font-bold">
        <PackageCheck aria-hidden className="size-7 text-temper" />
        Pack and dispatch
      </h2>
      {summary.shown && <ErrorSummary variant="floor" {...summary.props} />}
      <div className="grid gap-5 sm:grid-cols-2">
        <TextField
          variant="floor"
          id="pack-cartons"
          label="Cartons"
          inputMode="numeric"
          autoFocus
          error={errors.cartons?.message}
          hint="How many cartons go on the pallet or in the van."
          {...form.register('cartons', { valueAsNumber: true })}
        />
        <TextField
          variant="floor"
          id="pack-weight"
          label="Packed weight"
          inputMode="decimal"
          suffix="kg"
          error={errors.weightKg?.message}
          hint={goodsKg > 0 ? `The goods weigh ${goodsKg} kg; weigh the packed cartons.` : 'Weigh the packed cartons.'}
          {...form.register('weightKg', { valueAsNumber: true })}
        />
        <SelectField variant="floor" id="pack-carrier" label="Carrier" error={errors.carrier?.message} defaultValue="" {...form.register('carrier')}>
          <option value="" disabled>
            Choose a carrier
          </option>
          {CARRIERS.map((c) => (
            <option key={c} value={c}>
              {c}
            </option>
          ))}
        </SelectField>
        <ScanField
          id="pack-tracking"
          label="Tracking number"
          keepFocus={false}
          error={errors.trackingNumber?.message}
          hint="Scan the carrier’s label or type it. For a collection, type the collection reference."
          {...form.register('trackingNumber')}
        />
      </div>
      <div>
        <Button type="submit" size="lg" disabled={busy}>
          <Truck aria-hidden className="size-5" />
          {busy ? 'Dispatching…' : 'Dispatch'}
        </Button>
      </div>
    </form>
  );
}

function Dispatched({ order, reply }: { order: OrderDetail; reply: DispatchReply }) {
  return (
    <section aria-labelledby="dispatched-heading" className="grid gap-5">
      <h1 id="dispatched-heading" className="text-3xl font-bold">
        Dispatched <span className="tabular whitespace-nowrap">{order.number}</span>
      </h1>
      <Notice
        tone="done"
        size="floor"
        title={
          <>
            {reply.shipment.carrier} · tracking <span className="part-no text-2xl">{reply.shipment.trackingNumber}</span>
          </>
        }
      >
        <div className="text-ink">
          <p className="tabular text-lg">
            {reply.shipment.cartons ?? '—'} {reply.shipment.cartons === 1 ? 'carton' : 'cartons'} · {reply.shipment.units} {reply.shipment.units === 1 ? 'unit' : 'units'}
          </p>
          <p className="mt-2 text-lg">The customer has been e-mailed the tracking number.</p>
        </div>
      </Notice>
      <div className="flex flex-wrap gap-3">
        <Link to="/floor" className={buttonClass('primary', 'lg')}>
          Next order
        </Link>
        <Link to={`/floor/orders/${encodeURIComponent(order.number)}/slip`} className={buttonClass('secondary', 'lg')}>
          <FileText aria-hidden className="size-5" />
          Packing slip
        </Link>
      </div>
    </section>
  );
}

function AlreadyDispatched({ order }: { order: OrderDetail }) {
  return (
    <Notice tone="done" live="off" className="text-lg">
      <span className="inline-flex items-center gap-2 font-semibold">
        <Truck aria-hidden className="size-5" />
        Already dispatched
      </span>
      {order.dispatch.carrier && <> with {order.dispatch.carrier}</>}
      {order.dispatch.trackingNumber && (
        <>
          , tracking <span className="part-no">{order.dispatch.trackingNumber}</span>
        </>
      )}
      . An order leaves the building once.
    </Notice>
  );
}
