import { useMutation } from '@tanstack/react-query';
import { OrderFromListResultSchema, type OrderFromList } from '../../../../shared/schemas/parts-lists';
import { api } from '../../../lib/api-client';

export const orderFromList = (input: { listId: number } & OrderFromList) => api(`/lists/${input.listId}/order`, OrderFromListResultSchema, { method: 'POST', body: { lines: input.lines } });

/** The chosen lines go into the cart; the page passes onAdded to refresh the cart, which another feature owns. */
export function useOrderFromList(options: { onAdded?: () => void } = {}) {
  return useMutation({ mutationFn: orderFromList, onSuccess: () => options.onAdded?.() });
}
