import { useQuery } from '@tanstack/react-query';
import type { UnreadNotices } from '../../../../shared/schemas/notices';
import { apiRead } from '../../../lib/api-client';
import { noticesKeys } from './keys';

// Read without the validation library, as the shared schema's type: the header's bell is on every first page (see apiRead).
export const getUnreadNotices = (signal?: AbortSignal) => apiRead<UnreadNotices>('/notices/unread', { signal });

/** How many notices are unread, for the header; looked at again each minute and when the window regains focus. */
export const useUnreadNotices = (enabled: boolean) =>
  useQuery({ queryKey: noticesKeys.unread(), queryFn: ({ signal }) => getUnreadNotices(signal), enabled, staleTime: 30_000, refetchInterval: 60_000 });
