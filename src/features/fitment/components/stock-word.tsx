import type { PartSummary } from '../../../../shared/schemas/parts';
import { StatusBadge } from '../../../components/ui/status-badge';

/** Stock in a word and a shape; `wanted` says when fewer are on hand than the build needs. */
export function StockWord({ stock, wanted = 1 }: { stock: PartSummary['stock']; wanted?: number }) {
  const { state, available } = stock;
  if ((state === 'in-stock' || state === 'low') && available < wanted)
    return (
      <StatusBadge kind="stock" status="low" look="plain">
        Only {available} in stock
      </StatusBadge>
    );
  if (state === 'in-stock' || state === 'low')
    return (
      <StatusBadge kind="stock" status={state} look="plain">
        {state === 'in-stock' ? 'In stock' : 'Low stock'} ({available})
      </StatusBadge>
    );
  return <StatusBadge kind="stock" status={state} look="plain" />;
}
