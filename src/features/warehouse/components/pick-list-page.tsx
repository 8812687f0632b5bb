import { Check, CircleAlert, Gauge, Keyboard, PackageCheck, Undo2 } from 'lucide-react';
import { useEffect, useRef, useState, type FormEvent } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { PickSchema, type PickLine, type PickList } from '../../../../shared/schemas/warehouse';
import { Button, buttonClass } from '../../../components/ui/button';
import { PartPicture } from '../../../components/illustrations/part-picture';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { usePickList } from '../api/get-pick-list';
import { useRecordPick } from '../api/record-pick';
import { currentLine, isLineDone, normalisePartNumber, pickTarget, remainingToPick } from '../lib/pick-progress';
import { ModalDialog } from '../../../components/ui/modal-dialog';
import { ScanFeedback, type ScanOutcome } from './scan-feedback';
import { ScanField } from './scan-field';
import { OrientationNote } from '../../../components/ui/orientation-note';

/** Order numbers from ?orders=SY-1,SY-2, de-duplicated, in the order given. */
export function parseOrdersParam(raw: string | null): string[] {
  if (!raw) return [];
  const seen = new Set<string>();
  for (const part of raw.split(',')) {
    const n = part.trim().toUpperCase();
    if (/^[A-Z]{1,4}-\d{1,10}$/.test(n)) seen.add(n);
  }
  return [...seen].slice(0, 20);
}

export function PickListPage({ orders }: { orders: string[] }) {
  const list = usePickList(orders);
  if (orders.length === 0)
    return (
      <EmptyState title="No orders chosen">
        Open an order from the{' '}
        <Link to="/floor" className="font-semibold text-temper underline underline-offset-2">
          pick queue
        </Link>
        , or tick several there for a batch pick.
      </EmptyState>
    );
  if (list.isPending) return <LoadingState label="Loading the pick list…" />;
  if (list.error)
    return (
      <>
        <h1 className="text-3xl font-bold">Pick list</h1>
        <ErrorState title="The pick list did not load" message={list.error.message} onRetry={() => void list.refetch()} />
      </>
    );
  return <PickWorkspace orders={orders} list={list.data} />;
}

const shortcuts = [
  { keys: 'Enter', what: 'record the scan' },
  { keys: 'Esc', what: 'clear the scan field' },
  { keys: 'Alt + Q', what: 'units per scan' },
  { keys: 'Alt + B', what: 'bin is short' },
  { keys: 'Alt + N', what: 'next line with something to pick' },
];

