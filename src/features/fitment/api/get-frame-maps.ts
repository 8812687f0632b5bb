import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FitmentFrameMapsResponse } from '../../../../shared/schemas/saved-fitments';
import { apiRead } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

// Read without the validation library, as the shared schema's type: a first page makes this request (see apiRead).
export const getFrameMaps = (signal?: AbortSignal) => apiRead<FitmentFrameMapsResponse>('/fitment/frames', { signal });

export const frameMapsQueryOptions = () =>
  queryOptions({ queryKey: fitmentKeys.frameMaps(), queryFn: ({ signal }) => getFrameMaps(signal), staleTime: 10 * 60_000 });

/** Every frame's compressor map, for the results chart. */
export const useFrameMaps = () => useQuery(frameMapsQueryOptions());
