import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CartViewSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { cartKeys } from './keys';

export const removeCartLine = (id: number) => api(`/cart/lines/${id}`, CartViewSchema, { method: 'DELETE' });

export function useRemoveCartLine() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: removeCartLine,
    onSuccess: (view) => qc.setQueryData(cartKeys.cart(), view),
    onError: () => qc.invalidateQueries({ queryKey: cartKeys.all }),
  });
}
