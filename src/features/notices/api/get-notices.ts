import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { noticesKeys } from './keys';

// The schema (and the validation library) loads beside the request.
const schemas = () => import('../../../../shared/schemas/notices');

export const getNotices = (page: number, signal?: AbortSignal) => api(`/notices?page=${page}`, () => schemas().then((m) => m.NoticesPageSchema), { signal });
export const noticesQueryOptions = (page = 1) => queryOptions({ queryKey: noticesKeys.list(page), queryFn: ({ signal }) => getNotices(page, signal), staleTime: 0 });

/** The signed-in buyer's notices, newest first, a page at a time. */
export const useNotices = (page = 1) => useQuery({ ...noticesQueryOptions(page), placeholderData: (previous) => previous });
