import { queryOptions, useQuery } from '@tanstack/react-query';
import { ReturnsPageSchema, ReturnViewSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

export type ReturnFilter = 'requested' | 'all';

export const getReturns = (status: ReturnFilter, page: number, signal?: AbortSignal) => api(`/warehouse/returns?status=${status}&page=${page}`, ReturnsPageSchema, { signal });

export const returnsQueryOptions = (status: ReturnFilter, page = 1) =>
  queryOptions({ queryKey: warehouseKeys.returnList(status, page), queryFn: ({ signal }) => getReturns(status, page, signal), staleTime: 0 });

/** Returns and cores waiting to be received (or every one, with `all`), a page at a time. */
export const useReturns = (status: ReturnFilter, page = 1) => useQuery({ ...returnsQueryOptions(status, page), placeholderData: (previous) => previous });

/** One return by the code on its label, as scanned or typed. */
export const getReturnByCode = (code: string, signal?: AbortSignal) => api(`/warehouse/returns/by-code/${encodeURIComponent(code)}`, ReturnViewSchema, { signal });

export const useReturnByCode = (code: string | null) =>
  useQuery({ queryKey: warehouseKeys.returnByCode(code ?? ''), queryFn: ({ signal }) => getReturnByCode(code ?? '', signal), enabled: code !== null, staleTime: 0, retry: false });
