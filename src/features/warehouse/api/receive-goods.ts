import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { GoodsInSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';
import { GoodsInReplySchema } from './reply-schemas';

export type GoodsIn = z.infer<typeof GoodsInSchema>;

export const receiveGoods = (input: GoodsIn) => api('/warehouse/goods-in', GoodsInReplySchema, { method: 'POST', body: input });

/** Receiving stock may release waiting back-orders, so the queue, stock and low-stock list all move. */
export function useReceiveGoods() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: receiveGoods,
    onSuccess: () =>
      Promise.all([
        qc.invalidateQueries({ queryKey: warehouseKeys.stock() }),
        qc.invalidateQueries({ queryKey: warehouseKeys.lowStock() }),
        qc.invalidateQueries({ queryKey: warehouseKeys.queue() }),
        qc.invalidateQueries({ queryKey: warehouseKeys.pickLists() }),
      ]),
  });
}
