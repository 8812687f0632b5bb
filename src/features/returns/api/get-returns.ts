import { queryOptions, useQuery } from '@tanstack/react-query';
import { ReturnsPageSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { returnsKeys } from './keys';

export const getReturns = (signal?: AbortSignal) => api('/returns', ReturnsPageSchema, { signal });

export const returnsQueryOptions = () => queryOptions({ queryKey: returnsKeys.list(), queryFn: ({ signal }) => getReturns(signal), staleTime: 10_000 });

/** The signed-in buyer's own returns, newest first. */
export const useReturns = (enabled = true) => useQuery({ ...returnsQueryOptions(), enabled });
