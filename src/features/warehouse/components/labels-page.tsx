import { Printer, Tags } from 'lucide-react';
import { useState, type FormEvent } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { BinLabel, LabelSheet, PartLabel } from '../../../../shared/schemas/labels';
import { Button } from '../../../components/ui/button';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/form';
import { Notice } from '../../../components/ui/notice';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { useBins } from '../api/get-bins';
import { useLabels } from '../api/get-labels';

/** Part labels: 3 × 8 of 70 × 37 mm on A4; bin labels: 2 × 8 of 105 × 37 mm (shared/schemas/labels.ts). */
const PART_PER_SHEET = 24;
const BIN_PER_SHEET = 16;
const KEYS = ['parts', 'receipts', 'binFrom', 'binTo', 'copies'] as const;

const svgUrl = (svg: string) => `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svg)}`;

function sheetsOf<T>(items: T[], perSheet: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += perSheet) out.push(items.slice(i, i + perSheet));
  return out;
}

function expand<T extends { copies: number }>(labels: T[]): T[] {
  return labels.flatMap((l) => Array.from({ length: l.copies }, () => l));
}

/** The Floor's label sheets: choose parts, a goods-in receipt or a range of bins; the sheet shows as it prints. */
export function LabelsPage() {
  const [params, setParams] = useSearchParams();
  const chosen = new URLSearchParams();
  for (const k of KEYS) {
    const v = params.get(k)?.trim();
    if (v) chosen.set(k, v);
  }
  const query = chosen.has('parts') || chosen.has('receipts') || chosen.has('binFrom') || chosen.has('binTo') ? chosen.toString() : '';
  const labels = useLabels(query);
  const bins = useBins();
  const [form, setForm] = useState(() => ({
    parts: params.get('parts')?.split(',').join('\n') ?? '',
    receipts: params.get('receipts') ?? '',
    binFrom: params.get('binFrom') ?? '',
    binTo: params.get('binTo') ?? '',
    copies: params.get('copies') ?? '1',
  }));

  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    const next = new URLSearchParams();
    const parts = form.parts.split(/[\s,;]+/).filter(Boolean);
    if (parts.length > 0) next.set('parts', parts.join(','));
    const receipts = form.receipts.split(/[\s,;]+/).filter(Boolean);
    if (receipts.length > 0) next.set('receipts', receipts.join(','));
    if (form.binFrom) next.set('binFrom', form.binFrom);
    if (form.binTo) next.set('binTo', form.binTo);
    if (form.copies && form.copies !== '1') next.set('copies', form.copies);
    setParams(next);
  };
  const set = (k: keyof typeof form) => (e: { target: { value: string } }) => setForm((f) => ({ ...f, [k]: e.target.value }));
  const binOptions = bins.data?.items ?? [];

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <div className="no-print grid gap-6 lg:grid-cols-[minmax(0,1fr)_minmax(0,1fr)] lg:items-start">
        <form onSubmit={onSubmit} aria-labelledby="labels-choose" className="grid gap-4 rounded-lg border-2 border-cast-line bg-white p-5">
          <h2 id="labels-choose" className="flex items-center gap-2 text-xl font-bold">
            <Tags aria-hidden className="size-6 text-temper" />
            What to print
          </h2>
          <TextAreaField
            variant="floor"
            id="labels-parts"
            label="Part numbers or GTINs"
            optional
            rows={3}
            hint="One per line or separated by commas; add *3 for three labels of one part."
            value={form.parts}
            onChange={set('parts')}
            spellCheck={false}
            className="part-no uppercase"
          />
          <TextField
            variant="floor"
            id="labels-receipts"
            label="Goods-in receipts"
            optional
            hint="Such as GI-123, shown on Goods in after each delivery: one label per unit received."
            value={form.receipts}
            onChange={set('receipts')}
            autoComplete="off"
            className="part-no uppercase"
          />
          <div className="grid gap-4 sm:grid-cols-2">
            <SelectField variant="floor" id="labels-bin-from" label="Bins from" optional value={form.binFrom} onChange={set('binFrom')}>
              <option value="">{bins.isPending ? 'Loading bins…' : 'No bin labels'}</option>
              {binOptions.map((b) => (
                <option key={b.code} value={b.code}>
                  {b.code}
                </option>
              ))}
            </SelectField>
            <SelectField variant="floor" id="labels-bin-to" label="Bins to" optional hint="In walking order." value={form.binTo} onChange={set('binTo')}>
              <option value="">{form.binFrom ? 'Just that bin' : 'No bin labels'}</option>
              {binOptions.map((b) => (
                <option key={b.code} value={b.code}>
                  {b.code}
                </option>
              ))}
            </SelectField>
          </div>
          <TextField
            variant="floor"
            id="labels-copies"
            label="Copies of each label"
            inputMode="numeric"
            value={form.copies}
            onChange={(e) => setForm((f) => ({ ...f, copies: e.target.value.replace(/[^\d]/g, '').slice(0, 2) }))}
            className="w-28 text-right tabular"
          />
          <div>
            <Button type="submit" size="lg">
              <Tags aria-hidden className="size-5" />
              Show the labels
            </Button>
          </div>
        </form>
        <section aria-labelledby="labels-summary" className="grid gap-3">
          <h2 id="labels-summary" className="text-xl font-bold">
            Sheets
          </h2>
          {!query && <p className="rounded-md border border-dashed border-cast-line bg-white/60 p-4 text-cast">Choose parts, a receipt or bins; the sheets show here as they print.</p>}
          {query && labels.isPending && <LoadingState label="Drawing the labels…" />}
          {query && labels.error && <ErrorState title="The labels could not be drawn" message={labels.error.message} onRetry={() => void labels.refetch()} />}
          {labels.data && query && <Summary sheet={labels.data} />}
        </section>
      </div>
      {labels.data && query && <Sheets sheet={labels.data} />}
    </div>
  );
}

