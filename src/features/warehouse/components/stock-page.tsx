import { zodResolver } from '@hookform/resolvers/zod';
import { CircleCheckBig, OctagonAlert, Search, SlidersHorizontal, TriangleAlert } from 'lucide-react';
import { useRef, useState, type FormEvent } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { AdjustmentSchema, type StockDetailSchema } from '../../../../shared/schemas/warehouse';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { StatusBadge } from '../../../components/ui/status-badge';
import { TableFrame, Td, Th } from '../../../components/ui/table';
import { ApiError } from '../../../lib/api-client';
import { useAdjustStock, type Adjustment } from '../api/adjust-stock';
import { useBins } from '../api/get-bins';
import { useLowStock } from '../api/get-low-stock';
import { useStock } from '../api/get-stock';
import { formatDateTime } from '../../../../shared/format';
import { normalisePartNumber } from '../lib/pick-progress';
import { useErrorSummary } from '../../../components/ui/error-summary';
import { ErrorSummary, SelectField, TextField } from '../../../components/ui/form';
import { ScanField } from './scan-field';

type StockDetail = z.infer<typeof StockDetailSchema>;
type Bin = StockDetail['bins'][number];

/** A bin's counts agree with its ledger when both on hand and reserved equal the sums of their movements. */
export const ledgerAgrees = (b: Bin) => b.onHand === b.ledgerOnHand && b.reserved === b.ledgerReserved;

const signed = (n: number) => (n > 0 ? `+${n}` : String(n));

export function StockPage({ part, onLookUp }: { part: string | null; onLookUp: (partNumber: string | null) => void }) {
  const [value, setValue] = useState(part ?? '');
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const p = normalisePartNumber(value);
    setValue(p);
    onLookUp(p || null);
  };
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-8">
      <form onSubmit={submit} role="search" aria-label="Look up a part's stock" className="grid gap-3 rounded-lg border-2 border-cast-line bg-white p-4 sm:grid-cols-[minmax(0,1fr)_auto] sm:items-end">
        <ScanField id="stock-part" label="Part number" value={value} onChange={(e) => setValue(e.target.value)} hint="Scan or type, then Enter." />
        <Button type="submit" size="lg" className="mb-7 sm:mb-7">
          <Search aria-hidden className="size-5" />
          Look up
        </Button>
      </form>
      {part ? <PartStock key={part} partNumber={part} /> : null}
      <LowStock onLookUp={(p) => (setValue(p), onLookUp(p))} />
    </div>
  );
}

