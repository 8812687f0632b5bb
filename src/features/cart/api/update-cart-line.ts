import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CartViewSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { cartKeys } from './keys';

export interface CartLineChange {
  id: number;
  quantity?: number;
  allowBackorder?: boolean;
}

export const updateCartLine = ({ id, ...change }: CartLineChange) => api(`/cart/lines/${id}`, CartViewSchema, { method: 'PATCH', body: change });

export function useUpdateCartLine() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updateCartLine,
    onSuccess: (view) => qc.setQueryData(cartKeys.cart(), view),
    onError: () => qc.invalidateQueries({ queryKey: cartKeys.all }),
  });
}
