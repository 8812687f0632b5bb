import type { PartSummary } from '../../../../shared/schemas/parts';
import { stockLook, TONE_TEXT } from '../../../components/ui/stock-looks';

/**
 * Stock with a word and a shape, never colour alone; the count where there is one. Drawn as StatusBadge's plain look,
 * from the stock looks alone, so the catalogue does not bring every other status's icon.
 */
export function StockBadge({ stock }: { stock: PartSummary['stock'] }) {
  const words = stock.state === 'in-stock' ? `${stock.available} in stock` : stock.state === 'low' ? `Low: ${stock.available} left` : undefined;
  const { label, Icon, tone } = stockLook(stock.state);
  return (
    <span className={`inline-flex items-center gap-1 font-semibold ${TONE_TEXT[tone]} `}>
      <Icon aria-hidden className="size-4 shrink-0" />
      {words ? <span className="tabular">{words}</span> : label}
    </span>
  );
}
