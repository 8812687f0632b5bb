import type { PartSummary } from '../../../../shared/schemas/parts';
import { StatusBadge } from '../../../components/ui/status-badge';

/** Stock with a word and a shape, never colour alone; the count where there is one. */
export function StockBadge({ stock }: { stock: PartSummary['stock'] }) {
  const words = stock.state === 'in-stock' ? `${stock.available} in stock` : stock.state === 'low' ? `Low: ${stock.available} left` : undefined;
  return (
    <StatusBadge kind="stock" status={stock.state} look="plain">
      {words && <span className="tabular">{words}</span>}
    </StatusBadge>
  );
}
