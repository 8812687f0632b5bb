import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { PriceImportHistorySchema } from '../../../../shared/schemas/admin-catalog';
import { api, toSearchParams } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const getPriceImportHistory = (page: number, signal?: AbortSignal) => api(`/admin/price-imports${toSearchParams({ page })}`, PriceImportHistorySchema, { signal });

export const priceImportHistoryQueryOptions = (page: number) =>
  queryOptions({ queryKey: officeKeys.priceImportHistory(page), queryFn: ({ signal }) => getPriceImportHistory(page, signal), placeholderData: keepPreviousData });

export const usePriceImportHistory = (page: number) => useQuery(priceImportHistoryQueryOptions(page));
