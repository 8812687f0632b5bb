import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { cartKeys } from './keys';

// The schema (and the validation library) loads beside the request, not before the page's first paint.
const schema = () => import('../../../../shared/schemas/orders').then((m) => m.CartViewSchema);

export const getCart = (signal?: AbortSignal) => api('/cart', schema, { signal });

export const cartQueryOptions = () => queryOptions({ queryKey: cartKeys.cart(), queryFn: ({ signal }) => getCart(signal) });

export const useCart = () => useQuery(cartQueryOptions());
