import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { OrderSummarySchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { orderKeys } from './keys';

const OrdersResponseSchema = z.object({ items: z.array(OrderSummarySchema) });

export const getOrders = (signal?: AbortSignal) => api('/orders', OrdersResponseSchema, { signal });

export const ordersQueryOptions = () => queryOptions({ queryKey: orderKeys.list(), queryFn: ({ signal }) => getOrders(signal) });

export const useOrders = () => useQuery(ordersQueryOptions());
