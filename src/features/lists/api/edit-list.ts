import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ListDetailSchema, ListSummarySchema } from '../../../../shared/schemas/parts-lists';
import { api } from '../../../lib/api-client';
import { listKeys } from './keys';

export const setListLineQuantity = (input: { listId: number; lineId: number; quantity: number }) =>
  api(`/lists/${input.listId}/lines/${input.lineId}`, ListDetailSchema, { method: 'PATCH', body: { quantity: input.quantity } });
export const removeListLine = (input: { listId: number; lineId: number }) => api(`/lists/${input.listId}/lines/${input.lineId}`, ListDetailSchema, { method: 'DELETE' });
export const renameList = (input: { listId: number; name: string }) => api(`/lists/${input.listId}`, ListSummarySchema, { method: 'PATCH', body: { name: input.name } });
export const deleteList = (listId: number) => api(`/lists/${listId}`, z.null(), { method: 'DELETE' });

/** Quantity, line and name edits; each answers with the list as it now stands, which goes straight into the cache. */
export function useEditList(listId: number) {
  const qc = useQueryClient();
  const settle = {
    onSuccess: (list: z.infer<typeof ListDetailSchema>) => {
      qc.setQueryData(listKeys.detail(listId), list);
      void qc.invalidateQueries({ queryKey: listKeys.index() });
    },
  };
  return {
    setQuantity: useMutation({ mutationFn: (v: { lineId: number; quantity: number }) => setListLineQuantity({ listId, ...v }), ...settle }),
    removeLine: useMutation({ mutationFn: (lineId: number) => removeListLine({ listId, lineId }), ...settle }),
    rename: useMutation({ mutationFn: (name: string) => renameList({ listId, name }), onSuccess: () => qc.invalidateQueries({ queryKey: listKeys.all }) }),
    remove: useMutation({ mutationFn: () => deleteList(listId), onSuccess: () => qc.invalidateQueries({ queryKey: listKeys.index() }) }),
  };
}
