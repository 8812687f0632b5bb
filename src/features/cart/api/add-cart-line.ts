import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CartViewSchema, type AddCartLine } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { cartKeys } from './keys';

export const addCartLine = (line: AddCartLine) => api('/cart/lines', CartViewSchema, { method: 'POST', body: line });

/** Adds a part; the answer is the whole cart, so it replaces the cached one (with any "superseded" notices). */
export function useAddCartLine() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: addCartLine,
    onSuccess: (view) => qc.setQueryData(cartKeys.cart(), view),
  });
}
