import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PriceImportSchema } from '../../../../shared/schemas/admin-catalog';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const fixPriceImportRow = (id: number, row: number, input: Record<string, string>) =>
  api(`/admin/price-imports/${id}/rows/${row}`, PriceImportSchema, { method: 'PUT', body: { input } });

export function useFixPriceImportRow(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: ({ row, input }: { row: number; input: Record<string, string> }) => fixPriceImportRow(id, row, input),
    onSuccess: (result) => client.setQueryData(officeKeys.priceImport(id), result),
  });
}
