import { queryOptions, useQuery } from '@tanstack/react-query';
import { OrderDetailSchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { orderKeys } from './keys';

export const getOrder = (number: string, signal?: AbortSignal) => api(`/orders/${encodeURIComponent(number)}`, OrderDetailSchema, { signal });

/** How long the page keeps asking while a card payment waits for the payment service's webhook. */
export const PAYMENT_POLL_MS = 500;
export const PAYMENT_POLL_LIMIT = 60;

export const orderQueryOptions = (number: string) =>
  queryOptions({
    queryKey: orderKeys.detail(number),
    queryFn: ({ signal }) => getOrder(number, signal),
    // A card order stays "awaiting payment" until the webhook lands (usually well under a second); stop after ~30 s.
    refetchInterval: (query) => (query.state.data?.status === 'pending_payment' && query.state.dataUpdateCount < PAYMENT_POLL_LIMIT ? PAYMENT_POLL_MS : false),
    retry: (count, error) => !('status' in error && (error.status === 404 || error.status === 401)) && count < 2,
  });

export const useOrder = (number: string) => useQuery(orderQueryOptions(number));
