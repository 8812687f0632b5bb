import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FrameDetail } from '../../../../shared/schemas/parts';
import { apiRead } from '../../../lib/api-client';
import { catalogKeys } from './keys';

// Read without the validation library, as the shared schema's type: a first page makes this request (see apiRead).
export const getFrame = (code: string, signal?: AbortSignal) => apiRead<FrameDetail>(`/frames/${encodeURIComponent(code)}`, { signal });

export const frameQueryOptions = (code: string) => queryOptions({ queryKey: catalogKeys.frame(code), queryFn: ({ signal }) => getFrame(code, signal), staleTime: 60_000 });

/** A frame with its parts on sale; off until a code is known. */
export const useFrame = (code: string | null) => useQuery({ ...frameQueryOptions(code ?? ''), enabled: code !== null });
