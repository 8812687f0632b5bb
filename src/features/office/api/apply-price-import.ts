import { useMutation, useQueryClient } from '@tanstack/react-query';
import { PriceImportSchema } from '../../../../shared/schemas/admin-catalog';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

/** `expectChanges` is the count the person confirmed; the server applies nothing if the list now says otherwise. */
export const applyPriceImport = (id: number, expectChanges: number) => api(`/admin/price-imports/${id}/apply`, PriceImportSchema, { method: 'POST', body: { expectChanges } });

export function useApplyPriceImport(id: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (expectChanges: number) => applyPriceImport(id, expectChanges),
    onSuccess: async (result) => {
      client.setQueryData(officeKeys.priceImport(id), result);
      // New prices show everywhere: every cached catalogue answer is now stale, whichever feature owns it.
      await client.invalidateQueries({ predicate: (q) => q.queryKey[0] !== 'office' || q.queryKey[1] !== 'price-import' });
    },
    // A refusal (a flag or error found at apply time) rewrote the rows: show them as they are now.
    onError: () => client.invalidateQueries({ queryKey: officeKeys.priceImport(id) }),
  });
}
