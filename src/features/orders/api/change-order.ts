import { useMutation, useQueryClient } from '@tanstack/react-query';
import { OrderChangeResultSchema, type ChangeOrder } from '../../../../shared/schemas/order-changes';
import { api } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';

export const changeOrder = (input: { number: string } & ChangeOrder) =>
  api(`/orders/${encodeURIComponent(input.number)}/changes`, OrderChangeResultSchema, { method: 'POST', body: { lines: input.lines } });
export const cancelOrder = (number: string) => api(`/orders/${encodeURIComponent(number)}/cancel`, OrderChangeResultSchema, { method: 'POST' });

/** Lowering quantities and cancelling; either refreshes the order, its changes and the order list. */
export function useChangeOrder() {
  const qc = useQueryClient();
  const settle = { onSettled: () => qc.invalidateQueries({ queryKey: orderKeys.all }) };
  return { change: useMutation({ mutationFn: changeOrder, ...settle }), cancel: useMutation({ mutationFn: cancelOrder, ...settle }) };
}
