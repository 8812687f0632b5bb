import type { OrderDetail } from '../../../../shared/schemas/orders';
import type { ReturnView } from '../../../../shared/schemas/warehouse';

type Line = OrderDetail['lines'][number];

/** Orders with something in the customer's hands. */
export const hasLeftTheBuilding = (status: string) => status === 'dispatched' || status === 'returned';

/**
 * How many of a line can still come back: what was dispatched less what is already asked for or settled.
 * Returns do not name their line, so they are matched by order and part number; the server has the final word.
 */
export function returnableQuantity(order: Pick<OrderDetail, 'number' | 'status'>, line: Line, returns: readonly ReturnView[]): number {
  if (!hasLeftTheBuilding(order.status)) return 0;
  const claimed = returns
    .filter((r) => r.orderNumber === order.number && r.partNumber === line.partNumber && r.status !== 'rejected')
    .reduce((sum, r) => sum + r.quantity, 0);
  return Math.max(0, line.quantityPicked - claimed);
}
