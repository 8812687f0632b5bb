import { FileUp } from 'lucide-react';
import { useId, useState, type FormEvent } from 'react';
import { PRICE_IMPORT_MAX_BYTES, PRICE_IMPORT_MAX_ROWS, type PriceImport } from '../../../../shared/schemas/admin-catalog';
import { Button } from '../../../components/ui/button';
import { useUploadPriceImport, type UploadProgress } from '../api/upload-price-import';
import { formatBytes } from '../lib/money';

const EXAMPLE = `part_number,price,core_deposit,title,category,weight_kg,frame
FLG-50-0201,14.25,,,,,
CHS-10-0201-XCH,1189.00,250.00,,,,
CHS-50-0901,42.50,,Oil feed line 300 mm,gaskets-fittings,0.2,CHS`;

const COLUMNS: Array<[string, string]> = [
  ['part_number', 'Required. The part to price; a number we do not have yet creates a new part.'],
  ['price', 'Required. Retail price in dollars, e.g. 123.45.'],
  ['core_deposit', 'Optional. Dollars; exchange units only.'],
  ['title, category, weight_kg', 'Needed only for a new part. Category is one of the catalogue slugs, e.g. gaskets-fittings.'],
  ['frame', 'Optional, new parts only: the frame code, e.g. CHS.'],
];

export function PriceImportUpload({ onUploaded }: { onUploaded: (result: PriceImport) => void }) {
  const [file, setFile] = useState<File | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const upload = useUploadPriceImport(setProgress);
  const inputId = useId();

  const choose = (f: File | undefined) => {
    setProblem(null);
    upload.reset();
    setProgress(null);
    setFile(f ?? null);
    if (f && f.size > PRICE_IMPORT_MAX_BYTES) setProblem(`${f.name} is ${formatBytes(f.size)}; a price list may be at most ${formatBytes(PRICE_IMPORT_MAX_BYTES)}.`);
    else if (f && !/\.csv$/i.test(f.name) && f.type !== 'text/csv') setProblem(`${f.name} does not look like a CSV file. Save the sheet as CSV (comma separated) first.`);
  };

  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (!file) return setProblem('Choose the CSV file to import first.');
    if (problem) return;
    upload.mutate(file, { onSuccess: onUploaded });
  };

  const pct = progress && progress.total > 0 ? Math.round((progress.loaded / progress.total) * 100) : 0;

  return (
    <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
      <form noValidate onSubmit={submit} aria-label="Upload a price list" className="grid content-start gap-4 rounded-lg bg-white p-5 ring-1 ring-cast-line">
        <h2 className="text-lg font-bold">Upload a price list</h2>
        <div className="grid gap-1">
          <label htmlFor={inputId} className="font-semibold">
            CSV file
          </label>
          <input
            id={inputId}
            type="file"
            accept=".csv,text/csv"
            aria-describedby={`${inputId}-hint${problem ? ` ${inputId}-error` : ''}`}
            aria-invalid={problem ? true : undefined}
            onChange={(e) => choose(e.target.files?.[0])}
            className="min-h-11 rounded-md border border-cast-line bg-white p-2 file:mr-3 file:rounded file:border-0 file:bg-temper-tint file:px-3 file:py-1 file:font-semibold file:text-temper-deep"
          />
          <p id={`${inputId}-hint`} className="text-sm text-cast">
            Comma-separated, a header row first, at most {formatBytes(PRICE_IMPORT_MAX_BYTES)} and {PRICE_IMPORT_MAX_ROWS.toLocaleString('en-US')} rows. Nothing changes until you
            check the preview and apply it.
          </p>
          {problem && (
            <p id={`${inputId}-error`} role="alert" className="text-sm font-semibold text-oxide">
              ✕ {problem}
            </p>
          )}
        </div>
        {file && !problem && (
          <p className="text-sm">
            <span className="font-semibold">{file.name}</span> · <span className="tabular">{formatBytes(file.size)}</span>
          </p>
        )}
        {upload.isPending && (
          <div className="grid gap-1">
            <div className="flex justify-between text-sm">
              <span id={`${inputId}-progress-label`}>{pct < 100 ? 'Uploading…' : 'Uploaded; checking the rows…'}</span>
              <span className="tabular">
                {progress ? `${formatBytes(progress.loaded)} of ${formatBytes(progress.total)}` : ''} · {pct}%
              </span>
            </div>
            <div
              role="progressbar"
              aria-labelledby={`${inputId}-progress-label`}
              aria-valuemin={0}
              aria-valuemax={100}
              aria-valuenow={pct}
              className="h-3 overflow-hidden rounded-full bg-panel ring-1 ring-cast-line"
            >
              <div className="h-full bg-temper transition-[width]" style={{ width: `${pct}%` }} />
            </div>
          </div>
        )}
        {upload.isError && (
          <p role="alert" className="rounded-md border-2 border-oxide bg-oxide-tint p-3 font-semibold text-oxide">
            ✕ The upload was refused: {upload.error.message}
          </p>
        )}
        <div>
          <Button type="submit" disabled={upload.isPending}>
            <FileUp aria-hidden className="size-4" />
            {upload.isPending ? 'Uploading…' : 'Upload and preview'}
          </Button>
        </div>
      </form>

      <section aria-labelledby="csv-columns-heading" className="grid content-start gap-3">
        <h2 id="csv-columns-heading" className="text-lg font-bold">
          Expected columns
        </h2>
        <dl className="grid gap-2">
          {COLUMNS.map(([name, text]) => (
            <div key={name}>
              <dt className="font-mono text-sm font-semibold">{name}</dt>
              <dd className="text-sm text-cast">{text}</dd>
            </div>
          ))}
        </dl>
        <p className="text-sm font-semibold" id="csv-example-label">
          Example
        </p>
        <pre aria-labelledby="csv-example-label" tabIndex={0} className="overflow-x-auto rounded-md bg-panel p-3 text-sm">
          {EXAMPLE}
        </pre>
      </section>
    </div>
  );
}
