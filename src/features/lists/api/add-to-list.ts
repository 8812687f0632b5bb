import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AddToListResultSchema, type AddToList } from '../../../../shared/schemas/parts-lists';
import { api } from '../../../lib/api-client';
import { listKeys } from './keys';

export const addToList = (input: AddToList) => api('/lists/add', AddToListResultSchema, { method: 'POST', body: input });

/** Puts a part, the cart or a past order on a list (or on a new one). */
export function useAddToList() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: addToList, onSuccess: () => qc.invalidateQueries({ queryKey: listKeys.all }) });
}
