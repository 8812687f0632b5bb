import { queryOptions, useQuery } from '@tanstack/react-query';
import { FramesResponseSchema } from '../../../../shared/schemas/parts';
import { api } from '../../../lib/api-client';
import { catalogKeys } from './keys';

export const getFrames = (signal?: AbortSignal) => api('/frames', FramesResponseSchema, { signal });

export const framesQueryOptions = () => queryOptions({ queryKey: catalogKeys.frames(), queryFn: ({ signal }) => getFrames(signal), staleTime: 10 * 60_000 });

export const useFrames = () => useQuery(framesQueryOptions());
