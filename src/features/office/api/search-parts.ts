import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { PartsListResponseSchema, type PartsQuery } from '../../../../shared/schemas/parts';
import { api, toSearchParams } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const OFFICE_PAGE_SIZE = 50;
export type OfficeSort = NonNullable<PartsQuery['sort']>;

export const searchParts = (q: string, sort: OfficeSort, page: number, signal?: AbortSignal) =>
  api(`/parts${toSearchParams({ q, sort: sort === 'relevance' ? undefined : sort, page, pageSize: OFFICE_PAGE_SIZE })}`, PartsListResponseSchema, { signal });

export const officePartsQueryOptions = (q: string, sort: OfficeSort, page: number) =>
  queryOptions({
    queryKey: officeKeys.parts(q, sort, page),
    queryFn: ({ signal }) => searchParts(q, sort, page, signal),
    placeholderData: keepPreviousData,
  });

/** The public catalogue search, a page at a time, for the office's parts table. */
export const useOfficeParts = (q: string, sort: OfficeSort, page: number) => useQuery(officePartsQueryOptions(q, sort, page));
