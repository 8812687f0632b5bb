import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '../../../../shared/schemas/accounts';
import { apiRead } from '../../../lib/api-client';
import { authKeys } from './keys';

// Read without the validation library, as the shared schema's type: a first page makes this request (see apiRead).
export const getMe = (signal?: AbortSignal) => apiRead<Me>('/account/me', { signal });

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => getMe(signal), staleTime: 60_000 });

/** Who is signed in (null when nobody), their role and trade account, and the payment mode. */
export const useMe = () => useQuery(meQueryOptions());
