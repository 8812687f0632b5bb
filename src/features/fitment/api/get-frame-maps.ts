import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

// The schema (and the validation library) loads beside the request, not before the page's first paint.
const schema = () => import('../../../../shared/schemas/saved-fitments').then((m) => m.FitmentFrameMapsResponseSchema);

export const getFrameMaps = (signal?: AbortSignal) => api('/fitment/frames', schema, { signal });

export const frameMapsQueryOptions = () =>
  queryOptions({ queryKey: fitmentKeys.frameMaps(), queryFn: ({ signal }) => getFrameMaps(signal), staleTime: 10 * 60_000 });

/** Every frame's compressor map, for the results chart. */
export const useFrameMaps = () => useQuery(frameMapsQueryOptions());
