import { AlertOctagon, AlertTriangle, ArrowRight, CircleCheck, CircleDot, Equal, Plus, Trash2 } from 'lucide-react';
import { useId, useState, type FormEvent, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { formatDateTime } from '../../../../shared/format';
import { MAX_MAX_CHANGE_PCT, MIN_MAX_CHANGE_PCT, NEAR_ZERO_CENTS, PRICE_FLAG_LABELS } from '../../../../shared/price-import-flags';
import type { PriceImport, PriceImportRow } from '../../../../shared/schemas/admin-catalog';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useAcknowledgePriceImportRows } from '../api/acknowledge-price-import-rows';
import { useApplyPriceImport } from '../api/apply-price-import';
import { useDropPriceImportRow } from '../api/drop-price-import-row';
import { useFixPriceImportRow } from '../api/fix-price-import-row';
import { useSetPriceImportThreshold } from '../api/set-price-import-threshold';
import { ModalDialog } from '../../../components/ui/modal-dialog';

type Filter = 'all' | 'flagged' | 'changed' | 'new' | 'error';
type ShownRow = PriceImport['rows'][number];
const plural = (n: number, one: string, many: string) => `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;
const isFlagged = (r: PriceImportRow) => (r.flags?.length ?? 0) > 0;

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

export function ImportCounts({ counts, flagged }: { counts: PriceImport['counts']; flagged?: number }) {
  return (
    <dl className={`grid grid-cols-2 gap-3 ${flagged === undefined ? 'md:grid-cols-4' : 'md:grid-cols-5'}`} aria-label="Rows by result">
      <Count label="New parts" value={counts.new} tone="bg-temper-tint ring-temper/40" icon={<Plus aria-hidden className="size-6 text-temper" />} />
      <Count label="Price changed" value={counts.changed} tone="bg-amber-tint ring-amber-line/50" icon={<CircleDot aria-hidden className="size-6 text-amber" />} />
      <Count label="Unchanged" value={counts.unchanged} tone="bg-white ring-cast-line" icon={<Equal aria-hidden className="size-6 text-cast" />} />
      <Count label="In error" value={counts.error} tone={counts.error > 0 ? 'bg-oxide-tint ring-oxide/50' : 'bg-white ring-cast-line'} icon={<AlertOctagon aria-hidden className={`size-6 ${counts.error > 0 ? 'text-oxide' : 'text-cast'}`} />} />
      {flagged !== undefined && (
        <Count
          label="Flagged"
          value={flagged}
          tone={flagged > 0 ? 'bg-amber-tint ring-amber-line' : 'bg-white ring-cast-line'}
          icon={<AlertTriangle aria-hidden className={`size-6 ${flagged > 0 ? 'text-amber' : 'text-cast'}`} />}
        />
      )}
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

/** A flagged row: what was seen, and whether someone has looked (a checkbox while the list is still a preview). */
function RowFlags({ importId, row, editable }: { importId: number; row: ShownRow; editable: boolean }) {
  const ack = useAcknowledgePriceImportRows(importId);
  return (
    <div className="grid gap-1">
      <span className="inline-flex items-center gap-1 font-semibold text-amber">
        <AlertTriangle aria-hidden className="size-4 shrink-0" /> Flagged: {(row.flags ?? []).map((f) => PRICE_FLAG_LABELS[f].toLowerCase()).join(', ')}
      </span>
      <ul className="text-sm">
        {(row.flagNotes ?? []).map((n) => (
          <li key={n}>{n}</li>
        ))}
      </ul>
      {editable ? (
        <label className="inline-flex min-h-10 items-center gap-2 text-sm font-semibold">
          <input
            type="checkbox"
            className="size-5 accent-temper"
            // Shows the choice at once; the server's answer then confirms it (or the error below says why not).
            checked={ack.isPending ? ack.variables.acknowledged : row.acknowledged}
            disabled={ack.isPending}
            onChange={(e) => ack.mutate({ rows: [row.row], acknowledged: e.target.checked })}
            aria-label={`Acknowledge row ${row.row} (${row.partNumber})`}
          />
          Looked at: the price is meant
        </label>
      ) : (
        row.acknowledged && (
          <span className="inline-flex items-center gap-1 text-sm text-machined">
            <CircleCheck aria-hidden className="size-4" /> Acknowledged
          </span>
        )
      )}
      {ack.isError && (
        <span role="alert" className="text-sm font-semibold text-oxide">
          {ack.error.message}
        </span>
      )}
    </div>
  );
}

function ImportRowView({ importId, row, editable }: { importId: number; row: ShownRow; editable: boolean }) {
  const [editing, setEditing] = useState(false);
  const drop = useDropPriceImportRow(importId);
  const flagged = isFlagged(row);
  const tone = row.status === 'error' ? 'bg-oxide-tint/50' : flagged && !row.acknowledged ? 'bg-amber-tint/60' : '';
  const note =
    row.status === 'error' ? (
      <span className="font-semibold text-oxide">{row.message}</span>
    ) : flagged ? (
      <RowFlags importId={importId} row={row} editable={editable} />
    ) : (
      <span className="text-cast">{row.message ?? ''}</span>
    );
  const actions = (
    <>
      {editable && (row.status === 'error' || flagged) && (
        <span className="flex gap-2 whitespace-nowrap md:justify-end">
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
    </>
  );
  return (
    <>
      <tr className={`border-b border-cast-line align-top ${tone}`}>
        <td className="tabular px-3 py-2 text-right text-cast">{row.row}</td>
        <td className="hidden px-3 py-2 md:table-cell">
          <RowStatus row={row} />
        </td>
        <td className="px-3 py-2">
          <span className="part-no">{row.partNumber || '(blank)'}</span>
          {row.title && <span className="block text-sm text-cast">{row.title}</span>}
          {/* On a phone the result, note and actions sit under the part instead of in columns of their own. */}
          <div className="mt-2 grid gap-2 md:hidden">
            <RowStatus row={row} />
            {note}
            {actions}
          </div>
        </td>
        <td className="tabular px-3 py-2 text-right">
          {row.status === 'changed' ? (
            <span className="inline-flex flex-wrap items-center justify-end gap-1 md:whitespace-nowrap">
              <span className="text-cast line-through decoration-1">{price(row.oldPriceCents)}</span>
              <ArrowRight aria-label="to" className="size-4" />
              <span className="font-semibold">{price(row.newPriceCents)}</span>
            </span>
          ) : row.status === 'error' ? (
            <span className="font-mono text-sm">{row.input.price ?? ''}</span>
          ) : (
            price(row.newPriceCents)
          )}
          {row.newCoreCents !== null && row.newCoreCents !== undefined && (row.status === 'changed' || row.newCoreCents > 0) && (
            <span className="block text-sm text-cast md:whitespace-nowrap">
              core {row.status === 'changed' ? `${price(row.oldCoreCents ?? null)} → ` : ''}
              {price(row.newCoreCents)}
            </span>
          )}
        </td>
        <td className="hidden px-3 py-2 md:table-cell">{note}</td>
        <td className="hidden px-3 py-2 text-right md:table-cell">{actions}</td>
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

/** The share a price may move before its row is flagged; changing it flags the rows again. */
function ThresholdForm({ result }: { result: PriceImport }) {
  const id = useId();
  const [value, setValue] = useState(String(result.maxChangePct));
  const [problem, setProblem] = useState<string | null>(null);
  const set = useSetPriceImportThreshold(result.id);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const n = Number(value);
    if (!Number.isInteger(n) || n < MIN_MAX_CHANGE_PCT || n > MAX_MAX_CHANGE_PCT) return setProblem(`Enter a whole percentage from ${MIN_MAX_CHANGE_PCT} to ${MAX_MAX_CHANGE_PCT}.`);
    setProblem(null);
    set.mutate(n);
  };
  return (
    <form onSubmit={submit} noValidate aria-label="Flag rules" className="grid gap-1">
      <label htmlFor={id} className="font-semibold">
        Flag a price that moves more than
      </label>
      <div className="flex flex-wrap items-center gap-2">
        <span className="inline-flex items-center rounded-md border border-cast-line bg-white focus-within:border-temper">
          <input
            id={id}
            type="number"
            inputMode="numeric"
            min={MIN_MAX_CHANGE_PCT}
            max={MAX_MAX_CHANGE_PCT}
            value={value}
            onChange={(e) => setValue(e.target.value)}
            aria-describedby={`${id}-hint${problem || set.isError ? ` ${id}-error` : ''}`}
            aria-invalid={problem ? true : undefined}
            className="tabular min-h-10 w-20 rounded-md bg-transparent px-2 text-right"
          />
          <span className="pr-3 text-cast">%</span>
        </span>
        <Button type="submit" variant="secondary" disabled={set.isPending || Number(value) === result.maxChangePct}>
          {set.isPending ? 'Flagging…' : 'Flag again'}
        </Button>
      </div>
      <p id={`${id}-hint`} className="text-sm text-cast">
        Either way, up or down. A price under {formatPrice(NEAR_ZERO_CENTS)} and a core deposit above the price are always flagged.
      </p>
      {(problem || set.isError) && (
        <p id={`${id}-error`} role="alert" className="text-sm font-semibold text-oxide">
          ✕ {problem ?? set.error?.message}
        </p>
      )}
    </form>
  );
}

function ApplyConfirm({ result, isOpen, onClose, onApply, pending }: { result: PriceImport; isOpen: boolean; onClose: () => void; onApply: () => void; pending: boolean }) {
  const { changed, new: added, unchanged } = result.counts;
  return (
    <ModalDialog title="Apply this price list?" isOpen={isOpen} onClose={onClose}>
      <p>
        <span className="font-mono">{result.fileName}</span> changes the catalogue at once; shop and search show the new prices straight away.
      </p>
      <ul className="grid gap-1" aria-label="What applying does">
        <li className="tabular">{plural(changed, 'price changes', 'prices change')}</li>
        <li className="tabular">{plural(added, 'new part is added', 'new parts are added')}</li>
        {result.flagged > 0 && <li className="tabular font-semibold text-amber">{plural(result.flagged, 'flagged row', 'flagged rows')}, acknowledged</li>}
        <li className="tabular text-cast">{plural(unchanged, 'row is', 'rows are')} unchanged and left alone</li>
      </ul>
      <p className="text-sm text-cast">It is recorded in the import history and the audit log under your name.</p>
      <div className="flex flex-wrap gap-3">
        <Button onClick={onApply} disabled={pending}>
          {pending ? 'Applying…' : `Apply ${plural(changed + added, 'change', 'changes')}`}
        </Button>
        <Button variant="secondary" onClick={onClose}>
          Go back
        </Button>
      </div>
    </ModalDialog>
  );
}

export function PriceImportPreview({ result, onStartOver }: { result: PriceImport; onStartOver: () => void }) {
  const [filter, setFilter] = useState<Filter>(result.counts.error > 0 ? 'error' : result.unacknowledged > 0 ? 'flagged' : 'all');
  const [confirming, setConfirming] = useState(false);
  const apply = useApplyPriceImport(result.id);
  const ackAll = useAcknowledgePriceImportRows(result.id);
  const applied = result.status === 'applied';
  const errors = result.counts.error;
  const waiting = result.unacknowledged;
  const changes = result.counts.changed + result.counts.new;
  const rows = result.rows.filter((r) => filter === 'all' || (filter === 'flagged' ? isFlagged(r) : r.status === filter));
  const filters: Array<[Filter, string, number]> = [
    ['all', 'All listed', result.rows.length],
    ['error', 'Errors', result.rows.filter((r) => r.status === 'error').length],
    ['flagged', 'Flagged', result.rows.filter(isFlagged).length],
    ['changed', 'Changed', result.rows.filter((r) => r.status === 'changed').length],
    ['new', 'New', result.rows.filter((r) => r.status === 'new').length],
  ];
  const blocked = errors > 0 || waiting > 0 || changes === 0;

  return (
    <div className="grid gap-5">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-xl font-bold">
          {applied ? 'Applied' : 'Preview'}: <span className="font-mono text-lg">{result.fileName}</span>
        </h2>
        <p className="tabular text-cast">
          {result.totalRows.toLocaleString('en-US')} rows read · uploaded by {result.createdBy}, {formatDateTime(result.createdAt)}
        </p>
      </div>

      {applied && (
        <Notice tone="done" title="Price list applied">
          <p>
            {plural(result.counts.changed, 'price', 'prices')} changed, {plural(result.counts.new, 'new part', 'new parts')}, {result.counts.unchanged} unchanged
            {result.appliedAt ? ` · ${formatDateTime(result.appliedAt)}` : ''}
            {result.appliedBy ? ` by ${result.appliedBy}` : ''}. The catalogue and search show the new prices now.
          </p>
          <p className="mt-2 flex flex-wrap gap-4">
            <Link to="/office/price-imports" className="font-semibold text-temper underline underline-offset-2">
              Import history
            </Link>
            <Link to={`/office/audit?import=${result.id}`} className="font-semibold text-temper underline underline-offset-2">
              Audit log
            </Link>
            <button type="button" onClick={onStartOver} className="font-semibold text-temper underline underline-offset-2">
              Import another price list
            </button>
          </p>
        </Notice>
      )}

      <ImportCounts counts={result.counts} flagged={result.flagged} />

      {!applied && (
        <div className="grid gap-4 rounded-lg bg-white p-4 ring-1 ring-cast-line md:grid-cols-[1fr_auto]">
          <ThresholdForm key={result.maxChangePct} result={result} />
          {result.flagged > 0 && (
            <div className="grid content-start gap-2 md:max-w-sm">
              <p className={waiting > 0 ? 'inline-flex items-start gap-1 font-semibold text-amber' : 'inline-flex items-start gap-1 text-machined'}>
                {waiting > 0 ? <AlertTriangle aria-hidden className="mt-0.5 size-4 shrink-0" /> : <CircleCheck aria-hidden className="mt-0.5 size-4 shrink-0" />}
                {waiting > 0
                  ? `${plural(waiting, 'flagged row waits', 'flagged rows wait')} for a look.`
                  : `All ${plural(result.flagged, 'flagged row', 'flagged rows')} acknowledged.`}
              </p>
              {waiting > 0 ? (
                <Button variant="secondary" disabled={ackAll.isPending} onClick={() => ackAll.mutate({ allFlagged: true, acknowledged: true })}>
                  Acknowledge all {plural(result.flagged, 'flagged row', 'flagged rows')}
                </Button>
              ) : (
                <Button variant="quiet" disabled={ackAll.isPending} onClick={() => ackAll.mutate({ allFlagged: true, acknowledged: false })}>
                  Take back the acknowledgements
                </Button>
              )}
              {ackAll.isError && (
                <p role="alert" className="text-sm font-semibold text-oxide">
                  ✕ {ackAll.error.message}
                </p>
              )}
            </div>
          )}
        </div>
      )}

      {!applied && (
        <div className="grid gap-2 rounded-lg bg-white p-4 ring-1 ring-cast-line">
          <div className="flex flex-wrap items-center gap-3">
            <Button size="lg" disabled={blocked || apply.isPending} aria-describedby="apply-why" onClick={() => setConfirming(true)}>
              {apply.isPending ? 'Applying…' : `Apply ${plural(changes, 'change', 'changes')}…`}
            </Button>
            <Button variant="secondary" onClick={onStartOver}>
              Start over with another file
            </Button>
          </div>
          <p id="apply-why" className={blocked ? 'flex items-center gap-1 font-semibold text-oxide' : 'text-cast'}>
            {errors > 0 ? (
              <>
                <AlertOctagon aria-hidden className="size-4 shrink-0" />
                Apply is off while {errors} {errors === 1 ? 'row is' : 'rows are'} in error: fix or drop {errors === 1 ? 'it' : 'them'} first. Nothing is changed until then.
              </>
            ) : waiting > 0 ? (
              <>
                <AlertTriangle aria-hidden className="size-4 shrink-0" />
                Apply is off while {plural(waiting, 'flagged row waits', 'flagged rows wait')} for a look: acknowledge, fix or drop {waiting === 1 ? 'it' : 'them'}.
              </>
            ) : changes === 0 ? (
              'Nothing to apply: every row matches the catalogue.'
            ) : (
              'All rows check out. You confirm the counts before anything changes; unchanged rows are left alone.'
            )}
          </p>
          {apply.isError && (
            <p role="alert" className="font-semibold text-oxide">
              ✕ {apply.error.message}
            </p>
          )}
          <ApplyConfirm
            result={result}
            isOpen={confirming}
            onClose={() => setConfirming(false)}
            pending={apply.isPending}
            onApply={() => apply.mutate(changes, { onSettled: () => setConfirming(false) })}
          />
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
            {filter === 'error' ? '✓ No rows in error.' : filter === 'flagged' ? '✓ No flagged rows.' : 'No rows of this kind.'}
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
                  <th scope="col" className="hidden px-3 py-2 md:table-cell">
                    Result
                  </th>
                  <th scope="col" className="px-3 py-2">
                    Part
                  </th>
                  <th scope="col" className="px-3 py-2 text-right">
                    Price
                  </th>
                  <th scope="col" className="hidden px-3 py-2 md:table-cell">
                    Note
                  </th>
                  <th scope="col" className="hidden px-3 py-2 md:table-cell">
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
