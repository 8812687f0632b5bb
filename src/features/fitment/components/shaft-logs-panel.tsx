import { useState } from 'react';
import type { SavedFitment } from '../../../../shared/schemas/saved-fitments';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { useFrameMaps } from '../api/get-frame-maps';
import { useShaftLogs } from '../api/get-shaft-logs';
import { useUnitSystem } from '../lib/use-unit-system';
import { ShaftLogDetail } from './shaft-log-detail';
import { ShaftLogList } from './shaft-log-list';
import { ShaftLogUpload } from './shaft-log-upload';

export interface ShaftLogsPanelProps {
  saved: SavedFitment;
  /** The log shown on the map, from the address; null shows the newest. */
  selectedId: number | null;
  onSelect: (logId: number | null) => void;
}

/** A saved check's shaft-speed logs: upload one, pick one, see it on its frame's compressor map. */
export function ShaftLogsPanel({ saved, selectedId, onSelect }: ShaftLogsPanelProps) {
  const logs = useShaftLogs(saved.id);
  const maps = useFrameMaps();
  const [system, setSystem] = useUnitSystem();
  // A log picked or uploaded by hand is brought into view (on a phone it sits below the form and the list).
  const [picked, setPicked] = useState<number | null>(null);
  const pick = (logId: number) => {
    setPicked(logId);
    onSelect(logId);
  };
  const items = logs.data?.items ?? [];
  const shown = items.find((l) => l.id === selectedId)?.id ?? items[0]?.id ?? null;

  const listBody = () => {
    if (logs.isPending) return <LoadingState label="Loading the logs on this check…" />;
    if (logs.isError) return <ErrorState title="The logs did not load" message={logs.error.message} onRetry={() => void logs.refetch()} />;
    if (items.length === 0) {
      return (
        <EmptyState title="No logs on this check yet">
          Upload a file from the shaft-speed logger, or download a sample log to see what one looks like on the map.
        </EmptyState>
      );
    }
    return <ShaftLogList logs={items} selectedId={shown} onSelect={pick} onDeleted={(id) => id === shown && onSelect(null)} />;
  };

  return (
    <div className="grid min-w-0 gap-8">
      <div className="grid min-w-0 items-start gap-6 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
        {maps.isPending ? (
          <LoadingState label="Loading the frames…" />
        ) : maps.isError ? (
          <ErrorState title="The frames did not load" message={maps.error.message} onRetry={() => void maps.refetch()} />
        ) : (
          <ShaftLogUpload savedId={saved.id} frames={maps.data.items} defaultFrameCode={saved.bestFrameCode} onUploaded={(log) => pick(log.id)} />
        )}
        <section aria-labelledby="logs-heading" className="grid min-w-0 gap-3">
          <h2 id="logs-heading" className="text-xl font-bold">
            Logs on this check{items.length > 0 ? <span className="tabular font-normal text-cast"> ({items.length})</span> : null}
          </h2>
          {listBody()}
        </section>
      </div>
      {shown !== null && <ShaftLogDetail key={shown} savedId={saved.id} logId={shown} system={system} onSystemChange={setSystem} bringIntoView={picked === shown} />}
    </div>
  );
}
