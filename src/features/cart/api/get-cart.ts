import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CartView } from '../../../../shared/schemas/orders';
import { apiRead } from '../../../lib/api-client';
import { cartKeys } from './keys';

// Read without the validation library, as the shared schema's type: a first page makes this request (see apiRead).
export const getCart = (signal?: AbortSignal) => apiRead<CartView>('/cart', { signal });

export const cartQueryOptions = () => queryOptions({ queryKey: cartKeys.cart(), queryFn: ({ signal }) => getCart(signal) });

export const useCart = () => useQuery(cartQueryOptions());
