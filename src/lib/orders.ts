/**
 * The one way any screen reads an order or the buyer's order list, and the one key factory their caches live
 * under: the buyer's order page, the return request and the Floor's pack screen and slip share one cache entry per
 * order, and every change to an order invalidates through `orderKeys`.
 */
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { OrderDetailSchema, OrderSummarySchema } from '../../shared/schemas/orders';
import { api } from './api-client';

export const orderKeys = {
  all: ['orders'] as const,
  list: () => [...orderKeys.all, 'list'] as const,
  details: () => [...orderKeys.all, 'detail'] as const,
  detail: (number: string) => [...orderKeys.details(), number] as const,
};

export const getOrder = (number: string, signal?: AbortSignal) => api(`/orders/${encodeURIComponent(number)}`, OrderDetailSchema, { signal });

/** How long a screen keeps asking while a card payment waits for the payment service's webhook. */
export const PAYMENT_POLL_MS = 500;
export const PAYMENT_POLL_LIMIT = 60;

export const orderQueryOptions = (number: string) =>
  queryOptions({
    queryKey: orderKeys.detail(number),
    queryFn: ({ signal }) => getOrder(number, signal),
    // An order moves on the Floor and through payment webhooks while it is open elsewhere: read it fresh on each visit.
    staleTime: 0,
    // A card order stays "awaiting payment" until the webhook lands (usually well under a second); stop after ~30 s.
    refetchInterval: (query) => (query.state.data?.status === 'pending_payment' && query.state.dataUpdateCount < PAYMENT_POLL_LIMIT ? PAYMENT_POLL_MS : false),
  });

/** One order by its number; nothing is fetched while the number is null (no order chosen yet). */
export const useOrder = (number: string | null) => useQuery({ ...orderQueryOptions(number ?? ''), enabled: number !== null && number !== '' });

const OrdersListSchema = z.object({ items: z.array(OrderSummarySchema) });

export const getOrders = (signal?: AbortSignal) => api('/orders', OrdersListSchema, { signal });

export const ordersQueryOptions = () => queryOptions({ queryKey: orderKeys.list(), queryFn: ({ signal }) => getOrders(signal) });

/** The signed-in buyer's orders, newest first. */
export const useOrders = (enabled = true) => useQuery({ ...ordersQueryOptions(), enabled });
