import { CircleCheck, LoaderCircle, Plus, ShoppingCart, X } from 'lucide-react';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Link } from 'react-router-dom';
import type { OrderRowResult } from '../../../../shared/schemas/orders';
import { Button } from '../../../components/ui/button';
import { PartSearchBox } from '../../../components/ui/part-search-box';
import { useAddLinesToCart } from '../api/add-lines-to-cart';
import { useCheckLines, type TypedLine } from '../api/check-lines';
import { RowResult } from './row-result';

interface PadRow {
  key: number;
  partNumber: string;
  quantity: string;
}

/** Waits until typing pauses before the value moves on. */
function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

const LOOKUP_DEBOUNCE_MS = 300;

export function QuickOrderPad({ onAdded }: { onAdded: () => void }) {
  const nextKey = useRef(2);
  const [rows, setRows] = useState<PadRow[]>([{ key: 1, partNumber: '', quantity: '1' }]);
  const focusPart = useRef<number | null>(null);
  const add = useAddLinesToCart({ onAdded });
  const [addedMessage, setAddedMessage] = useState<{ count: number; notices: string[] } | null>(null);

  const filled = rows.filter((r) => r.partNumber.trim() !== '');
  // Debounced as a string so an unchanged pad does not restart the timer on every render.
  const typedText = JSON.stringify(filled.map((r) => ({ key: r.key, partNumber: r.partNumber.trim(), quantity: r.quantity.trim() })));
  const debouncedText = useDebounced(typedText, LOOKUP_DEBOUNCE_MS);
  const debouncedRows = useMemo(() => JSON.parse(debouncedText) as Array<TypedLine & { key: number }>, [debouncedText]);
  const debounced: TypedLine[] = useMemo(() => debouncedRows.map(({ partNumber, quantity }) => ({ partNumber, quantity })), [debouncedRows]);
  const check = useCheckLines(debounced);

  // Results come back in the order sent; match them to rows by the text that was checked.
  const resultFor = (row: PadRow): OrderRowResult | null => {
    const i = debouncedRows.findIndex((d) => d.key === row.key && d.partNumber === row.partNumber.trim() && d.quantity === row.quantity.trim());
    return i >= 0 && !check.isPlaceholderData ? (check.data?.rows[i] ?? null) : null;
  };

  useEffect(() => {
    if (focusPart.current !== null) {
      document.getElementById(`qo-part-${focusPart.current}`)?.focus();
      focusPart.current = null;
    }
  });

  const update = (key: number, change: Partial<PadRow>) => setRows((rs) => rs.map((r) => (r.key === key ? { ...r, ...change } : r)));
  const addRow = () => {
    const key = nextKey.current++;
    focusPart.current = key;
    setRows((rs) => [...rs, { key, partNumber: '', quantity: '1' }]);
  };
  const removeRow = (key: number) => setRows((rs) => (rs.length === 1 ? [{ key: nextKey.current++, partNumber: '', quantity: '1' }] : rs.filter((r) => r.key !== key)));

  const results = rows.map((r) => ({ row: r, result: r.partNumber.trim() ? resultFor(r) : null }));
  const valid = results.filter((x) => x.result && x.result.status !== 'error');
  const errors = results.filter((x) => x.result?.status === 'error');
  const pending = results.some((x) => x.row.partNumber.trim() && !x.result);

  const addAll = () => {
    const lines = valid.map((x) => ({ partNumber: x.result!.partNumber!, quantity: x.result!.quantity! }));
    add.mutate(lines, {
      onSuccess: (view) => {
        setAddedMessage({ count: lines.length, notices: [...view.notices, ...valid.filter((x) => x.result!.status === 'replaced').map((x) => x.result!.message ?? '')].filter(Boolean) });
        const addedKeys = new Set(valid.map((x) => x.row.key));
        setRows((rs) => {
          const left = rs.filter((r) => !addedKeys.has(r.key));
          return left.length ? left : [{ key: nextKey.current++, partNumber: '', quantity: '1' }];
        });
      },
    });
  };

  return (
    <div className="grid min-w-0 gap-4">
      <p className="text-cast">
        Type a part number, a cross-reference or an earlier number and a quantity; parts are suggested as you type (arrow keys and Enter to take one). Press Enter to move on and to start a new row. Each row is checked as you type.
      </p>
      <div className="min-w-0">
        <table className="w-full border-collapse">
          <caption className="sr-only">Quick order rows</caption>
          <thead className="border-b-2 border-ink text-left text-sm max-md:sr-only">
            <tr>
              <th scope="col" className="w-10 px-2 py-2 font-semibold">
                #
              </th>
              <th scope="col" className="px-2 py-2 font-semibold">
                Part number
              </th>
              <th scope="col" className="w-24 px-2 py-2 font-semibold">
                Quantity
              </th>
              <th scope="col" className="px-2 py-2 font-semibold">
                Check
              </th>
              <th scope="col" className="w-12 px-2 py-2">
                <span className="sr-only">Remove</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {results.map(({ row, result }, i) => {
              const invalid = result?.status === 'error';
              return (
                <tr key={row.key} className="border-b border-cast-line align-top max-md:grid max-md:grid-cols-[1.5rem_minmax(0,1fr)_5.5rem_2.75rem] max-md:items-start">
                  <td className="tabular px-2 py-3 text-cast">{i + 1}</td>
                  <td className="px-2 py-2">
                    <PartSearchBox
                      id={`qo-part-${row.key}`}
                      label={`Part number, row ${i + 1}`}
                      labelHidden
                      value={row.partNumber}
                      maxLength={40}
                      invalid={invalid}
                      describedBy={`qo-result-${row.key}`}
                      onChange={(partNumber) => update(row.key, { partNumber })}
                      // A part picked from the list is taken as its number; the quantity is next.
                      onPick={(s) => {
                        update(row.key, { partNumber: s.partNumber });
                        document.getElementById(`qo-qty-${row.key}`)?.focus();
                      }}
                      onEnter={() => document.getElementById(`qo-qty-${row.key}`)?.focus()}
                      inputClassName={`part-no min-h-11 w-full rounded-md md:min-w-44 border bg-white px-3 uppercase ${invalid ? 'border-2 border-oxide' : 'border-cast-line'}`}
                    />
                  </td>
                  <td className="px-2 py-2">
                    <label htmlFor={`qo-qty-${row.key}`} className="sr-only">
                      Quantity, row {i + 1}
                    </label>
                    <input
                      id={`qo-qty-${row.key}`}
                      value={row.quantity}
                      inputMode="numeric"
                      maxLength={6}
                      autoComplete="off"
                      onFocus={(e) => e.target.select()}
                      onChange={(e) => update(row.key, { quantity: e.target.value })}
                      onKeyDown={(e) => {
                        if (e.key === 'Enter') {
                          e.preventDefault();
                          const next = rows[i + 1];
                          if (next) document.getElementById(`qo-part-${next.key}`)?.focus();
                          else addRow();
                        }
                      }}
                      className="tabular min-h-11 w-20 rounded-md border border-cast-line bg-white px-3 text-right"
                    />
                  </td>
                  <td className="px-2 py-2 max-md:order-last max-md:col-span-full max-md:pl-8" id={`qo-result-${row.key}`} aria-live="polite">
                    {row.partNumber.trim() === '' ? (
                      <span className="text-sm text-cast">Type a part number</span>
                    ) : result ? (
                      <RowResult result={result} onPick={(pn) => update(row.key, { partNumber: pn })} />
                    ) : (
                      <span className="inline-flex items-center gap-1 text-sm text-cast">
                        <LoaderCircle aria-hidden className="size-4 animate-spin" /> Checking…
                      </span>
                    )}
                  </td>
                  <td className="px-2 py-2">
                    <button
                      type="button"
                      onClick={() => removeRow(row.key)}
                      className="inline-flex size-11 items-center justify-center rounded-md text-cast hover:bg-oxide-tint hover:text-oxide"
                      aria-label={`Remove row ${i + 1}`}
                    >
                      <X aria-hidden className="size-5" />
                    </button>
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {check.isError && (
        <p role="alert" className="font-semibold text-oxide">
          The rows could not be checked: {check.error.message}
        </p>
      )}
      <div className="flex flex-wrap items-center gap-3">
        <Button variant="secondary" onClick={addRow}>
          <Plus aria-hidden className="size-4" />
          Add row
        </Button>
        <Button onClick={addAll} disabled={valid.length === 0 || pending || add.isPending}>
          <ShoppingCart aria-hidden className="size-4" />
          {add.isPending ? 'Adding…' : `Add ${valid.length} ${valid.length === 1 ? 'line' : 'lines'} to cart`}
        </Button>
        {errors.length > 0 && (
          <span className="text-sm text-oxide">
            {errors.length} {errors.length === 1 ? 'row needs' : 'rows need'} fixing and will stay on the pad
          </span>
        )}
      </div>
      {add.isError && (
        <p role="alert" className="font-semibold text-oxide">
          {add.error.message}
        </p>
      )}
      {addedMessage && !add.isError && (
        <div role="status" className="grid gap-1 rounded-md bg-machined-tint p-4">
          <p className="inline-flex items-center gap-1 font-semibold text-machined">
            <CircleCheck aria-hidden className="size-5" />
            {addedMessage.count} {addedMessage.count === 1 ? 'line' : 'lines'} added to your cart.
          </p>
          {addedMessage.notices.map((n) => (
            <p key={n}>{n}</p>
          ))}
          <Link to="/cart" className="font-semibold text-temper underline">
            View cart
          </Link>
        </div>
      )}
    </div>
  );
}
