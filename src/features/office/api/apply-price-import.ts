import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PriceImportSchema } from '../../../../shared/schemas/admin-catalog';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const applyPriceImport = (id: number) => api(`/admin/price-imports/${id}/apply`, PriceImportSchema, { method: 'POST' });

export function useApplyPriceImport(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => applyPriceImport(id),
    onSuccess: async (result) => {
      client.setQueryData(officeKeys.priceImport(id), result);
      // New prices show everywhere: every cached catalogue answer is now stale, whichever feature owns it.
      await client.invalidateQueries({ predicate: (q) => q.queryKey[0] !== 'office' || q.queryKey[1] !== 'price-import' });
    },
  });
}
