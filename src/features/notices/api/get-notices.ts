import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { noticesKeys } from './keys';

// The schemas (and the validation library) load beside the request: the header's bell is on every first page.
const schemas = () => import('../../../../shared/schemas/notices');

export const getNotices = (page: number, signal?: AbortSignal) => api(`/notices?page=${page}`, () => schemas().then((m) => m.NoticesPageSchema), { signal });
export const noticesQueryOptions = (page = 1) => queryOptions({ queryKey: noticesKeys.list(page), queryFn: ({ signal }) => getNotices(page, signal), staleTime: 0 });

/** The signed-in buyer's notices, newest first, a page at a time. */
export const useNotices = (page = 1) => useQuery({ ...noticesQueryOptions(page), placeholderData: (previous) => previous });

export const getUnreadNotices = (signal?: AbortSignal) => api('/notices/unread', () => schemas().then((m) => m.UnreadNoticesSchema), { signal });

/** How many notices are unread, for the header; looked at again each minute and when the window regains focus. */
export const useUnreadNotices = (enabled: boolean) =>
  useQuery({ queryKey: noticesKeys.unread(), queryFn: ({ signal }) => getUnreadNotices(signal), enabled, staleTime: 30_000, refetchInterval: 60_000 });
