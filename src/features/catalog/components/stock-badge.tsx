import { Ban, CircleCheck, Clock, TriangleAlert } from 'lucide-react';
import type { PartSummary } from '../../../../shared/schemas/parts';

/** Stock with a word and a shape, never colour alone. */
export function StockBadge({ stock }: { stock: PartSummary['stock'] }) {
  switch (stock.state) {
    case 'in-stock':
      return (
        <span className="inline-flex items-center gap-1 text-machined">
          <CircleCheck aria-hidden className="size-4" />
          <span className="tabular">{stock.available} in stock</span>
        </span>
      );
    case 'low':
      return (
        <span className="inline-flex items-center gap-1 font-semibold text-amber">
          <TriangleAlert aria-hidden className="size-4" />
          <span className="tabular">Low: {stock.available} left</span>
        </span>
      );
    case 'out-of-stock':
      return (
        <span className="inline-flex items-center gap-1 text-cast">
          <Clock aria-hidden className="size-4" />
          <span>Awaiting stock</span>
        </span>
      );
    default:
      return (
        <span className="inline-flex items-center gap-1 text-oxide">
          <Ban aria-hidden className="size-4" />
          <span>Discontinued</span>
        </span>
      );
  }
}
