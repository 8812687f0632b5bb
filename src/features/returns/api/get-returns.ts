import { queryOptions, useQuery } from '@tanstack/react-query';
import { ReturnsPageSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { returnsKeys } from './keys';

export const getReturns = (page: number, signal?: AbortSignal) => api(`/returns?page=${page}`, ReturnsPageSchema, { signal });

export const returnsQueryOptions = (page = 1) => queryOptions({ queryKey: returnsKeys.list(page), queryFn: ({ signal }) => getReturns(page, signal), staleTime: 10_000 });

/** The signed-in buyer's own returns, newest first, a page at a time. */
export const useReturns = (page = 1) => useQuery({ ...returnsQueryOptions(page), placeholderData: (previous) => previous });
