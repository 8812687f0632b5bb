import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PriceImportSchema } from '../../../../shared/schemas/admin-catalog';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const setPriceImportThreshold = (id: number, maxChangePct: number) =>
  api(`/admin/price-imports/${id}/settings`, PriceImportSchema, { method: 'PUT', body: { maxChangePct } });

export function useSetPriceImportThreshold(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (maxChangePct: number) => setPriceImportThreshold(id, maxChangePct),
    onSuccess: (result) => client.setQueryData(officeKeys.priceImport(id), result),
  });
}
