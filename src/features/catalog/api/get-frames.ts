import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { catalogKeys } from './keys';

// The schema (and the validation library) loads beside the request, not before the page's first paint.
const schema = () => import('../../../../shared/schemas/parts').then((m) => m.FramesResponseSchema);

export const getFrames = (signal?: AbortSignal) => api('/frames', schema, { signal });

export const framesQueryOptions = () => queryOptions({ queryKey: catalogKeys.frames(), queryFn: ({ signal }) => getFrames(signal), staleTime: 10 * 60_000 });

export const useFrames = () => useQuery(framesQueryOptions());
