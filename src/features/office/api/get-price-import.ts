import { queryOptions, useQuery } from '@tanstack/react-query';
import { PriceImportSchema } from '../../../../shared/schemas/admin-catalog';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const getPriceImport = (id: number, signal?: AbortSignal) => api(`/admin/price-imports/${id}`, PriceImportSchema, { signal });

export const priceImportQueryOptions = (id: number) =>
  queryOptions({ queryKey: officeKeys.priceImport(id), queryFn: ({ signal }) => getPriceImport(id, signal) });

export const usePriceImport = (id: number | null) => useQuery({ ...priceImportQueryOptions(id ?? 0), enabled: id !== null });
