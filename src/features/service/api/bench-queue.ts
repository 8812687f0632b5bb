import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { BenchQueuePageSchema } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

export const getBenchQueue = (queue: string, page: number, signal?: AbortSignal) => api(`/bench/queue?queue=${queue}&page=${page}`, BenchQueuePageSchema, { signal });
export const benchQueueQueryOptions = (queue: string, page: number) =>
  queryOptions({ queryKey: serviceKeys.queue(queue, page), queryFn: ({ signal }) => getBenchQueue(queue, page, signal), placeholderData: keepPreviousData });
/** One queue of the Bench (by state), a page at a time, with the counts of every queue. */
export const useBenchQueue = (queue: string, page: number) => useQuery(benchQueueQueryOptions(queue, page));