function PickWorkspace({ orders, list }: { orders: string[]; list: PickList }) {
  const navigate = useNavigate();
  const pick = useRecordPick();
  const scanRef = useRef<HTMLInputElement>(null);
  const qtyRef = useRef<HTMLInputElement>(null);
  const [scan, setScan] = useState('');
  const [qty, setQty] = useState('1');
  const [chosen, setChosen] = useState<number | null>(null);
  const [outcome, setOutcome] = useState<ScanOutcome | null>(null);
  const [stamp, setStamp] = useState(0);
  const [shortOpen, setShortOpen] = useState(false);

  const line = currentLine(list.lines, chosen);
  const batch = list.orders.length > 1;

  const show = (o: ScanOutcome) => {
    setOutcome(o);
    setStamp((s) => s + 1);
  };
  const refocus = () => requestAnimationFrame(() => scanRef.current?.focus());

  const nextLine = () => {
    const open = list.lines.filter((l) => !isLineDone(l));
    if (open.length === 0) return;
    const at = line ? open.findIndex((l) => l.lineId === line.lineId) : -1;
    setChosen((open[(at + 1) % open.length] ?? open[0])?.lineId ?? null);
    refocus();
  };

  // Shortcuts use Alt so plain keys always type into the scan field.
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (!e.altKey || e.ctrlKey || e.metaKey || shortOpen) return;
      if (e.code === 'KeyQ') {
        e.preventDefault();
        qtyRef.current?.focus();
        qtyRef.current?.select();
      } else if (e.code === 'KeyB' && line) {
        e.preventDefault();
        setShortOpen(true);
      } else if (e.code === 'KeyN') {
        e.preventDefault();
        nextLine();
      }
    };
    document.addEventListener('keydown', onKey);
    return () => document.removeEventListener('keydown', onKey);
  });

  const onScan = (e: FormEvent) => {
    e.preventDefault();
    const scanned = normalisePartNumber(scan);
    setScan('');
    refocus();
    if (!line) return;
    if (pick.isPending) {
      show({ kind: 'refused', title: 'Still recording the last scan', detail: 'Nothing was recorded for this one. Scan it again.' });
      return;
    }
    const quantity = Number(qty.trim() || '1');
    const body = PickSchema.safeParse({ lineId: line.lineId, scannedPartNumber: scanned, quantity });
    if (!body.success || quantity < 1) {
      const message = body.success ? 'units per scan must be at least 1' : (body.error.issues[0]?.message ?? 'that scan could not be read');
      show({ kind: 'refused', title: message.charAt(0).toUpperCase() + message.slice(1), detail: 'Nothing was recorded.' });
      return;
    }
    pick.mutate(
      { orderNumber: line.orderNumber, pick: body.data },
      {
        onSuccess: (result) => {
          setQty('1');
          const left = remainingToPick(result.line);
          show({
            kind: 'ok',
            // The server counts within this shipment, which a released back-order needs.
            title: result.message,
            detail: left === 0 ? 'Line complete.' : `${left} more from bin ${result.line.binCode ?? '(no bin)'}.`,
          });
          finishIfDone(result.line);
        },
        onError: (err) => {
          show({
            kind: 'refused',
            title: err.message,
            detail: err instanceof ApiError && err.status === 409 ? 'Check the part against the line and scan again.' : 'Nothing was recorded. Try the scan again.',
          });
        },
      },
    );
  };

  // Moves on to packing once the last line of a single-order pick is done; a batch shows each order's pack link instead.
  const finishIfDone = (updated: PickLine) => {
    const rest = list.lines.filter((l) => l.lineId !== updated.lineId && !isLineDone(l));
    if (rest.length === 0 && isLineDone(updated) && !batch) {
      const number = list.orders[0]?.number ?? updated.orderNumber;
      navigate(`/floor/orders/${encodeURIComponent(number)}/pack`, { state: { flash: `All lines picked for ${number}. Pack it now.` } });
    }
  };

  const title = batch ? `Batch pick — ${list.orders.length} orders` : `Pick list — ${list.orders[0]?.number ?? orders[0] ?? ''}`;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div>
          <h1 className="text-2xl font-bold sm:text-3xl">{title}</h1>
          <ul aria-label="Orders on this pick" className={`mt-2 flex-wrap gap-2 ${batch ? 'flex' : 'hidden sm:flex'}`}>
            {list.orders.map((o) => (
              <li key={o.number} className="rounded-md border border-cast-line bg-white px-3 py-1">
                <span className="part-no">{o.number}</span> · {o.customer} · <span className="text-cast">{o.deliveryZone}</span>
              </li>
            ))}
          </ul>
        </div>
        {/* On a handheld the Floor tabs above lead back to the queue; the room goes to the scan field. */}
        <Link to="/floor" className={`${buttonClass('secondary', 'lg')} max-sm:hidden`}>
          <Undo2 aria-hidden className="size-5" />
          Back to the queue
        </Link>
      </div>

      {list.lines.length === 0 ? (
        <EmptyState title="Nothing on this pick list">These orders have no lines to pick. They may have been picked already.</EmptyState>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[minmax(0,1.1fr)_minmax(0,1fr)] lg:items-start">
          <section aria-labelledby="current-line-heading" className="grid gap-4 lg:sticky lg:top-4">
            <h2 id="current-line-heading" className="sr-only">
              Current line
            </h2>
            {line ? <CurrentLineCard line={line} batch={batch} /> : <AllPicked list={list} />}
            {/* First on a handheld, the line to pick right under it; beside each other on a wide screen. */}
            <form onSubmit={onScan} className="order-first grid gap-3 rounded-lg border-2 border-cast-line bg-white p-4 lg:order-none" aria-label="Scan a part">
              <ScanField
                ref={scanRef}
                id="pick-scan"
                label="Scan or type the part number"
                hint={line ? 'Its part number or GTIN (the EAN-13 on the part’s label); the scanner ends with Enter. A part that is not this line’s is refused and nothing is recorded.' : 'Every line is picked.'}
                value={scan}
                hold={shortOpen}
                disabled={!line}
                onChange={(e) => setScan(e.target.value)}
                onKeyDown={(e) => {
                  if (e.key === 'Escape') setScan('');
                }}
              />
              <div className="flex flex-wrap items-end gap-3">
                <div className="grid gap-1">
                  <label htmlFor="pick-qty" className="font-semibold">
                    Units per scan
                  </label>
                  <input
                    ref={qtyRef}
                    id="pick-qty"
                    inputMode="numeric"
                    value={qty}
                    onChange={(e) => setQty(e.target.value.replace(/[^\d]/g, '').slice(0, 3))}
                    onKeyDown={(e) => {
                      if (e.key === 'Enter' || e.key === 'Escape') {
                        e.preventDefault();
                        refocus();
                      }
                    }}
                    aria-describedby="pick-qty-hint"
                    className="tabular min-h-12 w-24 rounded-md border border-cast-line bg-white px-3 text-right text-xl"
                  />
                </div>
                <p id="pick-qty-hint" className="pb-3 text-cast">
                  Type a count first for a box of several; it goes back to 1 after each scan.
                </p>
              </div>
              <div className="flex flex-wrap gap-3">
                <Button type="submit" size="lg" disabled={!line}>
                  <Check aria-hidden className="size-5" />
                  Record scan
                </Button>
                <Button variant="secondary" size="lg" disabled={!line} onClick={() => setShortOpen(true)} aria-keyshortcuts="Alt+B">
                  <CircleAlert aria-hidden className="size-5" />
                  Bin is short
                </Button>
                <Button variant="quiet" size="lg" disabled={!line} onClick={nextLine} aria-keyshortcuts="Alt+N">
                  Next line
                </Button>
              </div>
            </form>
            <ScanFeedback outcome={outcome} stamp={stamp} idle={line ? `Ready: scan ${line.partNumber} from bin ${line.binCode ?? '(no bin)'}.` : undefined} />
            <Shortcuts />
          </section>

          <section aria-labelledby="lines-heading">
            <h2 id="lines-heading" className="mb-2 text-xl font-bold">
              Lines in bin walk order
            </h2>
            <ol className="grid gap-2">
              {list.lines.map((l) => (
                <LineRow key={l.lineId} line={l} current={line?.lineId === l.lineId} batch={batch} onChoose={() => (setChosen(l.lineId), refocus())} />
              ))}
            </ol>
          </section>
        </div>
      )}

      {line && (
        <ShortPickDialog
          line={line}
          isOpen={shortOpen}
          onClose={() => {
            setShortOpen(false);
            refocus();
          }}
          onDone={(o, updated) => {
            setShortOpen(false);
            show(o);
            refocus();
            if (updated) finishIfDone(updated);
          }}
        />
      )}
    </div>
  );
}

