import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ListSummarySchema } from '../../../../shared/schemas/parts-lists';
import { api } from '../../../lib/api-client';
import { listKeys } from './keys';

export const createList = (name: string) => api('/lists', ListSummarySchema, { method: 'POST', body: { name } });

export function useCreateList() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: createList, onSuccess: () => qc.invalidateQueries({ queryKey: listKeys.index() }) });
}
