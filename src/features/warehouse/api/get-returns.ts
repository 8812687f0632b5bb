import { queryOptions, useQuery } from '@tanstack/react-query';
import { ReturnsPageSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

export type ReturnFilter = 'requested' | 'all';

export const getReturns = (status: ReturnFilter, signal?: AbortSignal) => api(`/warehouse/returns?status=${status}`, ReturnsPageSchema, { signal });

export const returnsQueryOptions = (status: ReturnFilter) =>
  queryOptions({ queryKey: warehouseKeys.returnList(status), queryFn: ({ signal }) => getReturns(status, signal), staleTime: 0 });

/** Returns and cores waiting to be received (or every one, with `all`). */
export const useReturns = (status: ReturnFilter) => useQuery(returnsQueryOptions(status));
