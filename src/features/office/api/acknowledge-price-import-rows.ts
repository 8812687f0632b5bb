import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PriceImportSchema, type PriceImportAcknowledge } from '../../../../shared/schemas/admin-catalog';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const acknowledgePriceImportRows = (id: number, input: PriceImportAcknowledge) =>
  api(`/admin/price-imports/${id}/acknowledge`, PriceImportSchema, { method: 'POST', body: input });

export function useAcknowledgePriceImportRows(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (input: PriceImportAcknowledge) => acknowledgePriceImportRows(id, input),
    onSuccess: (result) => client.setQueryData(officeKeys.priceImport(id), result),
  });
}
