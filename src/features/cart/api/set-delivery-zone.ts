import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DeliveryZone } from '../../../../shared/pricing';
import { CartViewSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { cartKeys } from './keys';

export const setDeliveryZone = (zone: DeliveryZone) => api('/cart/delivery-zone', CartViewSchema, { method: 'PUT', body: { zone } });

/** Freight depends on the zone, so the cart is priced again by the server. */
export function useSetDeliveryZone() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: setDeliveryZone,
    onSuccess: (view) => qc.setQueryData(cartKeys.cart(), view),
  });
}
