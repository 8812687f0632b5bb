import { queryOptions, useQuery } from '@tanstack/react-query';
import { PickQueueSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

export const getPickQueue = (signal?: AbortSignal) => api('/warehouse/pick-queue', PickQueueSchema, { signal });

// Orders arrive all day; a queue a minute old is already wrong.
export const pickQueueQueryOptions = () =>
  queryOptions({ queryKey: warehouseKeys.queue(), queryFn: ({ signal }) => getPickQueue(signal), staleTime: 0, refetchInterval: 30_000 });

/** Orders ready to pick, pack or dispatch, oldest first. */
export const usePickQueue = () => useQuery(pickQueueQueryOptions());
