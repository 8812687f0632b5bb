import { useEffect, useRef, type ReactNode } from 'react';
import type { BoostUnit, ExcursionKind, ShaftLogDetail as Detail, ShaftLogExcursion, ShaftLogSummary } from '../../../../shared/schemas/shaft-logs';
import { BOOST_UNIT_LABELS } from '../../../../shared/shaft-log-csv';
import { kpaToBar, kpaToPsi } from '../../../../shared/units';
import { Caution } from '../../../components/ui/caution';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { ApiError } from '../../../lib/api-client';
import { useShaftLog } from '../api/get-shaft-log';
import { show, type UnitSystem } from '../lib/units';
import { CompressorMapChart } from './compressor-map-chart';
import { flagWords, markerOf, MarkerIcon, measuredLayer, MeasuredKey, type MarkerKind } from './shaft-log-layer';
import { UnitSwitch } from './unit-switch';

const seconds = (s: number) => `${s === 0 ? '0' : s < 10 ? s.toFixed(1) : Math.round(s).toString()} s`;
const pct = (v: number) => `${v.toFixed(Math.abs(v) < 10 ? 1 : 0)} %`;

function boostText(kpa: number, unit: BoostUnit): string {
  if (unit === 'psi') return `${kpaToPsi(kpa).toFixed(1)} psi`;
  if (unit === 'bar') return `${kpaToBar(kpa).toFixed(2)} bar`;
  return `${kpa.toFixed(0)} ${BOOST_UNIT_LABELS.kpa}`;
}

/** A figure with its state said in a word and a shape beside it. */
function Stat({ label, value, detail, state }: { label: string; value: string; detail?: ReactNode; state?: { kind: MarkerKind; word: string } }) {
  const [number, ...unit] = value.split(' ');
  return (
    <div className="min-w-0 rounded-lg bg-white p-4 ring-1 ring-cast-line">
      <dt className="text-sm font-semibold text-cast">{label}</dt>
      <dd className="tabular text-2xl font-bold whitespace-nowrap">
        {number}
        {unit.length > 0 && <span className="ml-1 text-base font-semibold">{unit.join(' ')}</span>}
      </dd>
      {state && (
        <dd className={`flex items-center gap-1.5 text-sm font-semibold ${state.kind === 'ok' ? 'text-machined' : state.kind === 'overspeed' || state.kind === 'surge' ? 'text-oxide' : 'text-amber'}`}>
          {state.kind === 'ok' ? (
            <svg aria-hidden width="16" height="16" viewBox="0 0 16 16">
              <circle cx="8" cy="8" r="6" fill="currentColor" />
            </svg>
          ) : (
            <MarkerIcon kind={state.kind} />
          )}
          {state.word}
        </dd>
      )}
      {detail && <dd className="tabular text-sm text-cast">{detail}</dd>}
    </div>
  );
}

function SummaryFigures({ summary }: { summary: ShaftLogSummary }) {
  const speedState =
    summary.timeOverSpeedS > 0
      ? { kind: 'overspeed' as const, word: 'over the limit' }
      : summary.timeNearLimitS > 0
        ? { kind: 'near-limit' as const, word: `near the limit (above ${summary.nearLimitPct} %)` }
        : { kind: 'ok' as const, word: 'within the limit' };
  const surgeState =
    summary.timeInSurgeS > 0
      ? { kind: 'surge' as const, word: 'went into surge' }
      : summary.timeNearOrInSurgeS > 0
        ? { kind: 'near-surge' as const, word: `came within ${summary.nearSurgeMarginPct} % of surge` }
        : { kind: 'ok' as const, word: 'clear of surge' };
  return (
    <dl className="grid grid-cols-1 gap-3 min-[30rem]:grid-cols-2 xl:grid-cols-4">
      <Stat
        label="Peak shaft speed"
        value={show.rpm(summary.peakShaftRpm)}
        state={speedState}
        detail={`${pct(summary.peakShaftSpeedPct)} of the ${show.rpm(summary.maxShaftRpm)} limit, at ${seconds(summary.peakAtS)}`}
      />
      <Stat
        label="Time over speed"
        value={seconds(summary.timeOverSpeedS)}
        detail={summary.timeNearLimitS > 0 ? `and ${seconds(summary.timeNearLimitS)} near the limit` : 'none near the limit'}
      />
      <Stat
        label="Time near or in surge"
        value={seconds(summary.timeNearOrInSurgeS)}
        state={surgeState}
        detail={`in surge ${seconds(summary.timeInSurgeS)}${summary.leastSurgeMarginPct !== null ? `; least margin ${pct(summary.leastSurgeMarginPct)}` : ''}`}
      />
      <Stat
        label="Points"
        value={summary.points.toLocaleString('en-US')}
        detail={`${seconds(summary.durationS)} logged${summary.pointsBelowMap > 0 ? `; ${summary.pointsBelowMap.toLocaleString('en-US')} off boost, below the map` : ''}`}
      />
    </dl>
  );
}

