import { queryOptions, useQuery } from '@tanstack/react-query';
import { PickListSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

/** One order's pick list, or a batch over several; lines come in bin walk order either way. */
export const getPickList = (orders: readonly string[], signal?: AbortSignal) =>
  orders.length === 1
    ? api(`/warehouse/orders/${encodeURIComponent(orders[0] ?? '')}/pick-list`, PickListSchema, { signal })
    : api(`/warehouse/pick-list?orders=${orders.map(encodeURIComponent).join(',')}`, PickListSchema, { signal });

export const pickListQueryOptions = (orders: readonly string[]) =>
  queryOptions({ queryKey: warehouseKeys.pickList(orders), queryFn: ({ signal }) => getPickList(orders, signal), staleTime: 0 });

export const usePickList = (orders: readonly string[]) => useQuery({ ...pickListQueryOptions(orders), enabled: orders.length > 0 });
