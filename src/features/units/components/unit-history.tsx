import { FileUp, Map as MapIcon, Wrench } from 'lucide-react';
import { useId, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { formatDate, formatDateTime } from '../../../../shared/format';
import { APPLICATIONS, type Application } from '../../../../shared/schemas/fitment';
import { APPLICATION_LABELS, UNIT_EVENT_LABELS, type UnitHistory } from '../../../../shared/schemas/units';
import { Button, buttonClass } from '../../../components/ui/button';
import { Caution } from '../../../components/ui/caution';
import { SelectField, TextField } from '../../../components/ui/form';
import { Notice } from '../../../components/ui/notice';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useUnit } from '../api/get-unit';
import { useSetApplication } from '../api/set-application';
import { useUploadUnitLog } from '../api/upload-unit-log';
import { ServiceDue } from './service-due';

/** Order and service request numbers are worth showing; a log's or a reminder's own key is not. */
const SHOWN_REFS = /^(SY|SR)-\d+$/;

const bearingWord = (b: 'journal' | 'ball') => (b === 'ball' ? 'Ball bearing' : 'Journal bearing');

function Facts({ data }: { data: UnitHistory }) {
  const u = data.unit;
  return (
    <dl className="grid grid-cols-[auto_minmax(0,1fr)] gap-x-6 gap-y-2 rounded-lg border border-cast-line bg-white p-4">
      <dt className="text-cast">Part</dt>
      <dd>
        {u.partNumber ? (
          <Link to={`/parts/${encodeURIComponent(u.partNumber)}`} className="part-no text-temper underline underline-offset-2">
            {u.partNumber}
          </Link>
        ) : (
          '—'
        )}
        {u.title && <span className="block">{u.title}</span>}
      </dd>
      <dt className="text-cast">Frame</dt>
      <dd className="part-no">{u.frameCode ?? '—'}</dd>
      <dt className="text-cast">Bearing</dt>
      <dd>{bearingWord(u.bearing)}</dd>
      <dt className="text-cast">Use</dt>
      <dd>{APPLICATION_LABELS[u.application]}</dd>
      <dt className="text-cast">{u.origin === 'sold' ? 'Sold' : 'First seen'}</dt>
      <dd>{formatDate(u.since)}</dd>
      <dt className="text-cast">Last service</dt>
      <dd>{u.lastServiceAt ? formatDate(u.lastServiceAt) : 'None yet'}</dd>
      <dt className="text-cast">Next service</dt>
      <dd>
        <ServiceDue dueOn={u.nextServiceDue} />
        <span className="block text-sm text-cast">Every {u.intervalMonths} months for a {bearingWord(u.bearing).toLowerCase()} unit in {APPLICATION_LABELS[u.application].toLowerCase()} use (common practice).</span>
      </dd>
      {data.owner && (
        <>
          <dt className="text-cast">Owner</dt>
          <dd>
            {data.owner.name}
            {data.owner.company && <span className="text-cast"> · {data.owner.company}</span>}
          </dd>
        </>
      )}
    </dl>
  );
}

