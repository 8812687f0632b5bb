import { CircleCheck, FileUp, Pencil, ShoppingCart, Trash2, Undo2 } from 'lucide-react';
import { useRef, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { CSV_MAX_BYTES, CSV_MAX_ROWS, type OrderRowResult } from '../../../../shared/schemas/orders';
import { Button } from '../../../components/ui/button';
import { useAddLinesToCart } from '../api/add-lines-to-cart';
import { useRecheckLine } from '../api/check-lines';
import { useImportStockList } from '../api/import-stock-list';
import { RowResult } from './row-result';

interface PreviewRow {
  /** The line in the uploaded file (1 = first line after the header). */
  line: number;
  result: OrderRowResult;
  dropped: boolean;
}

const EXAMPLE = `part,qty
AWL-10-0201,2
FLG-50-0201,10`;

function RowEditor({ row, onChecked, onCancel }: { row: PreviewRow; onChecked: (r: OrderRowResult) => void; onCancel: () => void }) {
  const [partNumber, setPartNumber] = useState(row.result.input.partNumber);
  const [quantity, setQuantity] = useState(row.result.input.quantity);
  const recheck = useRecheckLine();
  const submit = (e?: FormEvent) => {
    e?.preventDefault();
    recheck.mutate({ partNumber, quantity }, { onSuccess: (res) => res.rows[0] && onChecked(res.rows[0]) });
  };
  const id = `row-${row.line}`;
  return (
    <div className="grid gap-2">
      <div className="flex flex-wrap items-end gap-2">
        <div className="grid gap-1">
          <label htmlFor={`${id}-part`} className="text-sm font-semibold">
            Part number
          </label>
          <input
            id={`${id}-part`}
            value={partNumber}
            maxLength={40}
            autoComplete="off"
            spellCheck={false}
            onChange={(e) => setPartNumber(e.target.value)}
            onKeyDown={(e) => e.key === 'Enter' && submit(e)}
            className="part-no min-h-10 w-44 rounded-md border border-cast-line bg-white px-2 uppercase"
          />
        </div>
        <div className="grid gap-1">
          <label htmlFor={`${id}-qty`} className="text-sm font-semibold">
            Quantity
          </label>
          <input
            id={`${id}-qty`}
            value={quantity}
            maxLength={6}
            inputMode="numeric"
            autoComplete="off"
            onChange={(e) => setQuantity(e.target.value)}
            onKeyDown={(e) => e.key === 'Enter' && submit(e)}
            className="tabular min-h-10 w-20 rounded-md border border-cast-line bg-white px-2 text-right"
          />
        </div>
        <Button onClick={() => submit()} disabled={recheck.isPending}>
          {recheck.isPending ? 'Checking…' : 'Check again'}
        </Button>
        <Button variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      {recheck.isError && (
        <p role="alert" className="text-sm font-semibold text-oxide">
          {recheck.error.message}
        </p>
      )}
      <RowResult result={row.result} onPick={(pn) => setPartNumber(pn)} />
    </div>
  );
}

export function StockListUpload({ onAdded }: { onAdded: () => void }) {
  const [file, setFile] = useState<File | null>(null);
  const fileRef = useRef<HTMLInputElement>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const [rows, setRows] = useState<PreviewRow[] | null>(null);
  const [editing, setEditing] = useState<number | null>(null);
  const [added, setAdded] = useState<{ count: number; notices: string[] } | null>(null);
  const upload = useImportStockList();
  const add = useAddLinesToCart({ onAdded });

  const submit = (e: FormEvent) => {
    e.preventDefault();
    setAdded(null);
    if (!file) {
      setFileError('Choose a CSV file to upload');
      document.getElementById('stock-file')?.focus();
      return;
    }
    if (file.size > CSV_MAX_BYTES) {
      setFileError(`The file is ${(file.size / 1000).toFixed(0)} kB; the limit is ${CSV_MAX_BYTES / 1000} kB. Split it into smaller files.`);
      return;
    }
    setFileError(null);
    upload.mutate(file, {
      onSuccess: (preview) => {
        setRows(preview.rows.map((r) => ({ line: r.row, result: r, dropped: false })));
        setEditing(null);
      },
      onError: (err) => setFileError(err.message),
    });
  };

  const live = rows?.filter((r) => !r.dropped) ?? [];
  const valid = live.filter((r) => r.result.status !== 'error');
  const bad = live.filter((r) => r.result.status === 'error');
  const dropped = (rows ?? []).filter((r) => r.dropped);
  const setRow = (line: number, change: Partial<PreviewRow>) => setRows((rs) => rs?.map((r) => (r.line === line ? { ...r, ...change } : r)) ?? null);
  /** A row's Keep, or Fix and Drop buttons. */
  const actions = (r: PreviewRow) =>
    r.dropped ? (
      <Button variant="quiet" onClick={() => setRow(r.line, { dropped: false })} aria-label={`Keep row ${r.line}`}>
        <Undo2 aria-hidden className="size-4" /> Keep
      </Button>
    ) : (
      <div className="flex flex-wrap gap-1">
        {editing !== r.line && (
          <Button variant="quiet" onClick={() => setEditing(r.line)} aria-label={`Fix row ${r.line}`}>
            <Pencil aria-hidden className="size-4" /> Fix
          </Button>
        )}
        <Button
          variant="quiet"
          className="text-oxide hover:bg-oxide-tint"
          onClick={() => {
            setRow(r.line, { dropped: true });
            if (editing === r.line) setEditing(null);
          }}
          aria-label={`Drop row ${r.line}`}
        >
          <Trash2 aria-hidden className="size-4" /> Drop
        </Button>
      </div>
    );

  const addValid = () => {
    const lines = valid.map((r) => ({ partNumber: r.result.partNumber!, quantity: r.result.quantity! }));
    add.mutate(lines, {
      onSuccess: () => {
        setAdded({ count: lines.length, notices: valid.filter((r) => r.result.status === 'replaced').map((r) => r.result.message ?? '') });
        setRows(null);
        setFile(null);
        // The chooser still shows the old name until its own value is emptied.
        if (fileRef.current) fileRef.current.value = '';
      },
    });
  };

  return (
    <div className="grid min-w-0 gap-6">
      <form onSubmit={submit} noValidate className="grid max-w-3xl gap-4 rounded-lg bg-white p-5 shadow-sm ring-1 ring-cast-line" aria-label="Upload a stock list">
        <div className="grid gap-1">
          <label htmlFor="stock-file" className="font-semibold">
            Stock list (CSV)
          </label>
          <input
            ref={fileRef}
            id="stock-file"
            type="file"
            accept=".csv,text/csv"
            aria-describedby={`stock-file-hint${fileError ? ' stock-file-error' : ''}`}
            aria-invalid={!!fileError}
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setFileError(null);
            }}
            className="min-h-11 w-full min-w-0 rounded-md border border-cast-line bg-paper p-2 file:mr-3 file:rounded file:border-0 file:bg-temper file:px-3 file:py-1.5 file:font-semibold file:text-white"
          />
          <p id="stock-file-hint" className="text-sm text-cast">
            A .csv file up to {CSV_MAX_BYTES / 1000} kB and {CSV_MAX_ROWS} rows. A header row with a <strong>part</strong> column and a <strong>qty</strong> (or quantity)
            column; without a header, part number first, quantity second.
          </p>
          {fileError && (
            <p id="stock-file-error" role="alert" className="text-sm font-semibold text-oxide">
              {fileError}
            </p>
          )}
        </div>
        <figure className="grid gap-1">
          <figcaption className="text-sm font-semibold">Example</figcaption>
          <pre className="tabular w-fit rounded bg-panel px-3 py-2 text-sm">{EXAMPLE}</pre>
        </figure>
        <div>
          <Button type="submit" disabled={upload.isPending}>
            <FileUp aria-hidden className="size-4" />
            {upload.isPending ? 'Checking the file…' : 'Upload and check'}
          </Button>
        </div>
      </form>

      {added && (
        <div role="status" className="grid max-w-3xl gap-1 rounded-md bg-machined-tint p-4">
          <p className="inline-flex items-center gap-1 font-semibold text-machined">
            <CircleCheck aria-hidden className="size-5" />
            {added.count} {added.count === 1 ? 'line' : 'lines'} added to your cart.
          </p>
          {added.notices.map((n) => (
            <p key={n}>{n}</p>
          ))}
          <Link to="/cart" className="font-semibold text-temper underline">
            View cart and check out
          </Link>
        </div>
      )}

      {rows && (
        <section aria-labelledby="preview-heading" className="grid min-w-0 gap-3">
          <h2 id="preview-heading" className="text-xl font-bold">
            Preview
          </h2>
          <p role="status">
            <span className="tabular">{rows.length}</span> rows: <span className="tabular font-semibold text-machined">{valid.length} ready</span>
            {bad.length > 0 && (
              <>
                , <span className="tabular font-semibold text-oxide">{bad.length} to fix</span>
              </>
            )}
            {dropped.length > 0 && <>, {dropped.length} dropped</>}. Fix a row to check it again, or drop it.
          </p>
          <div className="max-h-[70vh] overflow-auto rounded-md ring-1 ring-cast-line">
            <table className="w-full border-collapse bg-white">
              <caption className="sr-only">Rows in the uploaded stock list</caption>
              <thead className="text-left text-sm">
                <tr>
                  <th scope="col" className="sticky top-0 z-10 hidden border-b-2 border-ink bg-white px-3 py-2 font-semibold sm:table-cell">
                    Row
                  </th>
                  <th scope="col" className="sticky top-0 z-10 border-b-2 border-ink bg-white px-3 py-2 font-semibold">
                    In the file
                  </th>
                  <th scope="col" className="sticky top-0 z-10 border-b-2 border-ink bg-white px-3 py-2 text-right font-semibold">
                    Qty
                  </th>
                  <th scope="col" className="sticky top-0 z-10 border-b-2 border-ink bg-white px-3 py-2 font-semibold">
                    Result
                  </th>
                  <th scope="col" className="sticky top-0 z-10 hidden border-b-2 border-ink bg-white px-3 py-2 font-semibold sm:table-cell">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <tr key={r.line} className={`border-b border-cast-line align-top ${r.dropped ? 'text-cast' : ''} ${r.result.status === 'error' && !r.dropped ? 'bg-oxide-tint/40' : ''}`}>
                    <td className="tabular hidden px-3 py-3 sm:table-cell">{r.line}</td>
                    <td className="px-2 py-3 sm:px-3">
                      {/* On a phone the row number rides with the part number, so the result column has the room. */}
                      <span className="block text-sm text-cast sm:hidden">Row {r.line}</span>
                      <span className="part-no">{r.result.input.partNumber || <span className="font-normal italic text-cast">(empty)</span>}</span>
                    </td>
                    <td className="tabular px-2 py-3 text-right sm:px-3">{r.result.input.quantity || '—'}</td>
                    <td className="px-2 py-3 sm:px-3">
                      {r.dropped ? (
                        <span className="inline-flex items-center gap-1 text-sm">
                          <Trash2 aria-hidden className="size-4" /> Dropped
                        </span>
                      ) : editing === r.line ? (
                        <RowEditor
                          row={r}
                          onCancel={() => setEditing(null)}
                          onChecked={(result) => {
                            setRow(r.line, { result: { ...result, row: r.line } });
                            if (result.status !== 'error') setEditing(null);
                          }}
                        />
                      ) : (
                        <RowResult
                          result={r.result}
                          onPick={(pn) => {
                            setRow(r.line, { result: { ...r.result, input: { ...r.result.input, partNumber: pn } } });
                            setEditing(r.line);
                          }}
                        />
                      )}
                      {/* On a phone the actions sit under the result, where the thumb is, not in a column off the screen. */}
                      <div className="mt-2 sm:hidden">{actions(r)}</div>
                    </td>
                    <td className="hidden whitespace-nowrap px-3 py-2 sm:table-cell">
                      {actions(r)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <div className="flex flex-wrap items-center gap-3">
            <Button size="lg" onClick={addValid} disabled={valid.length === 0 || add.isPending}>
              <ShoppingCart aria-hidden className="size-5" />
              {add.isPending ? 'Adding…' : `Add ${valid.length} valid ${valid.length === 1 ? 'line' : 'lines'} to cart`}
            </Button>
            {bad.length > 0 && (
              <span className="text-sm text-oxide">
                {bad.length} {bad.length === 1 ? 'row' : 'rows'} with errors will be left out: fix or drop {bad.length === 1 ? 'it' : 'them'}.
              </span>
            )}
          </div>
          {add.isError && (
            <p role="alert" className="font-semibold text-oxide">
              {add.error.message}
            </p>
          )}
        </section>
      )}
    </div>
  );
}
