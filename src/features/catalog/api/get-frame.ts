import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { catalogKeys } from './keys';

// The schema (and the validation library) loads beside the request, not before the page's first paint.
const schema = () => import('../../../../shared/schemas/parts').then((m) => m.FrameDetailSchema);

export const getFrame = (code: string, signal?: AbortSignal) => api(`/frames/${encodeURIComponent(code)}`, schema, { signal });

export const frameQueryOptions = (code: string) => queryOptions({ queryKey: catalogKeys.frame(code), queryFn: ({ signal }) => getFrame(code, signal), staleTime: 60_000 });

/** A frame with its parts on sale; off until a code is known. */
export const useFrame = (code: string | null) => useQuery({ ...frameQueryOptions(code ?? ''), enabled: code !== null });
