import { useMutation } from '@tanstack/react-query';
import { ReorderResponseSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';

export const reorderOrder = (number: string) => api(`/orders/${encodeURIComponent(number)}/reorder`, ReorderResponseSchema, { method: 'POST' });

/** Rebuilds the cart from a past order. The page passes onAdded to refresh the cart, which another feature owns. */
export function useReorder(options: { onAdded?: () => void } = {}) {
  return useMutation({ mutationFn: reorderOrder, onSuccess: () => options.onAdded?.() });
}