function CurrentLineCard({ line, batch }: { line: PickLine; batch: boolean }) {
  return (
    <div role="group" aria-label="Pick this now" className="grid gap-3 rounded-lg border-4 border-temper bg-white p-4">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <p className="text-sm font-semibold uppercase tracking-wider text-cast">Go to bin</p>
          <p className="part-no text-5xl leading-none text-temper-deep">{line.binCode ?? 'no bin'}</p>
        </div>
        <div className="text-right">
          <p className="text-sm font-semibold uppercase tracking-wider text-cast">Pick</p>
          <p className="tabular text-5xl font-bold leading-none">{remainingToPick(line)}</p>
          <p className="tabular text-cast">
            picked {line.picked} of {pickTarget(line)}
          </p>
        </div>
      </div>
      <div className="flex items-start gap-4">
        <div className="min-w-0 grow">
          <p className="text-sm font-semibold uppercase tracking-wider text-cast">Part number</p>
          <p className="part-no text-4xl leading-tight">{line.partNumber}</p>
          <p className="text-xl font-semibold">{line.title}</p>
          {batch && <p className="mt-1 text-lg">For order <span className="part-no">{line.orderNumber}</span></p>}
        </div>
        {/* Beside the big part number only where there is room for both; the line list shows it on a phone. */}
        <PartPicture part={line} photo={line.photo} className="hidden size-24 sm:block" />
      </div>
      {line.orientation && (
        <p className="rounded-md bg-temper-tint px-3 py-2 text-lg">
          <span className="font-semibold">Build to: </span>
          <OrientationNote orientation={line.orientation} className="inline-flex text-lg" />
        </p>
      )}
      {line.fitmentSummary && <Fitment summary={line.fitmentSummary} />}
    </div>
  );
}

