import { queryOptions, useQuery } from '@tanstack/react-query';
import { CartViewSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { cartKeys } from './keys';

export const getCart = (signal?: AbortSignal) => api('/cart', CartViewSchema, { signal });

export const cartQueryOptions = () => queryOptions({ queryKey: cartKeys.cart(), queryFn: ({ signal }) => getCart(signal) });

export const useCart = () => useQuery(cartQueryOptions());