function Summary({ sheet }: { sheet: LabelSheet }) {
  const partCount = sheet.parts.reduce((s, l) => s + l.copies, 0);
  const binCount = sheet.bins.reduce((s, l) => s + l.copies, 0);
  const sheets = Math.ceil(partCount / PART_PER_SHEET) + Math.ceil(binCount / BIN_PER_SHEET);
  return (
    <div className="grid gap-3">
      <p className="text-lg">
        <span className="tabular font-semibold">{partCount}</span> part {partCount === 1 ? 'label' : 'labels'} and <span className="tabular font-semibold">{binCount}</span> bin{' '}
        {binCount === 1 ? 'label' : 'labels'} on <span className="tabular font-semibold">{sheets}</span> A4 {sheets === 1 ? 'sheet' : 'sheets'}.
      </p>
      {sheet.problems.length > 0 && (
        <Notice tone="warning" live="off" title="Left off these sheets">
          <ul className="grid gap-1">
            {sheet.problems.map((p) => (
              <li key={p}>{p}</li>
            ))}
          </ul>
        </Notice>
      )}
      {sheets > 0 && (
        <div>
          <Button size="lg" onClick={() => window.print()}>
            <Printer aria-hidden className="size-5" />
            Print
          </Button>
          <p className="mt-1 text-cast">Print at 100 % (actual size) on A4 label stock: 70 × 37 mm for parts, 105 × 37 mm for bins.</p>
        </div>
      )}
    </div>
  );
}

function Sheets({ sheet }: { sheet: LabelSheet }) {
  const partSheets = sheetsOf(expand(sheet.parts), PART_PER_SHEET);
  const binSheets = sheetsOf(expand(sheet.bins), BIN_PER_SHEET);
  const all = partSheets.length + binSheets.length;
  if (all === 0) return null;
  let n = 0;
  return (
    <section aria-label="Label sheets as they print" tabIndex={0} className="label-sheets -mx-4 overflow-x-auto px-4 pb-4 focus-visible:outline-2 focus-visible:outline-temper">
      {/* As wide as a sheet, centred while it fits; on a narrow screen it scrolls from its left edge. */}
      <div className="mx-auto grid w-max gap-6">
        {partSheets.map((labels, i) => (
          <div key={`p${i}`} role="group" aria-label={`Sheet ${++n} of ${all}: part labels`} className="label-sheet label-sheet--parts">
            {labels.map((l, j) => (
              <PartLabelView key={j} label={l} />
            ))}
          </div>
        ))}
        {binSheets.map((labels, i) => (
          <div key={`b${i}`} role="group" aria-label={`Sheet ${++n} of ${all}: bin labels`} className="label-sheet label-sheet--bins">
            {labels.map((l, j) => (
              <BinLabelView key={j} label={l} />
            ))}
          </div>
        ))}
      </div>
    </section>
  );
}

function PartLabelView({ label }: { label: PartLabel }) {
  return (
    <div className="label label--part">
      <div className="flex items-baseline justify-between gap-2">
        <span className="part-no text-[12pt] leading-none">{label.partNumber}</span>
        {label.binCode && <span className="part-no text-[10pt] leading-none">Bin {label.binCode}</span>}
      </div>
      {/* About the nominal EAN-13 size (37.29 mm wide with its light margins), so any scanner reads it. */}
      <div className="grid grid-cols-[38mm_minmax(0,1fr)] items-start gap-[2mm]">
        <img src={svgUrl(label.barcodeSvg)} alt={`EAN-13 ${label.gtin}`} className="w-[38mm]" />
        <span className="line-clamp-5 text-[7.5pt] leading-tight">{label.shortName}</span>
      </div>
    </div>
  );
}

function BinLabelView({ label }: { label: BinLabel }) {
  return (
    <div className="label label--bin">
      <span className="part-no text-[30pt] leading-none">{label.code}</span>
      {/* Stretched evenly to 60 mm: wide bars read from a few metres away, up a racking ladder. */}
      <img src={svgUrl(label.barcodeSvg)} alt={`Code 128 ${label.code}`} className="h-[14mm] w-[60mm] object-fill" />
      <span className="text-[7pt] leading-none">Zone {label.zone}</span>
    </div>
  );
}
