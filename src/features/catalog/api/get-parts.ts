import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PartsListResponse, PartsQuery } from '../../../../shared/schemas/parts';
import { apiRead, toSearchParams } from '../../../lib/api-client';
import { catalogKeys } from './keys';

// Read without the validation library, as the shared schema's type: a first page makes this request (see apiRead).
export function getParts(query: PartsQuery, signal?: AbortSignal) {
  return apiRead<PartsListResponse>(`/parts${toSearchParams({ ...query, inStock: query.inStock === undefined ? undefined : String(query.inStock) })}`, { signal });
}

export const partsQueryOptions = (query: PartsQuery) =>
  queryOptions({ queryKey: catalogKeys.parts(query), queryFn: ({ signal }) => getParts(query, signal), placeholderData: keepPreviousData });

export const useParts = (query: PartsQuery, enabled = true) => useQuery({ ...partsQueryOptions(query), enabled });
