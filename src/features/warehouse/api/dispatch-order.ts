import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Dispatch } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';
import { warehouseKeys } from './keys';
import { DispatchReplySchema } from './reply-schemas';

export const dispatchOrder = ({ orderNumber, dispatch }: { orderNumber: string; dispatch: Dispatch }) =>
  api(`/warehouse/orders/${encodeURIComponent(orderNumber)}/dispatch`, DispatchReplySchema, { method: 'POST', body: dispatch });

/** Stock leaves on hand and the customer is mailed the tracking number; a second dispatch is refused with 409. */
export function useDispatchOrder() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: dispatchOrder,
    onSettled: (_d, _e, { orderNumber }) =>
      Promise.all([qc.invalidateQueries({ queryKey: warehouseKeys.queue() }), qc.invalidateQueries({ queryKey: orderKeys.detail(orderNumber) })]),
  });
}
