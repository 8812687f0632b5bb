import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PartsQuery } from '../../../../shared/schemas/parts';
import { api, toSearchParams } from '../../../lib/api-client';
import { catalogKeys } from './keys';

// The schema (and the validation library) loads beside the request, not before the page's first paint.
const schema = () => import('../../../../shared/schemas/parts').then((m) => m.PartsListResponseSchema);

export function getParts(query: PartsQuery, signal?: AbortSignal) {
  return api(`/parts${toSearchParams({ ...query, inStock: query.inStock === undefined ? undefined : String(query.inStock) })}`, schema, { signal });
}

export const partsQueryOptions = (query: PartsQuery) =>
  queryOptions({ queryKey: catalogKeys.parts(query), queryFn: ({ signal }) => getParts(query, signal), placeholderData: keepPreviousData });

export const useParts = (query: PartsQuery, enabled = true) => useQuery({ ...partsQueryOptions(query), enabled });
