import { ShoppingCart, Trash2 } from 'lucide-react';
import { useEffect, useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { formatDateTime } from '../../../../shared/format';
import type { ListDetail as ListDetailData, ListLine } from '../../../../shared/schemas/parts-lists';
import { QUANTITY_MAX } from '../../../../shared/order-limits';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useEditList } from '../api/edit-list';
import { useList } from '../api/get-list';
import { useOrderFromList } from '../api/order-from-list';

const wholeNumber = (text: string) => (/^\d+$/.test(text.trim()) ? Number(text) : null);
const qtyClass = 'min-h-10 w-20 rounded-md border border-cast-line bg-white px-2 text-right tabular focus:border-temper disabled:bg-panel disabled:text-cast';

function availability(l: ListLine) {
  if (l.status === 'discontinued') return l.available > 0 ? `Discontinued · ${l.available} left` : 'Discontinued · none left';
  if (l.status === 'superseded') return `Superseded by ${l.supersededBy ?? 'a newer number'}`;
  return l.available > 0 ? `${l.available} in stock` : 'Awaiting stock';
}

/** The list's quantity, saved for everyone at the account when the field is left or Enter is pressed. */
function ListQuantity({ line, onSave, disabled }: { line: ListLine; onSave: (q: number) => void; disabled: boolean }) {
  const [text, setText] = useState(String(line.quantity));
  useEffect(() => setText(String(line.quantity)), [line.quantity]);
  const commit = () => {
    const n = wholeNumber(text);
    if (n === null || n < 1 || n > QUANTITY_MAX) setText(String(line.quantity));
    else if (n !== line.quantity) onSave(n);
  };
  return (
    <label className="grid gap-0.5 text-sm">
      <span className="font-semibold">On list</span>
      <input
        className={qtyClass}
        inputMode="numeric"
        aria-label={`Quantity on the list for ${line.partNumber}`}
        value={text}
        disabled={disabled}
        onChange={(e) => setText(e.target.value)}
        onBlur={commit}
        onKeyDown={(e) => {
          if (e.key === 'Enter') commit();
        }}
      />
    </label>
  );
}

function Lines({ list, onAdded }: { list: ListDetailData; onAdded: () => void }) {
  const navigate = useNavigate();
  const edit = useEditList(list.id);
  const order = useOrderFromList({ onAdded });
  const [chosen, setChosen] = useState<Record<number, boolean>>({});
  const [toOrder, setToOrder] = useState<Record<number, string>>({});
  const isChosen = (l: ListLine) => chosen[l.id] ?? l.status !== 'superseded';
  const orderText = (l: ListLine) => toOrder[l.id] ?? String(l.quantity);
  const picked = list.lines.filter(isChosen);
  const bad = picked.find((l) => {
    const n = wholeNumber(orderText(l));
    return n === null || n < 1 || n > QUANTITY_MAX;
  });
  const units = picked.reduce((s, l) => s + (wholeNumber(orderText(l)) ?? 0), 0);

  if (list.lines.length === 0) {
    return <EmptyState title="This list is empty">Use “Save to a list” on a part page, in your cart or on a past order to fill it.</EmptyState>;
  }
  return (
    <div className="grid gap-4">
      <ul className="grid gap-2" aria-label={`Lines of ${list.name}`}>
        {list.lines.map((l) => (
          <li key={l.id} className="grid gap-3 rounded-lg bg-white p-3 shadow-sm ring-1 ring-cast-line sm:grid-cols-[minmax(0,1fr)_auto] sm:items-center">
            <div className="flex min-w-0 items-start gap-3">
              <input
                type="checkbox"
                className="mt-1 size-5 shrink-0 accent-temper"
                checked={isChosen(l)}
                onChange={(e) => setChosen({ ...chosen, [l.id]: e.target.checked })}
                aria-label={`Order ${l.partNumber}`}
              />
              <div className="min-w-0">
                <Link to={`/parts/${encodeURIComponent(l.partNumber)}`} className="part-no font-semibold text-temper hover:underline">
                  {l.partNumber}
                </Link>
                <p className="sm:truncate">{l.title}</p>
                <p className="text-sm text-cast">
                  <span className={l.available > 0 && l.status === 'active' ? '' : 'font-semibold text-amber'}>{availability(l)}</span> · <span className="tabular">{formatPrice(l.unitCents)}</span> each
                  {l.addedByName && <> · added by {l.addedByName}</>}
                </p>
              </div>
            </div>
            <div className="flex flex-wrap items-end gap-3 pl-8 sm:pl-0">
              <ListQuantity line={l} disabled={edit.setQuantity.isPending} onSave={(quantity) => edit.setQuantity.mutate({ lineId: l.id, quantity })} />
              <label className="grid gap-0.5 text-sm">
                <span className="font-semibold">To order</span>
                <input
                  className={qtyClass}
                  inputMode="numeric"
                  aria-label={`Quantity to order of ${l.partNumber}`}
                  value={orderText(l)}
                  disabled={!isChosen(l)}
                  onChange={(e) => setToOrder({ ...toOrder, [l.id]: e.target.value })}
                />
              </label>
              <Button variant="quiet" onClick={() => edit.removeLine.mutate(l.id)} disabled={edit.removeLine.isPending} aria-label={`Take ${l.partNumber} off the list`}>
                <Trash2 aria-hidden className="size-4" />
                <span className="sm:sr-only">Take off</span>
              </Button>
            </div>
          </li>
        ))}
      </ul>
      {(edit.setQuantity.isError || edit.removeLine.isError) && (
        <Notice tone="problem" live="alert">
          {(edit.setQuantity.error ?? edit.removeLine.error)?.message}
        </Notice>
      )}
      <div className="grid gap-3 rounded-lg bg-panel p-4 sm:flex sm:items-center sm:justify-between">
        <p>
          {picked.length === 0 ? (
            'Tick the lines to order.'
          ) : (
            <>
              <span className="font-semibold">
                {picked.length} of {list.lines.length} {list.lines.length === 1 ? 'line' : 'lines'}
              </span>
              , <span className="tabular">{units}</span> {units === 1 ? 'unit' : 'units'}. The list itself stays as it is.
            </>
          )}
        </p>
        <Button
          disabled={picked.length === 0 || Boolean(bad) || order.isPending}
          onClick={() =>
            order.mutate(
              { listId: list.id, lines: picked.map((l) => ({ lineId: l.id, quantity: wholeNumber(orderText(l))! })) },
              { onSuccess: (r) => (r.notices.length === 0 ? navigate('/cart') : undefined) },
            )
          }
        >
          <ShoppingCart aria-hidden className="size-4" />
          {order.isPending ? 'Adding…' : picked.length === list.lines.length ? 'Add the whole list to the cart' : 'Add chosen lines to the cart'}
        </Button>
      </div>
      {bad && (
        <Notice tone="warning" live="off">
          The quantity to order of {bad.partNumber} must be a whole number from 1 to {QUANTITY_MAX}.
        </Notice>
      )}
      {order.isError && (
        <Notice tone="problem" live="alert">
          {order.error.message}
        </Notice>
      )}
      {order.isSuccess && (
        <Notice tone="done" title={`${order.data.added} ${order.data.added === 1 ? 'line' : 'lines'} added to your cart`}>
          {order.data.notices.map((n) => (
            <p key={n}>{n}</p>
          ))}
          <Link to="/cart" className="font-semibold text-temper underline">
            Go to the cart
          </Link>
        </Notice>
      )}
    </div>
  );
}