function UseForm({ data }: { data: UnitHistory }) {
  const id = useId();
  const [value, setValue] = useState<Application>(data.unit.application);
  const set = useSetApplication(data.unit.serial);
  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    set.mutate(value);
  };
  return (
    <form onSubmit={onSubmit} className="grid gap-3 rounded-lg border border-cast-line bg-white p-4" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`} className="text-lg font-bold">
        How it is used
      </h2>
      <SelectField id={`${id}-use`} label="Use" hint="Sets how often we remind you to have it serviced." value={value} onChange={(e) => setValue(e.target.value as Application)}>
        {APPLICATIONS.map((a) => (
          <option key={a} value={a}>
            {APPLICATION_LABELS[a]}
          </option>
        ))}
      </SelectField>
      <div>
        <Button type="submit" variant="secondary" disabled={set.isPending || value === data.unit.application}>
          {set.isPending ? 'Saving…' : 'Save the use'}
        </Button>
      </div>
      <div role="status">{set.isSuccess && <Notice live="off">Saved. The next service date follows the new use.</Notice>}</div>
      {set.isError && <ErrorState title="Not saved" message={set.error.message} />}
    </form>
  );
}

function LogUpload({ data }: { data: UnitHistory }) {
  const id = useId();
  const upload = useUploadUnitLog(data.unit.serial);
  const [file, setFile] = useState<File | null>(null);
  const [check, setCheck] = useState<string>(data.savedChecks[0] ? String(data.savedChecks[0].id) : '');
  const [name, setName] = useState('');
  const [missing, setMissing] = useState(false);
  const fieldErrors = upload.error instanceof ApiError ? upload.error.fieldErrors : {};
  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    if (!file || !check) {
      setMissing(true);
      return;
    }
    setMissing(false);
    upload.mutate({ file, savedFitmentId: Number(check), name: name.trim() || undefined }, { onSuccess: () => setName('') });
  };
  if (data.savedChecks.length === 0) {
    return (
      <section aria-labelledby={`${id}-h`} className="grid gap-2 rounded-lg border border-cast-line bg-white p-4">
        <h2 id={`${id}-h`} className="text-lg font-bold">
          Shaft-speed logs
        </h2>
        <p>
          A log is laid on the compressor map through the engine it was taken on. First{' '}
          <Link to="/fitment" className="font-semibold text-temper underline underline-offset-2">
            check and save the engine
          </Link>{' '}
          this unit runs on, then upload the log here.
        </p>
      </section>
    );
  }
  const fileError = (missing && !file ? 'choose a log file (.csv)' : undefined) ?? fieldErrors.file?.[0];
  return (
    <form onSubmit={onSubmit} className="grid gap-3 rounded-lg border border-cast-line bg-white p-4" aria-labelledby={`${id}-h`} noValidate>
      <h2 id={`${id}-h`} className="text-lg font-bold">
        Upload a shaft-speed log
      </h2>
      <p className="text-sm text-cast">
        A CSV from a plug-in logger (time, engine rpm, boost, shaft rpm, intake temperature), taken on this unit (frame {data.unit.frameCode ?? '—'}).
      </p>
      <SelectField id={`${id}-check`} label="Engine (saved check)" hint="The engine this unit is on: its numbers place the log on the map." value={check} onChange={(e) => setCheck(e.target.value)} error={fieldErrors.savedFitmentId?.[0]}>
        {data.savedChecks.map((c) => (
          <option key={c.id} value={c.id}>
            {c.name}
          </option>
        ))}
      </SelectField>
      <div className="grid gap-1">
        <label htmlFor={`${id}-file`} className="font-semibold">
          Log file
        </label>
        <input
          id={`${id}-file`}
          type="file"
          accept=".csv,text/csv"
          aria-invalid={fileError ? true : undefined}
          aria-describedby={fileError ? `${id}-file-error` : undefined}
          onChange={(e) => setFile(e.target.files?.[0] ?? null)}
          className="min-h-11 w-full max-w-full rounded-md border border-cast-line bg-white p-2"
        />
        {fileError && (
          <p id={`${id}-file-error`} className="text-sm font-semibold text-oxide">
            {fileError}
          </p>
        )}
      </div>
      <TextField id={`${id}-name`} label="Name" optional hint="e.g. “Track day, hot pulls”; the file's name otherwise." value={name} maxLength={80} onChange={(e) => setName(e.target.value)} />
      <div>
        <Button type="submit" disabled={upload.isPending}>
          <FileUp aria-hidden className="size-4" />
          {upload.isPending ? 'Uploading…' : 'Upload the log'}
        </Button>
      </div>
      <div role="status">{upload.isSuccess && <Notice live="off">Log “{upload.data.name}” uploaded: {upload.data.rowCount.toLocaleString('en-US')} rows. It is in the history below.</Notice>}</div>
      {upload.isError && !fieldErrors.file && <ErrorState title="The log was not uploaded" message={upload.error.message} />}
    </form>
  );
}

function Logs({ data }: { data: UnitHistory }) {
  if (data.logs.length === 0) return null;
  return (
    <section aria-labelledby="unit-logs-h" className="grid gap-2">
      <h2 id="unit-logs-h" className="text-xl font-bold">
        Logs for this unit
      </h2>
      <ul className="grid gap-2">
        {data.logs.map((l) => (
          <li key={l.id} className="flex flex-wrap items-center justify-between gap-2 rounded-md border border-cast-line bg-white p-3">
            <span>
              <span className="font-semibold">{l.name}</span>
              <span className="block text-sm text-cast">
                {formatDateTime(l.createdAt)} · {l.rowCount.toLocaleString('en-US')} rows over {Math.round(l.durationS)} s · frame {l.frameCode}
              </span>
            </span>
            {l.mapLink && (
              <Link to={l.mapLink} className={buttonClass('secondary')}>
                <MapIcon aria-hidden className="size-4" />
                On the map<span className="sr-only">: {l.name}</span>
              </Link>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

function Timeline({ data }: { data: UnitHistory }) {
  return (
    <section aria-labelledby="unit-history-h" className="grid gap-2">
      <h2 id="unit-history-h" className="text-xl font-bold">
        History
      </h2>
      <ol className="grid gap-0 border-l-2 border-cast-line pl-4">
        {data.events.map((e, i) => (
          <li key={i} className="relative pb-4">
            <span aria-hidden className="absolute top-1.5 -left-[1.4rem] size-3 rounded-full border-2 border-temper bg-white" />
            <p className="font-semibold">
              {UNIT_EVENT_LABELS[e.kind]} <span className="tabular font-normal text-cast">· {formatDateTime(e.at)}</span>
            </p>
            <p>{e.summary}</p>
            {e.ref && SHOWN_REFS.test(e.ref) && <p className="part-no text-sm text-cast">{e.ref}</p>}
          </li>
        ))}
      </ol>
    </section>
  );
}

/** One unit's page: what it is, when it is due, its history, and (for its owner) its use and logs. */
export function UnitHistoryPage({ serial }: { serial: string }) {
  const unit = useUnit(serial);
  if (unit.isPending) return <LoadingState label={`Loading unit ${serial}…`} />;
  if (unit.isError) {
    const notFound = unit.error instanceof ApiError && unit.error.isNotFound;
    return <ErrorState title={notFound ? `No unit ${serial} on your account` : 'The unit did not load'} message={notFound ? 'Check the serial on the unit’s label, or sign in with the account that bought it.' : unit.error.message} onRetry={notFound ? undefined : () => void unit.refetch()} />;
  }
  const data = unit.data;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <p className="text-sm font-semibold uppercase tracking-wider text-cast">Unit</p>
          <h1 className="part-no text-3xl font-bold">{data.unit.serial}</h1>
        </div>
        {data.isOwner && (
          <Link to={`/service/new?serial=${encodeURIComponent(data.unit.serial)}`} className={buttonClass('primary')}>
            <Wrench aria-hidden className="size-4" />
            Book a service
          </Link>
        )}
      </div>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]">
        <div className="grid content-start gap-6">
          <Facts data={data} />
          <Timeline data={data} />
          <Logs data={data} />
        </div>
        <div className="grid content-start gap-4">
          {data.isOwner && <UseForm data={data} />}
          {data.isOwner && <LogUpload data={data} />}
          <Caution title="Before you take it off">
            Turbochargers run hot and spin past 100,000 rpm: let the unit cool, and after a rebuild prime the oil supply before the first start. Have service work done by a qualified workshop and follow local rules.
          </Caution>
        </div>
      </div>
    </div>
  );
}
