import { useMutation } from '@tanstack/react-query';
import { CartViewSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';

export const addLinesToCart = (lines: Array<{ partNumber: string; quantity: number }>) => api('/cart/bulk', CartViewSchema, { method: 'POST', body: { lines } });

/** Every valid row in one request; the page passes onAdded to refresh the cart, which another feature owns. */
export function useAddLinesToCart(options: { onAdded?: () => void } = {}) {
  return useMutation({ mutationFn: addLinesToCart, onSuccess: () => options.onAdded?.() });
}
