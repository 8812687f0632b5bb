import { queryOptions, useQuery } from '@tanstack/react-query';
import { BenchRequestSchema } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

export const getBenchRequest = (reference: string, signal?: AbortSignal) => api(`/bench/requests/${encodeURIComponent(reference)}`, BenchRequestSchema, { signal });
export const benchRequestQueryOptions = (reference: string | null) =>
  queryOptions({ queryKey: serviceKeys.benchRequest(reference ?? ''), queryFn: ({ signal }) => getBenchRequest(reference ?? '', signal), enabled: reference !== null, retry: false });
/** A request as the Bench works it: with the frame's limits and the kits that go with the unit. */
export const useBenchRequest = (reference: string | null) => useQuery(benchRequestQueryOptions(reference));
