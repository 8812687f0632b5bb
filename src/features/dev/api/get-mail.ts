import { queryOptions, useQuery } from '@tanstack/react-query';
import { CaughtMailListSchema } from '../../../../shared/schemas/dev-mail';
import { api } from '../../../lib/api-client';
import { devKeys } from './keys';

export const getMail = (signal?: AbortSignal) => api('/dev/mail', CaughtMailListSchema, { signal });

export const mailQueryOptions = () =>
  queryOptions({
    queryKey: devKeys.mail(),
    queryFn: ({ signal }) => getMail(signal),
    staleTime: 0,
    // Newest first whatever order the catcher keeps.
    select: (data) => [...data.messages].sort((a, b) => b.date.localeCompare(a.date)),
  });

/**
 * Messages the development mail catcher holds, looked at again every few seconds: mail leaves through the outbox a
 * moment after what caused it, so a message often arrives after the page has opened.
 */
export const useMail = () => useQuery({ ...mailQueryOptions(), refetchInterval: 3_000 });
