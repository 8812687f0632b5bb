import { Link } from 'react-router-dom';
import { Map as MapIcon, Wrench } from 'lucide-react';
import { isUsable } from '../../../../shared/fitment/verdict';
import type { FitmentCandidate } from '../../../../shared/schemas/fitment';
import { show } from '../lib/units';
import { VerdictBadge } from './verdict-badge';

export const candidateKey = (c: Pick<FitmentCandidate, 'frameCode' | 'layout'>) => `${c.frameCode}:${c.layout}`;
const sentence = (s: string) => `${s.charAt(0).toUpperCase()}${s.slice(1)}.`;
/** The reasons that decide a verdict come first; the rest wait behind a disclosure to keep the list compact. */
const SHOWN_REASONS = 2;

/** The frames after the build, compact: verdict (shape and word), the figures that decide it and every reason. */
export function CandidateList({ candidates, onMap, cameFrom, onShowOnMap, onBuild, directions = true }: {
  candidates: FitmentCandidate[];
  /** Show "go bigger" / "go smaller" on frames ruled out; off when no frame serves at all. */
  directions?: boolean;
  /** The key of the candidate shown on the map. */
  onMap: string | null;
  /** The frame the buyer came from (a part page), marked in the list. */
  cameFrom: string | null;
  onShowOnMap: (key: string) => void;
  /** Makes a usable frame the build; not offered for frames that do not fit. */
  onBuild: (key: string) => void;
}) {
  return (
    <ol className="divide-y divide-cast-line rounded-lg bg-white ring-1 ring-cast-line" aria-label="Other frames, best fit first">
      {candidates.map((c) => {
        const key = candidateKey(c);
        const shown = key === onMap;
        const id = `candidate-${c.frameCode}-${c.layout}`;
        return (
          <li key={key} className={`grid gap-1 p-3 ${shown ? 'bg-temper-tint/50' : ''}`} aria-labelledby={id} data-frame={c.frameCode} data-layout={c.layout}>
            <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
              <span className="tabular w-6 font-bold text-cast" aria-label={`Rank ${c.rank}`}>
                {c.rank}.
              </span>
              <h4 id={id} className="font-bold">
                <Link to={`/frames/${encodeURIComponent(c.frameCode)}`} className="hover:text-temper hover:underline">
                  <span className="part-no">{c.frameCode}</span> {c.frameName}
                </Link>
                {c.layout === 'twin' && <span className="font-semibold text-cast"> · twin</span>}
              </h4>
              <VerdictBadge verdict={c.verdict} direction={directions} />
              {cameFrom === c.frameCode && <span className="rounded bg-panel px-2 py-0.5 text-sm font-semibold text-cast">the frame you came from</span>}
            </div>
            <p className="tabular text-xs text-cast">
              Shaft {c.shaftRpm !== null ? `${show.shaftRpm(c.shaftRpm)} (${Math.round((100 * c.shaftRpm) / c.maxShaftRpm)} % of limit)` : 'past choke'} · efficiency at peak{' '}
              {c.efficiency !== null ? show.pct(c.efficiency) : 'off the map'}
              {c.turbine?.fullBoostRpm != null ? ` · full boost from ${show.rpm(c.turbine.fullBoostRpm)}` : ''}
            </p>
            <ul className="list-disc space-y-0.5 pl-5 text-xs">
              {c.reasons.slice(0, SHOWN_REASONS).map((r, i) => (
                <li key={i}>{sentence(r)}</li>
              ))}
            </ul>
            {c.reasons.length > SHOWN_REASONS && (
              <details className="text-xs">
                <summary className="cursor-pointer pl-5 font-semibold text-temper">
                  {c.reasons.length - SHOWN_REASONS} more {c.reasons.length - SHOWN_REASONS === 1 ? 'reason' : 'reasons'}
                  <span className="sr-only"> for {c.frameCode}</span>
                </summary>
                <ul className="mt-0.5 list-disc space-y-0.5 pl-5">
                  {c.reasons.slice(SHOWN_REASONS).map((r, i) => (
                    <li key={i}>{sentence(r)}</li>
                  ))}
                </ul>
              </details>
            )}
            <div className="mt-1 flex flex-wrap gap-2">
              {isUsable(c) && (
                <button
                  type="button"
                  onClick={() => onBuild(key)}
                  className="inline-flex min-h-10 items-center gap-1.5 rounded-md px-3 text-sm font-semibold text-temper ring-1 ring-cast-line hover:ring-temper"
                >
                  <Wrench aria-hidden className="size-4" />
                  Build on this frame<span className="sr-only"> {c.frameCode}{c.layout === 'twin' ? ' twin' : ''}</span>
                </button>
              )}
              <button
                type="button"
                onClick={() => onShowOnMap(key)}
                aria-pressed={shown}
                className={`inline-flex min-h-10 items-center gap-1.5 rounded-md px-3 text-sm font-semibold ${
                  shown ? 'bg-temper-tint text-temper-deep' : 'text-temper ring-1 ring-cast-line hover:ring-temper'
                }`}
              >
                <MapIcon aria-hidden className="size-4" />
                {shown ? 'On the map' : 'Show on the map'}
                <span className="sr-only">
                  {' '}
                  for {c.frameCode}
                  {c.layout === 'twin' ? ' twin' : ''}
                </span>
              </button>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