const EXCURSION_WORDS: Record<ExcursionKind, string> = {
  overspeed: 'Over the shaft-speed limit',
  'near-limit': 'Near the shaft-speed limit',
  surge: 'In surge',
  'near-surge': 'Near surge',
  'above-map': 'Above the map’s top pressure ratio',
};

function worstText(e: ShaftLogExcursion): string {
  if (e.kind === 'overspeed' || e.kind === 'near-limit') return `${pct(e.shaftSpeedPct)} of the limit`;
  if (e.kind === 'above-map') return 'no surge line to compare with';
  return e.surgeMarginPct === null ? 'no flow at all' : e.surgeMarginPct < 0 ? `${pct(-e.surgeMarginPct)} left of the surge line` : `margin ${pct(e.surgeMarginPct)}`;
}

const span = (e: ShaftLogExcursion) => (e.fromS === e.toS ? `at ${e.fromS.toFixed(1)} s` : `${e.fromS.toFixed(1)}–${e.toS.toFixed(1)} s`);

/** A list rather than a table, so each excursion reads whole on a phone. */
function Excursions({ summary }: { summary: ShaftLogSummary }) {
  if (summary.excursions.length === 0) {
    return <p className="text-cast">No excursions: the whole log stays clear of surge and below {summary.nearLimitPct} % of the shaft-speed limit.</p>;
  }
  return (
    <div className="grid gap-2">
      <ol aria-label="Excursions, in time order" className="divide-y divide-cast-line overflow-hidden rounded-md bg-white ring-1 ring-cast-line">
        {summary.excursions.map((e) => (
          <li key={`${e.kind}-${e.fromS}`} data-kind={e.kind} className="grid gap-x-4 gap-y-0.5 px-4 py-2.5 sm:grid-cols-[minmax(0,16rem)_minmax(0,1fr)]">
            <span className="inline-flex items-center gap-2 font-semibold">
              <MarkerIcon kind={e.kind} />
              {EXCURSION_WORDS[e.kind]}
            </span>
            <span className="tabular text-sm sm:text-base">
              {span(e)}, {seconds(e.durationS)} in all; at its worst {worstText(e)} ({e.worstAtS.toFixed(1)} s)
            </span>
          </li>
        ))}
      </ol>
      {summary.moreExcursions > 0 && <p className="text-sm text-cast">and {summary.moreExcursions} more, shorter ones further on.</p>}
    </div>
  );
}

const FLAGGED_ROWS_SHOWN = 200;

