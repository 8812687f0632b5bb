import { useMutation } from '@tanstack/react-query';
import { CartViewSchema, type AddCartLine } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';

export const addToCart = (line: AddCartLine) => api('/cart/lines', CartViewSchema, { method: 'POST', body: line });

/**
 * Adds a part to the cart, carrying the saved check's id so the order shows what the part was chosen for.
 * The cart's queries belong to the cart feature, so the page passes in what to refresh.
 */
export const useAddToCart = (onAdded?: () => unknown) => useMutation({ mutationFn: addToCart, onSuccess: () => onAdded?.() });
