import { queryOptions, useQuery } from '@tanstack/react-query';
import { MeSchema } from '../../../../shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

export const getMe = (signal?: AbortSignal) => api('/account/me', MeSchema, { signal });

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => getMe(signal), staleTime: 60_000 });

/** Who is signed in (null when nobody), their role and trade account, and the payment mode. */
export const useMe = () => useQuery(meQueryOptions());
