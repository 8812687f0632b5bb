import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddCartLine } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { cartKeys } from './keys';

// The answer's schema (and the validation library) loads with the request: the part and catalogue pages offer this.
const schema = () => import('../../../lib/action-schemas').then((m) => m.CartViewSchema);

export const addCartLine = (line: AddCartLine) => api('/cart/lines', schema, { method: 'POST', body: line });

/** Adds a part; the answer is the whole cart, so it replaces the cached one (with any "superseded" notices). */
export function useAddCartLine() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: addCartLine,
    onSuccess: (view) => qc.setQueryData(cartKeys.cart(), view),
  });
}
