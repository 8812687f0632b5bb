import { queryOptions, useQuery } from '@tanstack/react-query';
import { StockDetailSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

export const getStock = (partNumber: string, signal?: AbortSignal) => api(`/warehouse/stock/${encodeURIComponent(partNumber)}`, StockDetailSchema, { signal });

export const stockQueryOptions = (partNumber: string) =>
  queryOptions({ queryKey: warehouseKeys.stockPart(partNumber), queryFn: ({ signal }) => getStock(partNumber, signal), staleTime: 0 });

/** A part's bins (on hand, reserved, and the same figures summed from the ledger) and its last movements. */
export const useStock = (partNumber: string | null) => useQuery({ ...stockQueryOptions(partNumber ?? ''), enabled: Boolean(partNumber) });
