import { ChartLine, Trash2 } from 'lucide-react';
import { useState } from 'react';
import type { ShaftLog } from '../../../../shared/schemas/shaft-logs';
import { BOOST_UNIT_LABELS } from '../../../../shared/shaft-log-csv';
import { formatDate } from '../../../../shared/format';
import { Button } from '../../../components/ui/button';
import { useDeleteShaftLog } from '../api/delete-shaft-log';


function LogRow({ log, selected, onSelect, onDeleted }: { log: ShaftLog; selected: boolean; onSelect: () => void; onDeleted: () => void }) {
  const remove = useDeleteShaftLog();
  const [confirming, setConfirming] = useState(false);
  return (
    <li className={`grid gap-2 p-4 ${selected ? 'bg-temper-tint/60' : ''}`} aria-labelledby={`log-${log.id}`} aria-current={selected ? 'true' : undefined}>
      <div className="min-w-0">
        <h3 id={`log-${log.id}`} className="font-bold break-words">
          {log.name}
        </h3>
        <p className="tabular text-sm text-cast">
          Frame <span className="part-no text-ink">{log.frameCode}</span> · {log.rowCount.toLocaleString('en-US')} rows · {log.durationS.toFixed(1)} s · boost in{' '}
          {BOOST_UNIT_LABELS[log.boostUnit]} · uploaded <time dateTime={log.createdAt}>{formatDate(log.createdAt)}</time>
        </p>
      </div>
      {confirming ? (
        <div role="group" aria-label={`Delete ${log.name}?`} className="flex flex-wrap items-center gap-2">
          <span className="font-semibold">Delete this log?</span>
          <Button
            variant="primary"
            className="bg-oxide hover:bg-oxide/90"
            disabled={remove.isPending}
            onClick={() => remove.mutate({ savedId: log.savedFitmentId, logId: log.id }, { onSuccess: onDeleted })}
          >
            {remove.isPending ? 'Deleting…' : 'Yes, delete'}
          </Button>
          <Button variant="secondary" onClick={() => setConfirming(false)}>
            Keep it
          </Button>
        </div>
      ) : (
        <div className="flex flex-wrap gap-2">
          <Button variant={selected ? 'primary' : 'secondary'} aria-pressed={selected} onClick={onSelect}>
            <ChartLine aria-hidden className="size-4" />
            {selected ? 'On the map' : 'Show on the map'}
            <span className="sr-only"> {log.name}</span>
          </Button>
          <Button variant="quiet" onClick={() => setConfirming(true)}>
            <Trash2 aria-hidden className="size-4" />
            Delete<span className="sr-only"> {log.name}</span>
          </Button>
        </div>
      )}
      {remove.isError && (
        <p role="alert" className="font-semibold text-oxide">
          {remove.error.message}
        </p>
      )}
    </li>
  );
}

export interface ShaftLogListProps {
  logs: readonly ShaftLog[];
  selectedId: number | null;
  onSelect: (logId: number) => void;
  onDeleted: (logId: number) => void;
}

/** A saved check's logs, newest first; one at a time is shown on the map. */
export function ShaftLogList({ logs, selectedId, onSelect, onDeleted }: ShaftLogListProps) {
  return (
    <ul aria-label="Logs on this check" className="divide-y divide-cast-line overflow-hidden rounded-lg bg-white ring-1 ring-cast-line">
      {logs.map((log) => (
        <LogRow key={log.id} log={log} selected={log.id === selectedId} onSelect={() => onSelect(log.id)} onDeleted={() => onDeleted(log.id)} />
      ))}
    </ul>
  );
}
