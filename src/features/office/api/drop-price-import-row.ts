import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PriceImportSchema } from '../../../../shared/schemas/admin-catalog';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const dropPriceImportRow = (id: number, row: number) => api(`/admin/price-imports/${id}/rows/${row}`, PriceImportSchema, { method: 'DELETE' });

export function useDropPriceImportRow(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (row: number) => dropPriceImportRow(id, row),
    onSuccess: (result) => client.setQueryData(officeKeys.priceImport(id), result),
  });
}
