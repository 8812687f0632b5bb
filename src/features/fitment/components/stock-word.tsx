import { Ban, CircleCheck, Clock, TriangleAlert } from 'lucide-react';
import type { PartSummary } from '../../../../shared/schemas/parts';

/** Stock in a word and a shape; `wanted` says when fewer are on hand than the build needs. */
export function StockWord({ stock, wanted = 1 }: { stock: PartSummary['stock']; wanted?: number }) {
  const { state, available } = stock;
  if ((state === 'in-stock' || state === 'low') && available < wanted)
    return (
      <span className="inline-flex items-center gap-1 text-amber">
        <TriangleAlert aria-hidden className="size-4 shrink-0" />
        Only {available} in stock
      </span>
    );
  if (state === 'in-stock')
    return (
      <span className="inline-flex items-center gap-1 text-machined">
        <CircleCheck aria-hidden className="size-4 shrink-0" />
        In stock ({available})
      </span>
    );
  if (state === 'low')
    return (
      <span className="inline-flex items-center gap-1 text-amber">
        <TriangleAlert aria-hidden className="size-4 shrink-0" />
        Low stock ({available})
      </span>
    );
  if (state === 'out-of-stock')
    return (
      <span className="inline-flex items-center gap-1 text-cast">
        <Clock aria-hidden className="size-4 shrink-0" />
        Awaiting stock
      </span>
    );
  return (
    <span className="inline-flex items-center gap-1 text-cast">
      <Ban aria-hidden className="size-4 shrink-0" />
      Discontinued
    </span>
  );
}
