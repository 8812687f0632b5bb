import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ReturnViewSchema, type ReturnDecision } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';
import { warehouseKeys } from './keys';

export const decideReturn = ({ id, decision }: { id: number; decision: ReturnDecision }) =>
  api(`/warehouse/returns/${id}/receive`, ReturnViewSchema, { method: 'POST', body: decision });

/** Grade and decide in one step; a card order is refunded through the payment service, an on-account one gets a credit note. */
export function useDecideReturn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: decideReturn,
    onSettled: (view) =>
      Promise.all([
        qc.invalidateQueries({ queryKey: warehouseKeys.returns() }),
        qc.invalidateQueries({ queryKey: warehouseKeys.stock() }),
        // A refund or credit note shows on the order.
        view ? qc.invalidateQueries({ queryKey: orderKeys.detail(view.orderNumber) }) : undefined,
      ]),
  });
}
