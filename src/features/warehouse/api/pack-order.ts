import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { PackSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';
import { warehouseKeys } from './keys';
import { PackReplySchema } from './reply-schemas';

export const packOrder = ({ orderNumber, pack }: { orderNumber: string; pack: z.infer<typeof PackSchema> }) =>
  api(`/warehouse/orders/${encodeURIComponent(orderNumber)}/pack`, PackReplySchema, { method: 'POST', body: pack });

export function usePackOrder() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: packOrder,
    onSuccess: (_d, { orderNumber }) =>
      Promise.all([qc.invalidateQueries({ queryKey: warehouseKeys.queue() }), qc.invalidateQueries({ queryKey: orderKeys.detail(orderNumber) })]),
  });
}
