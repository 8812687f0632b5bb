import { PencilLine, XCircle } from 'lucide-react';
import { useState } from 'react';
import { formatPrice } from '../../../../shared/catalog';
import { formatDateTime } from '../../../../shared/format';
import type { OrderChangeResult, OrderChangeView } from '../../../../shared/schemas/order-changes';
import type { OrderDetail } from '../../../../shared/schemas/orders';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useChangeOrder } from '../api/change-order';
import { useOrderChanges } from '../api/get-order-changes';

const qtyClass = 'min-h-10 w-20 rounded-md border border-cast-line bg-white px-2 text-right tabular focus:border-temper';

/** How the money followed a change, in the buyer's words. */
function moneyWords(c: OrderChangeView): string {
  if (c.settlement === 'payment-cancelled') return 'Card payment cancelled: no money was taken.';
  if (c.settlement === 'amended-invoice') return c.kind === 'cancel' ? `Invoice of ${formatPrice(c.beforeTotalCents)} cancelled.` : `Invoice amended to ${formatPrice(c.afterTotalCents)} (${formatPrice(c.adjustmentCents)} less).`;
  if (c.refundState === 'refunded') return `${formatPrice(c.adjustmentCents)} refunded to your card.`;
  return `${formatPrice(c.adjustmentCents)} to be refunded to your card: waiting for the card provider.`;
}

function ChangeHistory({ changes }: { changes: OrderChangeView[] }) {
  return (
    <section aria-labelledby="changes-heading" className="grid gap-2">
      <h2 id="changes-heading" className="text-xl font-bold">
        Your changes
      </h2>
      <ol className="grid gap-2">
        {changes.map((c) => (
          <li key={c.id} className="rounded-md bg-white p-3 ring-1 ring-cast-line">
            <p className="font-semibold">
              {c.kind === 'cancel' ? 'Order cancelled' : 'Quantities lowered'} · <time dateTime={c.createdAt}>{formatDateTime(c.createdAt)}</time>
            </p>
            {c.kind === 'change' && (
              <ul className="text-sm">
                {c.lines.map((l) => (
                  <li key={l.partNumber}>
                    <span className="part-no">{l.partNumber}</span>: {l.after === 0 ? <>taken off (was {l.before})</> : <>{l.before} → {l.after}</>}
                  </li>
                ))}
              </ul>
            )}
            <p className="text-sm">
              Total {formatPrice(c.beforeTotalCents)} → {formatPrice(c.afterTotalCents)}. <span className="font-semibold">{moneyWords(c)}</span>
            </p>
          </li>
        ))}
      </ol>
    </section>
  );
}

/**
 * Lowering quantities, taking lines off and cancelling, while the warehouse has not started picking; once it has,
 * the reason instead of the buttons. The server prices the change; the page shows its answer.
 */
