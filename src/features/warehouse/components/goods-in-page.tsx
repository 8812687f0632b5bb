import { zodResolver } from '@hookform/resolvers/zod';
import { PackagePlus, RotateCcw, Tags } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { GoodsInSchema } from '../../../../shared/schemas/warehouse';
import { Button, buttonClass } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { ApiError } from '../../../lib/api-client';
import { useBins } from '../api/get-bins';
import { useStock } from '../api/get-stock';
import { useReceiveGoods, type GoodsIn } from '../api/receive-goods';
import { resolveScan } from '../api/resolve-scan';
import type { GoodsInReply } from '../api/reply-schemas';
import { normalisePartNumber } from '../lib/pick-progress';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, SelectField, TextField } from '../../../components/ui/form';
import { ScanField } from './scan-field';

const FIELDS = [
  { name: 'partNumber', id: 'gi-part', label: 'Part number' },
  { name: 'binCode', id: 'gi-bin', label: 'Bin' },
  { name: 'quantity', id: 'gi-qty', label: 'Quantity received' },
  { name: 'note', id: 'gi-note', label: 'Note' },
] as const;

export function GoodsInPage() {
  const form = useForm<GoodsIn>({ resolver: zodResolver(GoodsInSchema), defaultValues: { partNumber: '', binCode: '', note: '' } });
  const receive = useReceiveGoods();
  const bins = useBins();
  const [lookup, setLookup] = useState<string | null>(null);
  const stock = useStock(lookup);
  const [result, setResult] = useState<GoodsInReply | null>(null);
  // Every receipt on this screen since it opened: their labels print together.
  const [received, setReceived] = useState<GoodsInReply[]>([]);
  const [binScanned, setBinScanned] = useState<string | null>(null);
  const [scanNote, setScanNote] = useState<string | null>(null);
  const partRef = useRef<HTMLInputElement | null>(null);
  const summary = useErrorSummary(form, FIELDS);
  const errors = form.formState.errors;

  // The part's own bin is the default, where it is already stocked; the receiver can still choose another.
  useEffect(() => {
    if (!stock.data || form.getFieldState('binCode').isDirty) return;
    const home = stock.data.bins.find((b) => b.onHand > 0) ?? stock.data.bins[0];
    if (home) form.setValue('binCode', home.binCode, { shouldValidate: false });
  }, [stock.data, form]);

  // The field takes what a scanner types: a part number, a cross-reference, a GTIN (check digit verified) or a bin's
  // label, which chooses the bin and leaves the field for the part. The server says which (one resolver for the Floor).
  const lookUpPart = () => {
    const raw = form.getValues('partNumber').trim();
    setScanNote(null);
    if (raw.length < 2) return;
    form.clearErrors('partNumber');
    resolveScan(raw, ['part', 'bin']).then(
      (found) => {
        if (found.kind === 'bin') {
          form.setValue('binCode', found.bin.code, { shouldDirty: true });
          form.setValue('partNumber', '');
          setBinScanned(found.bin.code);
          setScanNote(`Bin ${found.bin.code} chosen: now scan the part.`);
          requestAnimationFrame(() => partRef.current?.focus());
          return;
        }
        if (found.kind !== 'part') return;
        const value = found.part.partNumber;
        form.setValue('partNumber', value);
        setLookup(value);
        if (!binScanned) form.resetField('binCode', { defaultValue: '' });
        if (found.via === 'gtin') setScanNote(`GTIN ${found.part.gtin} is ${value}.`);
        requestAnimationFrame(() => document.getElementById('gi-qty')?.focus());
      },
      (err: unknown) => {
        // A part that is not in the catalogue still gets the plain "no part" answer below the field.
        if (err instanceof ApiError && err.isNotFound && !/^\d[\d\s]*$/.test(raw)) {
          const value = normalisePartNumber(raw);
          form.setValue('partNumber', value);
          setLookup(value);
          return;
        }
        form.setError('partNumber', { message: err instanceof Error ? err.message : 'That scan could not be read' });
        requestAnimationFrame(() => partRef.current?.select());
      },
    );
  };

  const onSubmit = summary.handleSubmit(
    (values) => {
      receive.mutate(
        { ...values, partNumber: normalisePartNumber(values.partNumber), note: values.note || undefined },
        {
          onSuccess: (reply) => {
            setResult(reply);
            setReceived((r) => [...r, reply]);
            // No values given: the form's own reset empties every field, the number ones included.
            form.reset();
            setLookup(null);
            setBinScanned(null);
            setScanNote(null);
            requestAnimationFrame(() => partRef.current?.focus());
          },
          onError: (err) => {
            summary.showServerError(err);
          },
        },
      );
    },
  );

  const partRegister = form.register('partNumber');
  const notFound = stock.error instanceof ApiError && stock.error.isNotFound;
  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1.2fr)_minmax(0,1fr)] lg:items-start">
      <form noValidate onSubmit={onSubmit} aria-labelledby="gi-heading" className="grid gap-5 rounded-lg border-2 border-cast-line bg-white p-5">
        <h2 id="gi-heading" className="sr-only sm:not-sr-only sm:flex sm:items-center sm:gap-2 sm:text-2xl sm:font-bold">
          <PackagePlus aria-hidden className="size-7 text-temper" />
          Receive stock
        </h2>
        {summary.shown && <ErrorSummary variant="floor" {...summary.props} />}
        <ScanField
          id="gi-part"
          label="Part number"
          error={errors.partNumber?.message}
          hint="Scan the carton’s label (part number or GTIN) or a bin’s label; Enter looks it up."
          {...partRegister}
          ref={(el) => {
            partRegister.ref(el);
            partRef.current = el;
          }}
          onBlur={(e) => {
            void partRegister.onBlur(e);
            if (normalisePartNumber(e.target.value) !== lookup && e.target.value.trim() && !form.getFieldState('partNumber').error) lookUpPart();
          }}
          onKeyDown={(e) => {
            if (e.key === 'Enter') {
              e.preventDefault();
              lookUpPart();
            }
          }}
        />
        <div aria-live="polite">
          {scanNote && <p className="text-lg font-semibold text-machined">{scanNote}</p>}
          {lookup && stock.isPending && <p className="text-cast">Looking up {lookup}…</p>}
          {notFound && (
            <Notice tone="problem" live="off">
              There is no part {lookup}. Check the label; new parts are added in the Office first.
            </Notice>
          )}
          {stock.data && (
            <p className="text-lg">
              <span className="part-no">{stock.data.partNumber}</span> {stock.data.title}
              <span className="block text-cast">
                {stock.data.bins.length > 0
                  ? `Now in ${stock.data.bins.map((b) => `${b.binCode} (${b.onHand})`).join(', ')}`
                  : 'Not stocked in any bin yet.'}
              </span>
            </p>
          )}
        </div>
        <div className="grid gap-5 sm:grid-cols-2">
          <SelectField variant="floor" id="gi-bin" label="Bin" error={errors.binCode?.message} hint={bins.error ? `Bins did not load: ${bins.error.message}` : 'Defaults to where the part already sits.'} {...form.register('binCode')}>
            <option value="">{bins.isPending ? 'Loading bins…' : 'Choose a bin'}</option>
            {bins.data?.items.map((b) => (
              <option key={b.code} value={b.code}>
                {b.code} · zone {b.zone}
              </option>
            ))}
          </SelectField>
          <TextField variant="floor" id="gi-qty" label="Quantity received" inputMode="numeric" error={errors.quantity?.message} {...form.register('quantity', { valueAsNumber: true })} />
        </div>
        <TextField variant="floor" id="gi-note" label="Note" optional maxLength={120} hint="Supplier delivery note or carton count, up to 120 characters." error={errors.note?.message} {...form.register('note')} />
        <div>
          <Button type="submit" size="lg" disabled={receive.isPending}>
            <PackagePlus aria-hidden className="size-5" />
            {receive.isPending ? 'Receiving…' : 'Receive into bin'}
          </Button>
        </div>
      </form>

      <section aria-labelledby="gi-result-heading" aria-live="polite" className="grid gap-3">
        <h2 id="gi-result-heading" className="text-xl font-bold">
          Last receipt
        </h2>
        {result ? <Receipt reply={result} /> : <p className="rounded-md border border-dashed border-cast-line bg-white/60 p-4 text-cast">Nothing received on this screen yet.</p>}
        {received.length > 0 && <PrintReceived received={received} />}
      </section>
    </div>
  );
}

