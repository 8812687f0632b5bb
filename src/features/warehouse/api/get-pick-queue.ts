import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { PickQueueSchema, type PickQueueQuery } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

const search = (query: PickQueueQuery) => {
  const params = new URLSearchParams({ page: String(query.page), pageSize: String(query.pageSize) });
  if (query.q) params.set('q', query.q);
  if (query.state) params.set('state', query.state);
  if (query.payment) params.set('payment', query.payment);
  return params.toString();
};

export const getPickQueue = (query: PickQueueQuery, signal?: AbortSignal) => api(`/warehouse/pick-queue?${search(query)}`, PickQueueSchema, { signal });

// Orders arrive all day; a queue a minute old is already wrong.
export const pickQueueQueryOptions = (query: PickQueueQuery) =>
  queryOptions({
    queryKey: warehouseKeys.queuePage(query),
    queryFn: ({ signal }) => getPickQueue(query, signal),
    staleTime: 0,
    refetchInterval: 30_000,
    placeholderData: keepPreviousData,
  });

/** One page of the orders ready to pick, pack or dispatch, oldest first, filtered on the server. */
export const usePickQueue = (query: PickQueueQuery) => useQuery(pickQueueQueryOptions(query));
