import { queryOptions, useQuery } from '@tanstack/react-query';
import { LowStockSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

export const getLowStock = (signal?: AbortSignal) => api('/warehouse/low-stock', LowStockSchema, { signal });

export const lowStockQueryOptions = () => queryOptions({ queryKey: warehouseKeys.lowStock(), queryFn: ({ signal }) => getLowStock(signal), staleTime: 0 });

/** Parts at or under their minimum, with the back-orders waiting on them. */
export const useLowStock = () => useQuery(lowStockQueryOptions());
