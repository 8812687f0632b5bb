import { Download, FileUp } from 'lucide-react';
import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import {
  SHAFT_LOG_MAX_BYTES,
  SHAFT_LOG_MAX_ROWS,
  SHAFT_LOG_NAME_MAX,
  type ShaftLog,
  type ShaftLogRowError,
} from '../../../../shared/schemas/shaft-logs';
import type { FitmentFrameMap } from '../../../../shared/schemas/saved-fitments';
import { parseShaftLogCsv, rowErrorsFromFieldErrors } from '../../../../shared/shaft-log-csv';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';
import { shaftLogsPath } from '../api/get-shaft-logs';
import { useUploadShaftLog } from '../api/upload-shaft-log';
import { rowErrorsTitle, ShaftLogRowErrors } from './shaft-log-row-errors';

const EXAMPLE = `time_s,engine_rpm,boost_kpa,shaft_rpm,intake_c
0.0,2340,-45.0,24800,33.0
0.1,2410,-43.4,25100,33.1`;

const fieldClass = 'min-h-11 w-full min-w-0 rounded-md border border-cast-line bg-white px-3';

export interface ShaftLogUploadProps {
  savedId: number;
  frames: readonly FitmentFrameMap[];
  /** The check's best frame, chosen to begin with. */
  defaultFrameCode: string | null;
  onUploaded: (log: ShaftLog) => void;
}

