import { Map as MapIcon } from 'lucide-react';
import type { FitmentCandidate } from '../../../../shared/schemas/fitment';
import { show } from '../lib/units';
import { VerdictBadge } from './verdict-badge';

export function CandidateList({ candidates, selected, cameFrom, onSelect }: {
  candidates: FitmentCandidate[];
  selected: string | null;
  /** The frame the buyer came from (a part page), marked in the list. */
  cameFrom: string | null;
  onSelect: (frameCode: string) => void;
}) {
  return (
    <ol className="grid gap-3" aria-label="Frames, best fit first">
      {candidates.map((c) => {
        const isSelected = c.frameCode === selected;
        return (
          <li
            key={c.frameCode}
            className={`rounded-lg bg-white p-4 ring-1 ${isSelected ? 'ring-2 ring-temper' : 'ring-cast-line'}`}
            aria-labelledby={`candidate-${c.frameCode}`}
          >
            <div className="flex flex-wrap items-center gap-x-3 gap-y-2">
              <span className="tabular w-7 text-lg font-bold text-cast" aria-label={`Rank ${c.rank}`}>
                {c.rank}.
              </span>
              <h3 id={`candidate-${c.frameCode}`} className="text-lg font-bold">
                <span className="part-no">{c.frameCode}</span> {c.frameName}
              </h3>
              <VerdictBadge verdict={c.verdict} />
              {cameFrom === c.frameCode && <span className="rounded bg-panel px-2 py-0.5 text-sm font-semibold text-cast">the frame you came from</span>}
              <button
                type="button"
                onClick={() => onSelect(c.frameCode)}
                aria-pressed={isSelected}
                className={`ml-auto inline-flex min-h-10 items-center gap-1.5 rounded-md px-3 text-sm font-semibold ${
                  isSelected ? 'bg-temper-tint text-temper-deep' : 'text-temper ring-1 ring-cast-line hover:ring-temper'
                }`}
              >
                <MapIcon aria-hidden className="size-4" />
                {isSelected ? 'Shown on the map' : 'Show on the map'}
                <span className="sr-only"> for {c.frameCode}</span>
              </button>
            </div>
            <dl className="tabular mt-2 flex flex-wrap gap-x-5 gap-y-1 text-sm text-cast">
              <div className="flex gap-1">
                <dt>Shaft speed</dt>
                <dd className="font-semibold text-ink">
                  {c.shaftRpm !== null ? `${show.rpm(c.shaftRpm)} (${Math.round((100 * c.shaftRpm) / c.maxShaftRpm)} % of max)` : 'past choke'}
                </dd>
              </div>
              {c.tipSpeedMs !== null && (
                <div className="flex gap-1">
                  <dt>Tip speed</dt>
                  <dd className="font-semibold text-ink">{Math.round(c.tipSpeedMs)} m/s</dd>
                </div>
              )}
              <div className="flex gap-1">
                <dt>Efficiency at peak power</dt>
                <dd className="font-semibold text-ink">{c.efficiency !== null ? show.pct(c.efficiency) : 'off the map'}</dd>
              </div>
            </dl>
            <ul className="mt-2 list-disc space-y-0.5 pl-5">
              {c.reasons.map((r) => (
                <li key={r}>{r.charAt(0).toUpperCase() + r.slice(1)}.</li>
              ))}
            </ul>
          </li>
        );
      })}
    </ol>
  );
}
