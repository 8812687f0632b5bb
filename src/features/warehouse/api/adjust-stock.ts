import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import type { AdjustmentSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';
import { AdjustmentReplySchema } from './reply-schemas';

export type Adjustment = z.infer<typeof AdjustmentSchema>;

export const adjustStock = (input: Adjustment) => api('/warehouse/adjustments', AdjustmentReplySchema, { method: 'POST', body: input });

export function useAdjustStock() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: adjustStock,
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: warehouseKeys.stock() }), qc.invalidateQueries({ queryKey: warehouseKeys.lowStock() })]),
  });
}