/** Choose a log file and the frame it was taken on; the file is checked here first, then again by the server. */
export function ShaftLogUpload({ savedId, frames, defaultFrameCode, onUploaded }: ShaftLogUploadProps) {
  const id = useId();
  const upload = useUploadShaftLog();
  const fileRef = useRef<HTMLInputElement>(null);
  const errorsRef = useRef<HTMLDivElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [frameCode, setFrameCode] = useState(defaultFrameCode ?? frames[0]?.code ?? '');
  const [name, setName] = useState('');
  const [fileError, setFileError] = useState<string | null>(null);
  const [frameError, setFrameError] = useState<string | null>(null);
  const [rowErrors, setRowErrors] = useState<{ title: string; errors: ShaftLogRowError[]; more: number } | null>(null);
  const [checking, setChecking] = useState(false);
  const [uploaded, setUploaded] = useState<string | null>(null);

  useEffect(() => {
    if (rowErrors) errorsRef.current?.focus();
  }, [rowErrors]);

  const reset = () => {
    upload.reset();
    setUploaded(null);
    setFileError(null);
    setFrameError(null);
    setRowErrors(null);
  };

  const submit = async (e: FormEvent) => {
    e.preventDefault();
    reset();
    if (!file) {
      setFileError('Choose the log file to upload');
      fileRef.current?.focus();
      return;
    }
    if (file.size > SHAFT_LOG_MAX_BYTES) {
      setFileError(`The file is ${(file.size / 1_000_000).toFixed(1)} MB; the limit is ${SHAFT_LOG_MAX_BYTES / 1_000_000} MB. Split the session into shorter logs.`);
      fileRef.current?.focus();
      return;
    }
    // The same reader the server uses: row problems show at once, without sending the file.
    setChecking(true);
    const parsed = parseShaftLogCsv(await file.text());
    setChecking(false);
    if (!parsed.ok) {
      setRowErrors({ title: rowErrorsTitle(parsed.errorCount), errors: parsed.errors, more: parsed.errorCount - parsed.errors.length });
      return;
    }
    upload.mutate(
      { savedId, file, frameCode, name: name.trim() || undefined },
      {
        onSuccess: (log) => {
          setUploaded(log.name);
          setFile(null);
          setName('');
          if (fileRef.current) fileRef.current.value = '';
          onUploaded(log);
        },
        onError: (err) => {
          if (!(err instanceof ApiError)) return;
          const rows = rowErrorsFromFieldErrors(err.fieldErrors);
          if (rows.length > 0) setRowErrors({ title: err.message, errors: rows, more: 0 });
          if (err.fieldErrors.frameCode?.[0]) setFrameError(err.fieldErrors.frameCode[0]);
        },
      },
    );
  };

  // Row and frame problems show where they belong; anything else (too large, too many logs) shows here.
  const serverMessage = upload.error && rowErrors === null && frameError === null ? upload.error.message : null;
  const busy = checking || upload.isPending;

  return (
    <form onSubmit={(e) => void submit(e)} noValidate aria-labelledby={`${id}-title`} className="grid min-w-0 gap-4 rounded-lg bg-white p-5 shadow-sm ring-1 ring-cast-line">
      <h2 id={`${id}-title`} className="text-xl font-bold">
        Upload a log
      </h2>

      <div className="grid gap-1">
        <label htmlFor={`${id}-file`} className="font-semibold">
          Log file (CSV)
        </label>
        <input
          ref={fileRef}
          id={`${id}-file`}
          type="file"
          accept=".csv,.txt,text/csv,text/plain"
          aria-describedby={`${id}-file-hint${fileError ? ` ${id}-file-error` : ''}`}
          aria-invalid={fileError ? true : undefined}
          onChange={(e) => {
            setFile(e.target.files?.[0] ?? null);
            reset();
          }}
          className="min-h-11 w-full min-w-0 rounded-md border border-cast-line bg-paper p-2 file:mr-3 file:rounded file:border-0 file:bg-temper file:px-3 file:py-1.5 file:font-semibold file:text-white"
        />
        <p id={`${id}-file-hint`} className="text-sm text-cast">
          Up to {SHAFT_LOG_MAX_BYTES / 1_000_000} MB and {SHAFT_LOG_MAX_ROWS.toLocaleString('en-US')} rows, as the logger exports it.
        </p>
        {fileError && (
          <p id={`${id}-file-error`} className="text-sm font-semibold text-oxide">
            {fileError}
          </p>
        )}
      </div>

      <div className="grid gap-1">
        <label htmlFor={`${id}-frame`} className="font-semibold">
          Frame the log was taken on
        </label>
        <select
          id={`${id}-frame`}
          value={frameCode}
          onChange={(e) => {
            setFrameCode(e.target.value);
            setFrameError(null);
          }}
          aria-describedby={frameError ? `${id}-frame-error` : `${id}-frame-hint`}
          aria-invalid={frameError ? true : undefined}
          className={fieldClass}
        >
          {frames.map((f) => (
            <option key={f.code} value={f.code}>
              {f.code} {f.name}
              {f.code === defaultFrameCode ? ' (best fit for this check)' : ''}
            </option>
          ))}
        </select>
        <p id={`${id}-frame-hint`} className="text-sm text-cast">
          The points are laid on this frame’s compressor map.
        </p>
        {frameError && (
          <p id={`${id}-frame-error`} className="text-sm font-semibold text-oxide">
            {frameError}
          </p>
        )}
      </div>

      <div className="grid gap-1">
        <label htmlFor={`${id}-name`} className="font-semibold">
          Name <span className="font-normal text-cast">(optional)</span>
        </label>
        <input
          id={`${id}-name`}
          value={name}
          maxLength={SHAFT_LOG_NAME_MAX}
          onChange={(e) => setName(e.target.value)}
          aria-describedby={`${id}-name-hint`}
          className={fieldClass}
        />
        <p id={`${id}-name-hint`} className="text-sm text-cast">
          Such as “third-gear pull, hot day”. Without one, the file’s name is used.
        </p>
      </div>

      {rowErrors && <ShaftLogRowErrors ref={errorsRef} {...rowErrors} />}
      {uploaded && (
        <p role="status" className="font-semibold text-machined">
          Uploaded “{uploaded}”: its points are on the map below.
        </p>
      )}
      {serverMessage && (
        <p role="alert" className="font-semibold text-oxide">
          {serverMessage}
        </p>
      )}

      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <Button type="submit" disabled={busy}>
          <FileUp aria-hidden className="size-4" />
          {checking ? 'Checking the file…' : upload.isPending ? 'Uploading…' : 'Upload log'}
        </Button>
        {frameCode && (
          <a
            href={`/api${shaftLogsPath(savedId)}/sample.csv?frameCode=${encodeURIComponent(frameCode)}`}
            download
            className="inline-flex min-h-11 items-center gap-1.5 font-semibold text-temper underline underline-offset-2 hover:text-temper-deep"
          >
            <Download aria-hidden className="size-4" />
            Download a sample log<span className="sr-only"> for frame {frameCode}</span>
          </a>
        )}
      </div>

      <details className="rounded-md border border-cast-line">
        <summary className="min-h-11 cursor-pointer px-3 py-2 font-semibold text-temper">What the file looks like</summary>
        <div className="grid gap-2 border-t border-cast-line px-3 py-3 text-sm">
          <p>
            Comma-separated text with a header row, one row per sample, times rising. Columns, in any order (others are ignored; lines starting
            with # are skipped):
          </p>
          <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-3 gap-y-1">
            <dt className="font-mono text-xs leading-5 font-semibold">time_s</dt>
            <dd>seconds since the logger started</dd>
            <dt className="font-mono text-xs leading-5 font-semibold">engine_rpm</dt>
            <dd>engine speed</dd>
            <dt className="font-mono text-xs leading-5 font-semibold">boost_kpa</dt>
            <dd>boost, gauge (0 = the air around); or boost_psi, or boost_bar</dd>
            <dt className="font-mono text-xs leading-5 font-semibold">shaft_rpm</dt>
            <dd>turbo shaft speed from the sensor</dd>
            <dt className="font-mono text-xs leading-5 font-semibold">intake_c</dt>
            <dd>charge-air temperature in the manifold, °C</dd>
          </dl>
          <pre className="tabular max-w-full overflow-x-auto rounded bg-panel px-3 py-2 text-xs">{EXAMPLE}</pre>
        </div>
      </details>
    </form>
  );
}
