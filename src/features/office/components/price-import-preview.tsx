import { AlertOctagon, ArrowRight, CircleCheck, CircleDot, Equal, Plus, Trash2 } from 'lucide-react';
import { useState, type FormEvent, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import type { PriceImport, PriceImportRow } from '../../../../shared/schemas/admin-catalog';
import { Button } from '../../../components/ui/button';
import { useApplyPriceImport } from '../api/apply-price-import';
import { useDropPriceImportRow } from '../api/drop-price-import-row';
import { useFixPriceImportRow } from '../api/fix-price-import-row';

type Filter = 'all' | 'changed' | 'new' | 'error';

const price = (cents: number | null) => (cents === null ? '—' : formatPrice(cents));

function Count({ label, value, icon, tone }: { label: string; value: number; icon: ReactNode; tone: string }) {
  return (
    <div className={`grid rounded-lg p-4 ring-1 ${tone}`}>
      <dt className="flex items-center gap-2 text-sm font-semibold">
        {icon}
        {label}
      </dt>
      <dd className="tabular pl-8 text-2xl font-bold">{value.toLocaleString('en-US')}</dd>
    </div>
  );
}

export function ImportCounts({ counts }: { counts: PriceImport['counts'] }) {
  return (
    <dl className="grid grid-cols-2 gap-3 md:grid-cols-4" aria-label="Rows by result">
      <Count label="New parts" value={counts.new} tone="bg-temper-tint ring-temper/40" icon={<Plus aria-hidden className="size-6 text-temper" />} />
      <Count label="Price changed" value={counts.changed} tone="bg-amber-tint ring-amber-line/50" icon={<CircleDot aria-hidden className="size-6 text-amber" />} />
      <Count label="Unchanged" value={counts.unchanged} tone="bg-white ring-cast-line" icon={<Equal aria-hidden className="size-6 text-cast" />} />
      <Count label="In error" value={counts.error} tone={counts.error > 0 ? 'bg-oxide-tint ring-oxide/50' : 'bg-white ring-cast-line'} icon={<AlertOctagon aria-hidden className={`size-6 ${counts.error > 0 ? 'text-oxide' : 'text-cast'}`} />} />
    </dl>
  );
}

function RowStatus({ row }: { row: PriceImportRow }) {
  switch (row.status) {
    case 'new':
      return (
        <span className="inline-flex items-center gap-1 font-semibold text-temper">
          <Plus aria-hidden className="size-4" /> New
        </span>
      );
    case 'changed':
      return (
        <span className="inline-flex items-center gap-1 font-semibold text-amber">
          <CircleDot aria-hidden className="size-4" /> Changed
        </span>
      );
    case 'unchanged':
      return (
        <span className="inline-flex items-center gap-1 text-cast">
          <Equal aria-hidden className="size-4" /> Unchanged
        </span>
      );
    default:
      return (
        <span className="inline-flex items-center gap-1 font-semibold text-oxide">
          <AlertOctagon aria-hidden className="size-4" /> Error
        </span>
      );
  }
}

const FIX_COLUMNS = ['part_number', 'price', 'core_deposit', 'title', 'category', 'weight_kg', 'frame'];

/** The row's own columns, editable in place; saving sends them back to be checked again. */
function FixRow({ importId, row, onDone }: { importId: number; row: PriceImportRow; onDone: () => void }) {
  const present = new Set(['part_number', 'price', ...Object.keys(row.input)]);
  const keys = [...FIX_COLUMNS.filter((k) => present.has(k)), ...[...present].filter((k) => !FIX_COLUMNS.includes(k))];
  const [values, setValues] = useState<Record<string, string>>(() => Object.fromEntries(keys.map((k) => [k, row.input[k] ?? ''])));
  const fix = useFixPriceImportRow(importId);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    fix.mutate(
      { row: row.row, input: values },
      {
        onSuccess: (result) => {
          if (result.rows.find((r) => r.row === row.row)?.status !== 'error') onDone();
        },
      },
    );
  };
  return (
    <form onSubmit={submit} noValidate aria-label={`Fix row ${row.row}`} className="grid gap-3 rounded-md bg-paper p-3">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        {keys.map((k) => (
          <label key={k} className="grid gap-1 text-sm">
            <span className="font-mono font-semibold">{k}</span>
            <input
              value={values[k] ?? ''}
              onChange={(e) => setValues({ ...values, [k]: e.target.value })}
              autoComplete="off"
              inputMode={k === 'price' || k === 'core_deposit' || k === 'weight_kg' ? 'decimal' : undefined}
              className="min-h-10 rounded-md border border-cast-line bg-white px-2 focus:border-temper"
            />
          </label>
        ))}
      </div>
      {fix.isError && (
        <p role="alert" className="font-semibold text-oxide">
          ✕ {fix.error.message}
        </p>
      )}
      <div className="flex gap-2">
        <Button type="submit" disabled={fix.isPending}>
          {fix.isPending ? 'Checking…' : 'Save row'}
        </Button>
        <Button variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

function ImportRowView({ importId, row, editable }: { importId: number; row: PriceImportRow; editable: boolean }) {
  const [editing, setEditing] = useState(false);
  const drop = useDropPriceImportRow(importId);
  return (
    <>
      <tr className={`border-b border-cast-line ${row.status === 'error' ? 'bg-oxide-tint/50' : ''}`}>
        <td className="tabular px-3 py-2 text-right text-cast">{row.row}</td>
        <td className="px-3 py-2">
          <RowStatus row={row} />
        </td>
        <td className="px-3 py-2">
          <span className="part-no">{row.partNumber || '(blank)'}</span>
          {row.title && <span className="block text-sm text-cast">{row.title}</span>}
        </td>
        <td className="tabular px-3 py-2 text-right">
          {row.status === 'changed' ? (
            <span className="inline-flex items-center gap-1 whitespace-nowrap">
              <span className="text-cast line-through decoration-1">{price(row.oldPriceCents)}</span>
              <ArrowRight aria-label="to" className="size-4" />
              <span className="font-semibold">{price(row.newPriceCents)}</span>
            </span>
          ) : row.status === 'error' ? (
            <span className="font-mono text-sm">{row.input.price ?? ''}</span>
          ) : (
            price(row.newPriceCents)
          )}
        </td>
        <td className="px-3 py-2">
          {row.status === 'error' ? <span className="font-semibold text-oxide">{row.message}</span> : <span className="text-cast">{row.message ?? ''}</span>}
        </td>
        <td className="px-3 py-2 text-right">
          {editable && row.status === 'error' && (
            <span className="flex justify-end gap-2 whitespace-nowrap">
              <Button variant="secondary" className="min-h-9" onClick={() => setEditing(!editing)} aria-expanded={editing} aria-label={`Fix row ${row.row}`}>
                Fix
              </Button>
              <Button variant="quiet" className="min-h-9" onClick={() => drop.mutate(row.row)} disabled={drop.isPending} aria-label={`Drop row ${row.row}`}>
                <Trash2 aria-hidden className="size-4" /> Drop
              </Button>
            </span>
          )}
          {drop.isError && (
            <span role="alert" className="block text-sm font-semibold text-oxide">
              {drop.error.message}
            </span>
          )}
        </td>
      </tr>
      {editing && (
        <tr className="border-b border-cast-line">
          <td colSpan={6} className="px-3 py-2">
            <FixRow importId={importId} row={row} onDone={() => setEditing(false)} />
          </td>
        </tr>
      )}
    </>
  );
}

export function PriceImportPreview({ result, onStartOver }: { result: PriceImport; onStartOver: () => void }) {
  const [filter, setFilter] = useState<Filter>(result.counts.error > 0 ? 'error' : 'all');
  const apply = useApplyPriceImport(result.id);
  const applied = result.status === 'applied';
  const errors = result.counts.error;
  const rows = result.rows.filter((r) => filter === 'all' || r.status === filter);
  const filters: Array<[Filter, string, number]> = [
    ['all', 'All listed', result.rows.length],
    ['error', 'Errors', result.rows.filter((r) => r.status === 'error').length],
    ['changed', 'Changed', result.rows.filter((r) => r.status === 'changed').length],
    ['new', 'New', result.rows.filter((r) => r.status === 'new').length],
  ];

  return (
    <div className="grid gap-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-xl font-bold">
          {applied ? 'Applied' : 'Preview'}: <span className="font-mono text-lg">{result.fileName}</span>
        </h2>
        <p className="tabular text-cast">{result.totalRows.toLocaleString('en-US')} rows read</p>
      </div>

      {applied && (
        <div role="status" className="flex gap-3 rounded-lg border-2 border-machined bg-machined-tint p-4">
          <CircleCheck aria-hidden className="mt-0.5 size-6 shrink-0 text-machined" />
          <div>
            <p className="text-lg font-bold text-machined">Price list applied</p>
            <p>
              {result.counts.changed} {result.counts.changed === 1 ? 'price' : 'prices'} changed, {result.counts.new} new {result.counts.new === 1 ? 'part' : 'parts'},{' '}
              {result.counts.unchanged} unchanged
              {result.appliedAt ? ` · ${new Date(result.appliedAt).toLocaleString('en-US', { dateStyle: 'medium', timeStyle: 'short' })}` : ''}. The catalogue and search show
              the new prices now.
            </p>
            <p className="mt-2 flex flex-wrap gap-4">
              <Link to="/office/parts" className="font-semibold text-temper underline underline-offset-2">
                Back to the catalogue
              </Link>
              <button type="button" onClick={onStartOver} className="font-semibold text-temper underline underline-offset-2">
                Import another price list
              </button>
            </p>
          </div>
        </div>
      )}

      <ImportCounts counts={result.counts} />

      {!applied && (
        <div className="grid gap-2 rounded-lg bg-white p-4 ring-1 ring-cast-line">
          <div className="flex flex-wrap items-center gap-3">
            <Button size="lg" disabled={errors > 0 || apply.isPending} aria-describedby="apply-why" onClick={() => apply.mutate()}>
              {apply.isPending ? 'Applying…' : `Apply ${result.counts.changed + result.counts.new} ${result.counts.changed + result.counts.new === 1 ? 'change' : 'changes'}`}
            </Button>
            <Button variant="secondary" onClick={onStartOver}>
              Start over with another file
            </Button>
          </div>
          <p id="apply-why" className={errors > 0 ? 'flex items-center gap-1 font-semibold text-oxide' : 'text-cast'}>
            {errors > 0 ? (
              <>
                <AlertOctagon aria-hidden className="size-4 shrink-0" />
                Apply is off while {errors} {errors === 1 ? 'row is' : 'rows are'} in error: fix or drop {errors === 1 ? 'it' : 'them'} first. Nothing is changed until then.
              </>
            ) : (
              'All rows check out. Applying changes every listed price in one go; unchanged rows are left alone.'
            )}
          </p>
          {apply.isError && (
            <p role="alert" className="font-semibold text-oxide">
              ✕ {apply.error.message}
            </p>
          )}
        </div>
      )}

      <div className="grid gap-2">
        <div role="group" aria-label="Show rows" className="flex flex-wrap gap-2">
          {filters.map(([key, label, n]) => (
            <button
              key={key}
              type="button"
              aria-pressed={filter === key}
              onClick={() => setFilter(key)}
              className={`min-h-10 rounded-full border px-3 font-semibold ${filter === key ? 'border-temper bg-temper-tint text-temper-deep' : 'border-cast-line bg-white'}`}
            >
              {label} <span className="tabular">({n})</span>
            </button>
          ))}
        </div>
        {result.rows.length < result.counts.new + result.counts.changed + result.counts.error && (
          <p className="text-sm text-cast">Showing the first {result.rows.length.toLocaleString('en-US')} rows that need a look.</p>
        )}
        {rows.length === 0 ? (
          <p className="rounded-md border border-dashed border-cast-line bg-white/60 p-4 text-cast">
            {filter === 'error' ? '✓ No rows in error.' : 'No rows of this kind.'}
          </p>
        ) : (
          <div className="max-h-[70vh] overflow-auto rounded-lg bg-white ring-1 ring-cast-line">
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">Rows of {result.fileName}</caption>
              <thead className="sticky top-0 z-10 bg-panel">
                <tr>
                  <th scope="col" className="px-3 py-2 text-right">
                    Row
                  </th>
                  <th scope="col" className="px-3 py-2">
                    Result
                  </th>
                  <th scope="col" className="px-3 py-2">
                    Part
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    Price
                  </th>
                  <th scope="col" className="px-3 py-2">
                    Note
                  </th>
                  <th scope="col" className="px-3 py-2">
                    <span className="sr-only">Actions</span>
                  </th>
                </tr>
              </thead>
              <tbody>
                {rows.map((r) => (
                  <ImportRowView key={`${r.row}-${r.status}-${r.input.price ?? ''}`} importId={result.id} row={r} editable={!applied} />
                ))}
              </tbody>
            </table>
          </div>
        )}
      </div>
    </div>
  );
}
