import { queryOptions, useQuery } from '@tanstack/react-query';
import { DealerAccountsSchema } from '../../../../shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { adminKeys } from './keys';

export const getDealers = (signal?: AbortSignal) => api('/admin/dealers', DealerAccountsSchema, { signal });

export const dealersQueryOptions = () => queryOptions({ queryKey: adminKeys.dealers(), queryFn: ({ signal }) => getDealers(signal) });

/** Every dealer account and application, pending first (admins only; 403 for anyone else). */
export const useDealers = (enabled = true) => useQuery({ ...dealersQueryOptions(), enabled });
