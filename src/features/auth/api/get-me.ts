import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

// The schema (and the validation library) loads beside the request, not before the page's first paint.
const schema = () => import('../../../../shared/schemas/accounts').then((m) => m.MeSchema);

export const getMe = (signal?: AbortSignal) => api('/account/me', schema, { signal });

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => getMe(signal), staleTime: 60_000 });

/** Who is signed in (null when nobody), their role and trade account, and the payment mode. */
export const useMe = () => useQuery(meQueryOptions());