function PartStock({ partNumber }: { partNumber: string }) {
  const stock = useStock(partNumber);
  if (stock.isPending) return <LoadingState label={`Looking up ${partNumber}…`} />;
  if (stock.error)
    return (
      <ErrorState
        title={stock.error instanceof ApiError && stock.error.isNotFound ? `There is no part ${partNumber}` : 'Stock did not load'}
        message={stock.error.message}
        onRetry={() => void stock.refetch()}
      />
    );
  const s = stock.data;
  const mismatched = s.bins.filter((b) => !ledgerAgrees(b));
  const total = s.bins.reduce((acc, b) => ({ onHand: acc.onHand + b.onHand, reserved: acc.reserved + b.reserved }), { onHand: 0, reserved: 0 });
  return (
    <section aria-labelledby="part-stock-heading" className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <div>
        <h2 id="part-stock-heading" className="part-no text-4xl">
          {s.partNumber}
        </h2>
        <p className="text-xl font-semibold">{s.title}</p>
        <p className="tabular text-lg text-cast">
          {total.onHand} on hand · {total.reserved} reserved · {total.onHand - total.reserved} available
        </p>
      </div>
      {mismatched.length === 0 ? (
        <Notice tone="done" className="w-fit text-lg font-semibold">
          Ledger agrees: every bin’s counts equal the sum of its movements.
        </Notice>
      ) : (
        <Notice tone="problem" size="floor" live="alert" title={`Ledger mismatch in ${mismatched.map((b) => b.binCode).join(', ')}`}>
          <p className="text-ink">The stock count and the movements ledger disagree. Do not adjust; tell the office so the cause is found first.</p>
        </Notice>
      )}
      {s.bins.length === 0 ? (
        <EmptyState title="Not stocked in any bin">Receive it on Goods in to give it a bin.</EmptyState>
      ) : (
        <TableFrame>
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Bins holding {s.partNumber}, with the ledger sums beside the counts</caption>
            <thead className="bg-panel">
              <tr>
                <Th>Bin</Th>
                <Th numeric>On hand</Th>
                <Th numeric>Ledger on hand</Th>
                <Th numeric>Reserved</Th>
                <Th numeric>Ledger reserved</Th>
                <Th>Check</Th>
              </tr>
            </thead>
            <tbody>
              {s.bins.map((b) => (
                <tr key={b.binCode} className={`border-t border-cast-line first:border-t-0 ${ledgerAgrees(b) ? '' : 'bg-oxide-tint'}`}>
                  <Td className="part-no text-2xl">{b.binCode}</Td>
                  <Td numeric className="text-xl font-bold">
                    {b.onHand}
                  </Td>
                  <Td numeric className="text-xl">
                    {b.ledgerOnHand}
                  </Td>
                  <Td numeric className="text-xl">
                    {b.reserved}
                  </Td>
                  <Td numeric className="text-xl">
                    {b.ledgerReserved}
                  </Td>
                  <Td>
                    {ledgerAgrees(b) ? (
                      <span className="inline-flex items-center gap-1 font-semibold text-machined">
                        <CircleCheckBig aria-hidden className="size-5" />
                        agrees
                      </span>
                    ) : (
                      <span className="inline-flex items-center gap-1 font-bold text-oxide">
                        <OctagonAlert aria-hidden className="size-5" />
                        MISMATCH
                      </span>
                    )}
                  </Td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableFrame>
      )}
      <AdjustForm detail={s} />
      <Movements detail={s} />
    </section>
  );
}

const ADJ_FIELDS = [
  { name: 'binCode', id: 'adj-bin', label: 'Bin' },
  { name: 'delta', id: 'adj-delta', label: 'Change' },
  { name: 'reason', id: 'adj-reason', label: 'Reason' },
] as const;

function AdjustForm({ detail }: { detail: StockDetail }) {
  const bins = useBins();
  const adjust = useAdjustStock();
  const form = useForm<Adjustment>({
    resolver: zodResolver(AdjustmentSchema),
    defaultValues: { partNumber: detail.partNumber, binCode: detail.bins[0]?.binCode ?? '', reason: '' },
  });
  const [done, setDone] = useState<string | null>(null);
  const formRef = useRef<HTMLFormElement>(null);
  const summary = useErrorSummary(form, ADJ_FIELDS);
  const errors = form.formState.errors;
  const held = new Set(detail.bins.map((b) => b.binCode));

  const onSubmit = summary.handleSubmit(
    (values) => {
      setDone(null);
      adjust.mutate(values, {
        onSuccess: (r) => {
          setDone(`${signed(values.delta)} in ${values.binCode}: now ${r.onHand} on hand, ${r.reserved} reserved.`);
          // The form's own reset empties the number field too; then the bin just counted stays chosen.
          formRef.current?.reset();
          form.reset({ partNumber: detail.partNumber, binCode: values.binCode, reason: '' });
        },
        onError: (err) => {
          summary.showServerError(err);
        },
      });
    },
  );

  return (
    <form ref={formRef} noValidate onSubmit={onSubmit} aria-labelledby="adj-heading" className="grid gap-4 rounded-lg border-2 border-cast-line bg-white p-4">
      <h3 id="adj-heading" className="flex items-center gap-2 text-xl font-bold">
        <SlidersHorizontal aria-hidden className="size-6 text-temper" />
        Adjust stock
      </h3>
      <p className="flex items-start gap-2 text-cast">
        <TriangleAlert aria-hidden className="mt-0.5 size-5 shrink-0 text-amber" />
        Count the bin before adjusting. Every change is written to the ledger with your reason.
      </p>
      {summary.shown && <ErrorSummary variant="floor" {...summary.props} />}
      {done && (
        <Notice tone="done" size="floor">
          Adjusted {detail.partNumber}: {done}
        </Notice>
      )}
      <input type="hidden" {...form.register('partNumber')} />
      <div className="grid gap-4 sm:grid-cols-3">
        <SelectField variant="floor" id="adj-bin" label="Bin" error={errors.binCode?.message} {...form.register('binCode')}>
          <option value="">Choose a bin</option>
          {detail.bins.map((b) => (
            <option key={b.binCode} value={b.binCode}>
              {b.binCode} (holds {b.onHand})
            </option>
          ))}
          {bins.data?.items
            .filter((b) => !held.has(b.code))
            .map((b) => (
              <option key={b.code} value={b.code}>
                {b.code} (empty)
              </option>
            ))}
        </SelectField>
        <TextField variant="floor" id="adj-delta" label="Change" inputMode="numeric" hint="Found more: 3. Damaged or missing: -2." error={errors.delta?.message} {...form.register('delta', { valueAsNumber: true })} />
        <TextField variant="floor" id="adj-reason" label="Reason" maxLength={120} hint="e.g. cycle count, damaged in handling" error={errors.reason?.message} {...form.register('reason')} />
      </div>
      <div>
        <Button type="submit" size="lg" variant="secondary" disabled={adjust.isPending}>
          {adjust.isPending ? 'Recording…' : 'Record adjustment'}
        </Button>
      </div>
    </form>
  );
}

function Movements({ detail }: { detail: StockDetail }) {
  return (
    <section aria-labelledby="moves-heading">
      <h3 id="moves-heading" className="mb-2 text-xl font-bold">
        Last movements <span className="tabular font-normal text-cast">({detail.movements.length})</span>
      </h3>
      {detail.movements.length === 0 ? (
        <EmptyState title="No movements yet" />
      ) : (
        <TableFrame maxHeight="max-h-[60vh]">
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Ledger movements for {detail.partNumber}, newest first</caption>
            <thead className="sticky top-0 z-10 bg-panel">
              <tr>
                <Th>When</Th>
                <Th>Bin</Th>
                <Th>Kind</Th>
                <Th numeric>On hand</Th>
                <Th numeric>Reserved</Th>
                <Th>Order</Th>
                <Th>Note</Th>
              </tr>
            </thead>
            <tbody>
              {detail.movements.map((m) => (
                <tr key={m.id} className="border-t border-cast-line first:border-t-0">
                  <Td className="whitespace-nowrap">{formatDateTime(m.createdAt)}</Td>
                  <Td className="part-no">{m.binCode}</Td>
                  <Td className="font-semibold">{m.kind}</Td>
                  <Td numeric>{m.onHandDelta === 0 ? '—' : signed(m.onHandDelta)}</Td>
                  <Td numeric>{m.reservedDelta === 0 ? '—' : signed(m.reservedDelta)}</Td>
                  <Td className="part-no">{m.orderNumber ?? '—'}</Td>
                  <Td className="text-cast">{m.note ?? ''}</Td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableFrame>
      )}
    </section>
  );
}

function LowStock({ onLookUp }: { onLookUp: (partNumber: string) => void }) {
  const low = useLowStock();
  return (
    <section aria-labelledby="low-heading">
      <h2 id="low-heading" className="mb-2 text-2xl font-bold">
        Low stock
      </h2>
      <p className="mb-3 text-cast">Parts at or under their minimum, those with customers waiting first.</p>
      {low.isPending ? (
        <LoadingState label="Loading the low-stock list…" />
      ) : low.error ? (
        <ErrorState title="The low-stock list did not load" message={low.error.message} onRetry={() => void low.refetch()} />
      ) : low.data.items.length === 0 ? (
        <EmptyState title="Nothing is low">Every active part is above its minimum.</EmptyState>
      ) : (
        <TableFrame maxHeight="max-h-[60vh]">
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Parts at or under their minimum stock</caption>
            <thead className="sticky top-0 z-10 bg-panel">
              <tr>
                <Th density="floor">Part number</Th>
                <Th density="floor">Title</Th>
                <Th numeric density="floor">Available</Th>
                <Th numeric density="floor">On hand</Th>
                <Th numeric density="floor">Minimum</Th>
                <Th numeric density="floor">Back-orders waiting</Th>
              </tr>
            </thead>
            <tbody>
              {low.data.items.map((i) => (
                <tr key={i.partNumber} className="border-t border-cast-line first:border-t-0">
                  <Td density="floor">
                    <button type="button" onClick={() => onLookUp(i.partNumber)} className="part-no min-h-12 text-lg text-temper underline-offset-2 hover:underline">
                      {i.partNumber}
                    </button>
                  </Td>
                  <Td density="floor">{i.title}</Td>
                  <Td numeric density="floor">
                    <StatusBadge kind="stock" status="low" look="plain">
                      {i.available}
                    </StatusBadge>
                  </Td>
                  <Td numeric density="floor">{i.onHand}</Td>
                  <Td numeric density="floor">{i.minStock}</Td>
                  <Td numeric density="floor">{i.waitingBackorders > 0 ? <span className="font-bold text-oxide">{i.waitingBackorders}</span> : '—'}</Td>
                </tr>
              ))}
            </tbody>
          </table>
        </TableFrame>
      )}
    </section>
  );
}
