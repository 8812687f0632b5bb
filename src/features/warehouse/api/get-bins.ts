import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';
import { BinsSchema } from './reply-schemas';

export const getBins = (signal?: AbortSignal) => api('/warehouse/bins', BinsSchema, { signal });

// Bins change when the racking does: rarely.
export const binsQueryOptions = () => queryOptions({ queryKey: warehouseKeys.bins(), queryFn: ({ signal }) => getBins(signal), staleTime: 10 * 60_000 });

export const useBins = () => useQuery(binsQueryOptions());