function FlaggedRows({ detail, system }: { detail: Detail; system: UnitSystem }) {
  const flagged = detail.points.filter((p) => markerOf(p) !== 'ok');
  if (flagged.length === 0) return null;
  return (
    <details className="rounded-md border border-cast-line bg-white">
      <summary className="min-h-11 cursor-pointer px-4 py-2 font-semibold text-temper">
        The {flagged.length.toLocaleString('en-US')} flagged {flagged.length === 1 ? 'row' : 'rows'} as a table
      </summary>
      <div className="overflow-x-auto border-t border-cast-line">
        <table className="w-full min-w-[44rem] border-collapse text-left text-sm">
          <caption className="sr-only">Logged rows near or past a limit</caption>
          <thead>
            <tr className="border-b border-cast-line">
              {['Time', 'Engine', 'Boost', 'Shaft', 'Pressure ratio', 'Corrected flow'].map((h) => (
                <th key={h} scope="col" className="px-3 py-1.5 text-right font-semibold">
                  {h}
                </th>
              ))}
              <th scope="col" className="px-3 py-1.5 font-semibold">
                Flags
              </th>
            </tr>
          </thead>
          <tbody className="tabular">
            {flagged.slice(0, FLAGGED_ROWS_SHOWN).map((p) => (
              <tr key={p.t} className="border-b border-cast-line/60">
                <th scope="row" className="px-3 py-1 text-right font-semibold">
                  {p.t.toFixed(2)} s
                </th>
                <td className="px-3 py-1 text-right">{show.rpm(p.engineRpm)}</td>
                <td className="px-3 py-1 text-right">{boostText(p.boostKpa, detail.log.boostUnit)}</td>
                <td className="px-3 py-1 text-right">
                  {show.rpm(p.shaftRpm)} ({pct(p.shaftSpeedPct)})
                </td>
                <td className="px-3 py-1 text-right">{p.pressureRatio.toFixed(2)}</td>
                <td className="px-3 py-1 text-right">{show.flow(p.correctedFlowLbMin, system)}</td>
                <td className="px-3 py-1">
                  <span className="inline-flex items-center gap-1.5">
                    <MarkerIcon kind={markerOf(p)} />
                    {flagWords(p)}
                  </span>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        {flagged.length > FLAGGED_ROWS_SHOWN && <p className="px-3 py-2 text-sm text-cast">The first {FLAGGED_ROWS_SHOWN} are shown.</p>}
      </div>
    </details>
  );
}

export interface ShaftLogDetailProps {
  savedId: number;
  logId: number;
  system: UnitSystem;
  onSystemChange: (system: UnitSystem) => void;
  /** Move focus to the log's heading once it has loaded, scrolling it into view. */
  bringIntoView?: boolean;
}

/** One log: the summary, the measured points on the frame's map beside the check's predicted line, the excursions. */
export function ShaftLogDetail({ savedId, logId, system, onSystemChange, bringIntoView = false }: ShaftLogDetailProps) {
  const query = useShaftLog(savedId, logId);
  const headingRef = useRef<HTMLHeadingElement>(null);
  const loaded = query.isSuccess;
  useEffect(() => {
    if (loaded && bringIntoView) headingRef.current?.focus();
  }, [loaded, bringIntoView]);
  if (query.isPending) return <LoadingState label="Laying the log on the compressor map…" />;
  if (query.isError) {
    const gone = query.error instanceof ApiError && query.error.isNotFound;
    return (
      <ErrorState
        title={gone ? 'That log is no longer here' : 'The log did not load'}
        message={gone ? 'It may have been deleted. Pick another from the list.' : query.error.message}
        onRetry={gone ? undefined : () => void query.refetch()}
      />
    );
  }
  const detail = query.data;
  const { summary, frame, log } = detail;
  const pastLimit = summary.timeOverSpeedS > 0 || summary.timeInSurgeS > 0;
  return (
    <section aria-labelledby="log-detail-heading" className="grid min-w-0 gap-5">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div className="min-w-0">
          <h2 id="log-detail-heading" ref={headingRef} tabIndex={-1} className="scroll-mt-4 text-2xl font-bold break-words outline-none">
            {log.name}
          </h2>
          <p className="text-cast">
            On frame <span className="part-no text-ink">{frame.code}</span> {frame.name}, shaft-speed limit {show.rpm(frame.maxShaftRpm)}.
          </p>
        </div>
        <UnitSwitch value={system} onChange={onSystemChange} />
      </div>

      <SummaryFigures summary={summary} />

      {pastLimit && (
        <Caution title="This log went past a limit">
          {summary.timeOverSpeedS > 0 && 'Past its shaft-speed limit a compressor wheel can burst. '}
          {summary.timeInSurgeS > 0 && 'In surge the airflow reverses in pulses that hammer the thrust bearing. '}
          Lower the boost or have the installation checked by a qualified person before the next run.
        </Caution>
      )}

      <div className="grid min-w-0 gap-2">
        <CompressorMapChart frame={frame} line={detail.operatingLine} candidate={detail.candidate ?? undefined} system={system} layer={measuredLayer(detail.points)} />
        <div className="grid gap-1">
          <p className="text-sm text-cast">
            Logged points, worked out from each row’s engine rpm, boost and charge-air temperature with this check’s engine, beside the check’s predicted
            operating line.
          </p>
          <MeasuredKey points={detail.points} />
        </div>
      </div>

      <section aria-labelledby="log-excursions-heading" className="grid gap-2">
        <h3 id="log-excursions-heading" className="text-xl font-bold">
          Excursions
        </h3>
        <Excursions summary={summary} />
      </section>

      <FlaggedRows detail={detail} system={system} />
    </section>
  );
}
