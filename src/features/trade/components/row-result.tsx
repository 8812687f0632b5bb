import { ArrowRightLeft, CircleCheck, OctagonAlert } from 'lucide-react';
import type { OrderRowResult } from '../../../../shared/schemas/orders';

/** A validated row: a word and a shape for its state, the matched part, and clickable "did you mean" numbers. */
export function RowResult({ result, onPick }: { result: OrderRowResult; onPick?: (partNumber: string) => void }) {
  return (
    <div className="grid gap-1 text-sm">
      {result.status === 'ok' && (
        <p className="inline-flex items-start gap-1 text-machined">
          <CircleCheck aria-hidden className="mt-0.5 size-4 shrink-0" />
          <span>
            <span className="font-semibold">Ready</span>
            {result.title && <span className="text-ink"> · {result.title}</span>}
          </span>
        </p>
      )}
      {result.status === 'replaced' && (
        <p className="inline-flex items-start gap-1 text-temper-deep">
          <ArrowRightLeft aria-hidden className="mt-0.5 size-4 shrink-0" />
          <span>
            <span className="font-semibold">Replaced</span> by <span className="part-no">{result.partNumber}</span>
            {result.title && <span className="text-ink"> · {result.title}</span>}
          </span>
        </p>
      )}
      {result.status === 'error' && (
        <p className="inline-flex items-start gap-1 font-semibold text-oxide">
          <OctagonAlert aria-hidden className="mt-0.5 size-4 shrink-0" />
          <span>{result.message}</span>
        </p>
      )}
      {result.status !== 'error' && result.message && <p className="text-cast">{result.message}</p>}
      {result.available !== null && result.status !== 'error' && (
        <p className="tabular text-cast">{result.available} available</p>
      )}
      {result.suggestions.length > 0 && onPick && (
        <div className="flex flex-wrap items-center gap-2">
          <span className="text-cast">Did you mean</span>
          {result.suggestions.map((s) => (
            <button
              key={s.partNumber}
              type="button"
              onClick={() => onPick(s.partNumber)}
              title={s.title}
              className="part-no rounded border border-temper/50 bg-temper-tint px-2 py-1 text-temper-deep hover:border-temper"
              aria-label={`Use ${s.partNumber}: ${s.title}`}
            >
              {s.partNumber}
            </button>
          ))}
        </div>
      )}
    </div>
  );
}
