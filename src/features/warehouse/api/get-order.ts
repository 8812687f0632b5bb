import { queryOptions, useQuery } from '@tanstack/react-query';
import { OrderDetailSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

export const getOrder = (number: string, signal?: AbortSignal) => api(`/orders/${encodeURIComponent(number)}`, OrderDetailSchema, { signal });

export const orderQueryOptions = (number: string) =>
  queryOptions({ queryKey: warehouseKeys.order(number), queryFn: ({ signal }) => getOrder(number, signal), staleTime: 0 });

/** Any order, as warehouse staff may read them all: delivery address, lines, dispatch details. */
export const useOrder = (number: string) => useQuery(orderQueryOptions(number));
