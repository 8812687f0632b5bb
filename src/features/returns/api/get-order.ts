import { queryOptions, useQuery } from '@tanstack/react-query';
import { OrderDetailSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { returnsKeys } from './keys';

export const getOrder = (number: string, signal?: AbortSignal) => api(`/orders/${encodeURIComponent(number)}`, OrderDetailSchema, { signal });

export const orderQueryOptions = (number: string) => queryOptions({ queryKey: returnsKeys.order(number), queryFn: ({ signal }) => getOrder(number, signal) });

export const useOrderForReturn = (number: string | null) => useQuery({ ...orderQueryOptions(number ?? ''), enabled: Boolean(number) });
