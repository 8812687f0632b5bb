import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { OrderSummarySchema } from '../../../../shared/schemas/orders';
import { api } from '../../../lib/api-client';
import { returnsKeys } from './keys';

const OrdersListSchema = z.object({ items: z.array(OrderSummarySchema) });

export const getOrders = (signal?: AbortSignal) => api('/orders', OrdersListSchema, { signal });

export const ordersQueryOptions = () => queryOptions({ queryKey: returnsKeys.orders(), queryFn: ({ signal }) => getOrders(signal) });

/** The buyer's orders, to find one that has been dispatched. */
export const useOrdersForReturn = (enabled = true) => useQuery({ ...ordersQueryOptions(), enabled });