/** Labels for what was just received: one per unit, in the bin it went to. */
function PrintReceived({ received }: { received: GoodsInReply[] }) {
  const last = received.at(-1)!;
  const units = received.reduce((s, r) => s + r.quantity, 0);
  const link = (list: GoodsInReply[]) => `/floor/labels?receipts=${encodeURIComponent(list.map((r) => r.receipt).join(','))}`;
  return (
    <div className="flex flex-wrap gap-3">
      <Link to={link([last])} className={buttonClass('secondary', 'lg')}>
        <Tags aria-hidden className="size-5" />
        Print labels for {last.receipt} ({last.quantity})
      </Link>
      {received.length > 1 && (
        <Link to={link(received)} className={buttonClass('secondary', 'lg')}>
          <Tags aria-hidden className="size-5" />
          Labels for all {received.length} receipts ({units})
        </Link>
      )}
    </div>
  );
}

function Receipt({ reply }: { reply: GoodsInReply }) {
  return (
    <Notice tone="done" size="floor" live="off" title={`Received into ${reply.binCode} · receipt ${reply.receipt}`}>
      <div className="grid gap-3 text-ink">
        <p className="text-lg">
          <span className="part-no text-2xl">{reply.partNumber}</span> — on hand in {reply.binCode}: <span className="tabular text-2xl font-bold">{reply.onHand}</span>
        </p>
        {reply.released.length > 0 ? (
          <div>
            <p className="flex items-center gap-2 text-lg font-semibold">
              <RotateCcw aria-hidden className="size-5 text-amber" />
              Back-orders released into the pick queue
            </p>
            <ul className="mt-1 grid gap-1">
              {reply.released.map((r) => (
                <li key={r.orderNumber} className="text-lg">
                  <Link to={`/floor/pick?orders=${encodeURIComponent(r.orderNumber)}`} className="part-no text-temper underline underline-offset-2">
                    {r.orderNumber}
                  </Link>{' '}
                  · <span className="tabular">{r.quantity}</span> {r.quantity === 1 ? 'unit' : 'units'}
                </li>
              ))}
            </ul>
          </div>
        ) : (
          <p>No back-orders were waiting for this part.</p>
        )}
      </div>
    </Notice>
  );
}
