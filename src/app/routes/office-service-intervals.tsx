import { useState, type FormEvent } from 'react';
import { BEARINGS } from '../../../shared/catalog';
import { APPLICATIONS } from '../../../shared/schemas/fitment';
import { formatDateTime } from '../../../shared/format';
import { APPLICATION_LABELS, SERVICE_INTERVAL_MONTHS, type ServiceInterval } from '../../../shared/schemas/units';
import { Button } from '../../components/ui/button';
import { controlClass } from '../../components/ui/form';
import { Notice } from '../../components/ui/notice';
import { TableFrame, Td, Th } from '../../components/ui/table-frame';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { ApiError } from '../../lib/api-client';
import { useMe } from '../../features/auth/api/get-me';
import { useServiceIntervals, useSetServiceInterval } from '../../features/office/api/service-intervals';
import { OfficeGate, OfficeNav, OfficePageHeader } from '../../features/office/components/office-shell';
import { officeAccess } from '../../features/office/lib/office-access';

const bearingWord = (b: string) => (b === 'ball' ? 'Ball bearing' : 'Journal bearing');

function IntervalRow({ row, onSaved }: { row: ServiceInterval; onSaved: (text: string) => void }) {
  const [months, setMonths] = useState(String(row.months));
  const save = useSetServiceInterval();
  const id = `interval-${row.bearing}-${row.application}`;
  const label = `${bearingWord(row.bearing)}, ${APPLICATION_LABELS[row.application].toLowerCase()}`;
  const error = save.error instanceof ApiError ? (save.error.fieldErrors.months?.[0] ?? save.error.message) : save.error?.message;
  const onSubmit = (e: FormEvent) => {
    e.preventDefault();
    save.mutate({ bearing: row.bearing, application: row.application, months: Number(months) }, { onSuccess: (r) => onSaved(`${label}: every ${r.months} months from now on.`) });
  };
  return (
    <tr className="border-b border-cast-line align-top last:border-b-0">
      <Td>{APPLICATION_LABELS[row.application]}</Td>
      <Td>
        <form onSubmit={onSubmit} className="flex flex-wrap items-center gap-2 sm:flex-nowrap" noValidate>
          <label htmlFor={id} className="sr-only">
            Months between services, {label}
          </label>
          <span className="w-20 shrink-0">
          <input
            id={id}
            type="number"
            inputMode="numeric"
            min={SERVICE_INTERVAL_MONTHS.min}
            max={SERVICE_INTERVAL_MONTHS.max}
            value={months}
            onChange={(e) => setMonths(e.target.value)}
            aria-invalid={error ? true : undefined}
            aria-describedby={error ? `${id}-error` : undefined}
            className={`${controlClass(Boolean(error))} tabular text-right`}
          />
          </span>
          <span className="text-cast">months</span>
          <Button type="submit" variant="secondary" disabled={save.isPending || months === String(row.months)}>
            {save.isPending ? 'Saving…' : 'Save'}
            <span className="sr-only"> {label}</span>
          </Button>
          {error && (
            <p id={`${id}-error`} className="basis-full text-sm font-semibold text-oxide">
              {error}
            </p>
          )}
        </form>
      </Td>
      <Td className="min-w-64 text-sm">{row.note}</Td>
      <Td className="whitespace-nowrap text-sm text-cast">{row.updatedBy ? `${row.updatedBy}, ${formatDateTime(row.updatedAt)}` : 'As first set'}</Td>
    </tr>
  );
}

function Intervals() {
  const list = useServiceIntervals();
  const [done, setDone] = useState<string | null>(null);
  if (list.isPending) return <LoadingState label="Loading the intervals…" />;
  if (list.isError) return <ErrorState title="The intervals did not load" message={list.error.message} onRetry={() => void list.refetch()} />;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
      <div role="status">{done && <Notice live="off">Saved. {done}</Notice>}</div>
      {BEARINGS.map((b) => (
        <section key={b} aria-labelledby={`intervals-${b}`} className="grid gap-2">
          <h2 id={`intervals-${b}`} className="text-xl font-bold">
            {bearingWord(b)} units
          </h2>
          <TableFrame>
            <table className="w-full border-collapse text-left">
              <caption className="sr-only">Service intervals for {bearingWord(b).toLowerCase()} units, by use</caption>
              <thead className="bg-panel">
                <tr>
                  <Th>Use</Th>
                  <Th>Every</Th>
                  <Th>Why</Th>
                  <Th>Last changed</Th>
                </tr>
              </thead>
              <tbody>
                {list.data.items
                  .filter((i) => i.bearing === b)
                  .sort((x, y) => APPLICATIONS.indexOf(x.application) - APPLICATIONS.indexOf(y.application))
                  .map((row) => (
                    <IntervalRow key={`${row.bearing}-${row.application}-${row.months}`} row={row} onSaved={setDone} />
                  ))}
              </tbody>
            </table>
          </TableFrame>
        </section>
      ))}
    </div>
  );
}

export function OfficeServiceIntervalsRoute() {
  const me = useMe();
  return (
    <OfficeGate access={officeAccess(me)}>
      <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
        <OfficeNav />
        <OfficePageHeader title="Service intervals">
          How often each unit should come in, by its bearing and how it is used. A unit is due this long after its last service
          (or its sale); the owner gets one reminder by e-mail and on the site for each due date. The values first set follow
          common practice as we read it: journal bearings in hard use a few times a season, ball bearings checked at each season’s end.
        </OfficePageHeader>
        <Intervals />
      </div>
    </OfficeGate>
  );
}
