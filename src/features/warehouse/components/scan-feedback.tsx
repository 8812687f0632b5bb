import { CircleCheckBig, CircleX } from 'lucide-react';

export type ScanOutcome = { kind: 'ok'; title: string; detail?: string } | { kind: 'refused'; title: string; detail?: string };

/**
 * The answer to the last scan, big enough to read at arm's length. No sound: a shape, a colour and words.
 * Keyed by a counter so a repeat of the same answer still flashes.
 */
export function ScanFeedback({ outcome, stamp, idle, label = 'Last scan' }: { outcome: ScanOutcome | null; stamp: number; idle?: string; label?: string }) {
  return (
    <div role="status" aria-live="assertive" aria-atomic="true" aria-label={label} className="min-h-28">
      {!outcome && idle && <p className="flex min-h-28 items-center rounded-lg border-2 border-dashed border-cast-line px-4 text-lg text-cast">{idle}</p>}
      {outcome && (
        <div
          key={stamp}
          className={`flex items-center gap-4 rounded-lg border-4 p-4 ${
            outcome.kind === 'ok' ? 'border-machined bg-machined-tint text-machined' : 'border-oxide bg-oxide-tint text-oxide'
          }`}
        >
          {outcome.kind === 'ok' ? <CircleCheckBig aria-hidden className="size-14 shrink-0" strokeWidth={2.5} /> : <CircleX aria-hidden className="size-14 shrink-0" strokeWidth={2.5} />}
          <div className="min-w-0">
            <p className="text-2xl font-bold leading-tight">
              <span className="sr-only">{outcome.kind === 'ok' ? 'Confirmed: ' : 'Refused: '}</span>
              {outcome.title}
            </p>
            {outcome.detail && <p className="mt-1 text-lg font-semibold text-ink">{outcome.detail}</p>}
          </div>
        </div>
      )}
    </div>
  );
}
