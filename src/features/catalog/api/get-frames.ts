import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FramesResponse } from '../../../../shared/schemas/parts';
import { apiRead } from '../../../lib/api-client';
import { catalogKeys } from './keys';

// Read without the validation library, as the shared schema's type: a first page makes this request (see apiRead).
export const getFrames = (signal?: AbortSignal) => apiRead<FramesResponse>('/frames', { signal });

export const framesQueryOptions = () => queryOptions({ queryKey: catalogKeys.frames(), queryFn: ({ signal }) => getFrames(signal), staleTime: 10 * 60_000 });

export const useFrames = () => useQuery(framesQueryOptions());