function Fitment({ summary }: { summary: string }) {
  return (
    <p className="flex items-start gap-2 rounded-md bg-temper-tint px-3 py-2">
      <Gauge aria-hidden className="mt-0.5 size-5 shrink-0 text-temper" />
      <span>
        <span className="font-semibold">Chosen for:</span> {summary}
      </span>
    </p>
  );
}

function LineRow({ line, current, batch, onChoose }: { line: PickLine; current: boolean; batch: boolean; onChoose: () => void }) {
  const done = isLineDone(line);
  return (
    <li
      aria-current={current ? 'step' : undefined}
      aria-label={`${line.binCode ?? 'no bin'} ${line.partNumber}`}
      className={`grid grid-cols-[5.5rem_minmax(0,1fr)_auto] items-center gap-3 rounded-md border-2 p-3 sm:grid-cols-[5.5rem_3.5rem_minmax(0,1fr)_auto] lg:grid-cols-[5.5rem_minmax(0,1fr)_auto] ${
        current ? 'border-temper bg-temper-tint/50' : done ? 'border-cast-line bg-panel/60' : 'border-cast-line bg-white'
      }`}
    >
      {/* The drawing sits under the bin code where the row is narrow (a phone, the half-width column on a wide screen). */}
      <div className="grid justify-items-start gap-2 sm:contents lg:grid">
        <span className="part-no text-2xl">{line.binCode ?? '—'}</span>
        <PartPicture part={line} photo={line.photo} className="size-14" />
      </div>
      <div className="min-w-0">
        <p className="part-no text-xl">{line.partNumber}</p>
        <p className="truncate">{line.title}</p>
        {batch && <p className="text-cast">Order <span className="part-no">{line.orderNumber}</span></p>}
        {line.fitmentSummary && <p className="truncate text-sm text-cast">For: {line.fitmentSummary}</p>}
        <OrientationNote orientation={line.orientation} />
        {line.backordered > 0 && (
          <p className="inline-flex items-center gap-1 font-semibold text-amber">
            <CircleAlert aria-hidden className="size-4" />
            <span className="tabular">{line.backordered}</span> back-ordered
          </p>
        )}
      </div>
      <div className="grid justify-items-end gap-1">
        <p className="tabular text-xl font-bold">
          {line.picked} / {pickTarget(line)}
        </p>
        {done ? (
          <span className="inline-flex items-center gap-1 font-semibold text-machined">
            <Check aria-hidden className="size-5" />
            Picked
          </span>
        ) : current ? (
          <span className="font-semibold text-temper-deep">Picking now</span>
        ) : (
          <Button variant="secondary" className="min-h-12" onClick={onChoose} aria-label={`Pick ${line.partNumber} from ${line.binCode ?? 'no bin'} now`}>
            Pick this
          </Button>
        )}
      </div>
    </li>
  );
}

function AllPicked({ list }: { list: PickList }) {
  return (
    <div className="grid gap-3 rounded-lg border-4 border-machined bg-machined-tint p-4">
      <p className="flex items-center gap-2 text-2xl font-bold text-machined">
        <PackageCheck aria-hidden className="size-8" />
        Every line is picked
      </p>
      <ul className="flex flex-wrap gap-3">
        {list.orders.map((o) => (
          <li key={o.number}>
            <Link to={`/floor/orders/${encodeURIComponent(o.number)}/pack`} className={buttonClass('primary', 'lg')}>
              Pack {o.number}
            </Link>
          </li>
        ))}
      </ul>
    </div>
  );
}

