import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddToList } from '../../../../shared/schemas/parts-lists';
import { api } from '../../../lib/api-client';
import { listKeys } from './keys';

// The answer's schema (and the validation library) loads with the request: the part page offers this.
const schema = () => import('../../../lib/action-schemas').then((m) => m.AddToListResultSchema);

export const addToList = (input: AddToList) => api('/lists/add', schema, { method: 'POST', body: input });

/** Puts a part, the cart or a past order on a list (or on a new one). */
export function useAddToList() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: addToList, onSuccess: () => qc.invalidateQueries({ queryKey: listKeys.all }) });
}
