import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

const schema = () => import('../../../../shared/schemas/parts').then((m) => m.FrameDetailSchema);

export const getFrameDetail = (code: string, signal?: AbortSignal) => api(`/frames/${encodeURIComponent(code)}`, schema, { signal });

export const frameDetailQueryOptions = (code: string) =>
  queryOptions({ queryKey: fitmentKeys.frameDetail(code), queryFn: ({ signal }) => getFrameDetail(code, signal), staleTime: 60_000 });

/** The recommended frame with its parts, for its exploded view under the build. */
export const useFrameDetail = (code: string | null) => useQuery({ ...frameDetailQueryOptions(code ?? ''), enabled: code !== null });