function Shortcuts() {
  return (
    <section aria-labelledby="shortcuts-heading" className="rounded-md border border-cast-line bg-white p-3">
      <h2 id="shortcuts-heading" className="flex items-center gap-2 font-semibold">
        <Keyboard aria-hidden className="size-5 text-cast" />
        Keyboard
      </h2>
      <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
        {shortcuts.map((s) => (
          <div key={s.keys} className="contents">
            <dt>
              <kbd className="rounded border border-cast-line bg-panel px-1.5 py-0.5 font-semibold">{s.keys}</kbd>
            </dt>
            <dd className="text-cast">{s.what}</dd>
          </div>
        ))}
      </dl>
    </section>
  );
}

function ShortPickDialog({ line, isOpen, onClose, onDone }: { line: PickLine; isOpen: boolean; onClose: () => void; onDone: (o: ScanOutcome, updated?: PickLine) => void }) {
  const pick = useRecordPick();
  const remaining = remainingToPick(line);
  const [found, setFound] = useState('0');
  const [error, setError] = useState<string | null>(null);

  useEffect(() => {
    if (isOpen) {
      setFound('0');
      setError(null);
      pick.reset();
    }
    // Reset only when the dialog opens.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [isOpen]);

  const n = Number(found || '0');
  const confirm = (e: FormEvent) => {
    e.preventDefault();
    if (!Number.isInteger(n) || n < 0 || n >= remaining) {
      setError(`Found must be a whole number from 0 to ${remaining - 1}; if all ${remaining} are there, scan them instead.`);
      return;
    }
    pick.mutate(
      { orderNumber: line.orderNumber, pick: { lineId: line.lineId, scannedPartNumber: line.partNumber, quantity: n, short: true } },
      {
        onSuccess: (result) =>
          onDone(
            {
              kind: 'ok',
              title: result.message,
              detail: `${result.line.picked} picked in all, ${result.line.backordered} back-ordered. The customer has been e-mailed.`,
            },
            result.line,
          ),
        onError: (err) => setError(err.message),
      },
    );
  };

  return (
    <ModalDialog title="Bin is short" isOpen={isOpen} onClose={onClose}>
      <form onSubmit={confirm} className="grid gap-4" noValidate>
        <p className="text-lg">
          Bin <span className="part-no">{line.binCode ?? '—'}</span> should hold <span className="tabular font-semibold">{remaining}</span> more of{' '}
          <span className="part-no">{line.partNumber}</span>. Count what is there: those are picked, and the rest becomes a back-order. The customer is told by
          e-mail.
        </p>
        {error && (
          <p role="alert" className="flex items-center gap-2 rounded-md border-2 border-oxide bg-oxide-tint p-3 font-semibold text-oxide">
            <CircleAlert aria-hidden className="size-5 shrink-0" />
            {error}
          </p>
        )}
        <div className="grid gap-1">
          <label htmlFor="short-found" className="text-lg font-semibold">
            Found in the bin now
          </label>
          <input
            id="short-found"
            autoFocus
            inputMode="numeric"
            value={found}
            onChange={(e) => setFound(e.target.value.replace(/[^\d]/g, '').slice(0, 3))}
            aria-describedby="short-found-hint"
            className="tabular min-h-12 w-28 rounded-md border border-cast-line bg-white px-3 text-right text-xl"
          />
          <p id="short-found-hint" className="text-cast">
            {Number.isInteger(n) && n < remaining ? `${remaining - n} will be back-ordered.` : `At most ${remaining - 1}.`}
          </p>
        </div>
        <div className="flex flex-wrap gap-3">
          <Button type="submit" size="lg" disabled={pick.isPending}>
            {pick.isPending ? 'Recording…' : 'Record short pick'}
          </Button>
          <Button variant="secondary" size="lg" onClick={onClose}>
            Cancel
          </Button>
        </div>
      </form>
    </ModalDialog>
  );
}