export function OrderChanges({ order }: { order: OrderDetail }) {
  const changes = useOrderChanges(order.number);
  const { change, cancel } = useChangeOrder();
  const [mode, setMode] = useState<'idle' | 'edit' | 'cancel'>('idle');
  const [quantities, setQuantities] = useState<Record<number, string>>({});
  const [result, setResult] = useState<OrderChangeResult | null>(null);
  if (!changes.data) return null;
  const { changeability, changes: history } = changes.data;
  const failure = change.error ?? cancel.error;
  const money =
    order.paymentMethod === 'account'
      ? 'The invoice is amended to match.'
      : order.status === 'pending_payment'
        ? 'The card payment is cancelled; nothing is taken.'
        : 'The difference goes back to your card.';
  const edited = order.lines
    .map((l) => ({ line: l, text: quantities[l.id] ?? String(l.quantity) }))
    .map(({ line, text }) => ({ line, n: /^\d+$/.test(text.trim()) ? Number(text) : null }));
  const invalid = edited.find(({ line, n }) => n === null || n > line.quantity);
  const lowered = edited.filter(({ line, n }) => n !== null && n < line.quantity);

  return (
    <div className="grid gap-4">
      {result && mode === 'idle' && (
        <Notice tone="done" title={result.change.kind === 'cancel' ? 'Order cancelled' : 'Order changed'}>
          {result.message}
        </Notice>
      )}
      {failure && (
        <Notice tone="problem" title="Nothing was changed" live="alert">
          {failure.message}
        </Notice>
      )}
      {(changeability.canChange || changeability.canCancel) && mode === 'idle' && (
        <section aria-labelledby="change-heading" className="grid gap-2 rounded-lg bg-panel p-4">
          <h2 id="change-heading" className="text-xl font-bold">
            Change or cancel
          </h2>
          <p>
            {changeability.canChange
              ? `Until the warehouse starts picking you can lower quantities, take lines off or cancel the order. ${money} To add parts, place a new order.`
              : `${changeability.reason ?? ''} ${money}`}
          </p>
          <div className="flex flex-wrap gap-2">
            {changeability.canChange && (
              <Button variant="secondary" onClick={() => {
                  change.reset();
                  setQuantities({});
                  setMode('edit');
                }}>
                <PencilLine aria-hidden className="size-4" />
                Change quantities
              </Button>
            )}
            {changeability.canCancel && (
              <Button variant="secondary" onClick={() => {
                  cancel.reset();
                  setMode('cancel');
                }}>
                <XCircle aria-hidden className="size-4" />
                Cancel order
              </Button>
            )}
          </div>
        </section>
      )}
      {mode === 'edit' && (
        <form
          aria-labelledby="edit-heading"
          className="grid gap-3 rounded-lg bg-white p-4 ring-2 ring-temper"
          onSubmit={(e) => {
            e.preventDefault();
            if (invalid || lowered.length === 0) return;
            change.mutate({ number: order.number, lines: lowered.map(({ line, n }) => ({ lineId: line.id, quantity: n! })) }, {
              onSuccess: (r) => {
                setResult(r);
                setMode('idle');
              },
            });
          }}
        >
          <h2 id="edit-heading" className="text-xl font-bold">
            Change quantities
          </h2>
          <p className="text-sm text-cast">Lower a quantity, or take a line off. The new total and what comes back to you are worked out when you save.</p>
          <ul className="grid gap-2">
            {order.lines.map((l) => {
              const text = quantities[l.id] ?? String(l.quantity);
              return (
                <li key={l.id} className="flex flex-wrap items-end justify-between gap-2 border-b border-cast-line pb-2">
                  <div className="min-w-0">
                    <p className="part-no font-semibold">{l.partNumber}</p>
                    <p className="text-sm text-cast">
                      {l.title} · ordered {l.quantity}
                    </p>
                    {text.trim() === '0' && <p className="text-sm font-semibold text-oxide">Will be taken off the order</p>}
                  </div>
                  <div className="flex items-end gap-2">
                    <label className="grid gap-0.5 text-sm">
                      <span className="font-semibold">New quantity</span>
                      <input
                        className={qtyClass}
                        inputMode="numeric"
                        aria-label={`New quantity of ${l.partNumber}`}
                        value={text}
                        onChange={(e) => setQuantities({ ...quantities, [l.id]: e.target.value })}
                      />
                    </label>
                    <Button variant="quiet" onClick={() => setQuantities({ ...quantities, [l.id]: '0' })} aria-label={`Take ${l.partNumber} off the order`}>
                      Take off
                    </Button>
                  </div>
                </li>
              );
            })}
          </ul>
          {invalid && (
            <Notice tone="warning" live="off">
              {invalid.line.partNumber}: enter a whole number from 0 to {invalid.line.quantity}. To order more, place a new order.
            </Notice>
          )}
          <div className="flex flex-wrap gap-2">
            <Button type="submit" disabled={Boolean(invalid) || lowered.length === 0 || change.isPending}>
              {change.isPending ? 'Saving…' : 'Save changes'}
            </Button>
            <Button variant="quiet" onClick={() => setMode('idle')}>
              Keep the order as it is
            </Button>
          </div>
        </form>
      )}
      {mode === 'cancel' && (
        <Notice tone="warning" title={`Cancel order ${order.number}?`} live="off">
          <p>
            Nothing will be sent.{' '}
            {order.paymentMethod === 'account'
              ? `The invoice of ${formatPrice(order.totalCents)} is cancelled.`
              : order.status === 'pending_payment'
                ? 'The card payment is cancelled before it is taken.'
                : `${formatPrice(order.totalCents - order.totals.refundedCents)} goes back to your card.`}
          </p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button onClick={() => cancel.mutate(order.number, {
                  onSuccess: (r) => {
                    setResult(r);
                    setMode('idle');
                  },
                })} disabled={cancel.isPending}>
              {cancel.isPending ? 'Cancelling…' : 'Yes, cancel the order'}
            </Button>
            <Button variant="secondary" onClick={() => setMode('idle')}>
              Keep the order
            </Button>
          </div>
        </Notice>
      )}
      {!changeability.canChange && !changeability.canCancel && changeability.reason && order.status !== 'cancelled' && (
        <Notice tone="info" title="Why this order cannot be changed" live="off">
          {changeability.reason}
        </Notice>
      )}
      {history.length > 0 && <ChangeHistory changes={history} />}
    </div>
  );
}

/** Whether the buyer cancelled the order themselves (the page then does not show the failed-payment banner). */
export function useBuyerCancelled(number: string) {
  return useOrderChanges(number).data?.changes.some((c) => c.kind === 'cancel') ?? false;
}