/** One list: its lines with the account's trade prices and stock, quantities to keep and to order, rename and delete. */
export function ListDetail({ id, onAdded }: { id: number; onAdded: () => void }) {
  const list = useList(id);
  const edit = useEditList(id);
  const navigate = useNavigate();
  const [renaming, setRenaming] = useState<string | null>(null);
  const [confirmDelete, setConfirmDelete] = useState(false);
  if (list.isPending) return <LoadingState label="Loading the list…" />;
  if (list.isError) {
    if (list.error instanceof ApiError && list.error.isNotFound) {
      return (
        <EmptyState title="No such list">
          It may have been deleted by someone at your account.{' '}
          <Link to="/trade/lists" className="font-semibold text-temper underline">
            See your lists
          </Link>
        </EmptyState>
      );
    }
    return <ErrorState title="The list did not load" message={list.error.message} onRetry={() => list.refetch()} />;
  }
  const l = list.data;
  return (
    <div className="grid gap-5">
      <header className="grid gap-1">
        {renaming === null ? (
          <h1 className="text-3xl font-bold">{l.name}</h1>
        ) : (
          <form
            className="flex flex-wrap items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              if (renaming.trim()) edit.rename.mutate(renaming.trim(), { onSuccess: () => setRenaming(null) });
            }}
          >
            <label className="grid gap-1">
              <span className="font-semibold">List name</span>
              <input className="min-h-11 rounded-md border border-cast-line bg-white px-3 text-xl font-bold" maxLength={60} value={renaming} onChange={(e) => setRenaming(e.target.value)} />
            </label>
            <Button type="submit" disabled={edit.rename.isPending}>
              Save name
            </Button>
            <Button variant="quiet" onClick={() => setRenaming(null)}>
              Keep
            </Button>
          </form>
        )}
        <p className="text-sm text-cast">
          {l.lineCount} {l.lineCount === 1 ? 'line' : 'lines'} · changed <time dateTime={l.updatedAt}>{formatDateTime(l.updatedAt)}</time>
          {l.updatedByName && <> by {l.updatedByName}</>}
          {l.createdByName && <> · started by {l.createdByName}</>}
        </p>
        <div className="flex flex-wrap gap-2">
          {renaming === null && (
            <Button variant="quiet" onClick={() => setRenaming(l.name)}>
              Rename
            </Button>
          )}
          {!confirmDelete ? (
            <Button variant="quiet" onClick={() => setConfirmDelete(true)}>
              Delete list
            </Button>
          ) : (
            <Notice tone="warning" title={`Delete “${l.name}” for everyone at your account?`} live="off">
              <div className="mt-2 flex flex-wrap gap-2">
                <Button onClick={() => edit.remove.mutate(undefined, { onSuccess: () => navigate('/trade/lists') })} disabled={edit.remove.isPending}>
                  Delete it
                </Button>
                <Button variant="secondary" onClick={() => setConfirmDelete(false)}>
                  Keep it
                </Button>
              </div>
            </Notice>
          )}
        </div>
        {edit.rename.isError && (
          <Notice tone="problem" live="alert">
            {edit.rename.error.message}
          </Notice>
        )}
      </header>
      <Lines list={l} onAdded={onAdded} />
    </div>
  );
}
