import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { DealerAccountsSchema, DEALERS_PAGE_SIZE } from '../../../../shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { adminKeys } from './keys';

export const getDealers = (page: number, signal?: AbortSignal) => api(`/admin/dealers?page=${page}&pageSize=${DEALERS_PAGE_SIZE}`, DealerAccountsSchema, { signal });

export const dealersQueryOptions = (page = 1) =>
  queryOptions({ queryKey: adminKeys.dealersPage(page), queryFn: ({ signal }) => getDealers(page, signal), placeholderData: keepPreviousData });

/** One page of dealer accounts and applications, pending first (admins only; 403 for anyone else). */
export const useDealers = (enabled = true, page = 1) => useQuery({ ...dealersQueryOptions(page), enabled });
