import { queryOptions, useQuery } from '@tanstack/react-query';
import { FitmentFrameMapsResponseSchema } from '../../../../shared/schemas/saved-fitments';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

export const getFrameMaps = (signal?: AbortSignal) => api('/fitment/frames', FitmentFrameMapsResponseSchema, { signal });

export const frameMapsQueryOptions = () =>
  queryOptions({ queryKey: fitmentKeys.frameMaps(), queryFn: ({ signal }) => getFrameMaps(signal), staleTime: 10 * 60_000 });

/** Every frame's compressor map, for the results chart. */
export const useFrameMaps = () => useQuery(frameMapsQueryOptions());
