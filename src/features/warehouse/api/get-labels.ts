import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { warehouseKeys } from './keys';

const labelSheetSchema = () => import('../../../../shared/schemas/labels').then((m) => m.LabelSheetSchema);

/** The label choices as the page's address holds them (parts, receipts, binFrom, binTo, copies). */
export const getLabels = (query: string, signal?: AbortSignal) => api(`/warehouse/labels?${query}`, labelSheetSchema, { signal });

export const labelsQueryOptions = (query: string) =>
  queryOptions({ queryKey: warehouseKeys.labels(query), queryFn: ({ signal }) => getLabels(query, signal), staleTime: 30_000, placeholderData: keepPreviousData });

/** Part and bin labels with their barcodes drawn by the server; nothing is asked while nothing is chosen. */
export const useLabels = (query: string) => useQuery({ ...labelsQueryOptions(query), enabled: query.length > 0 });
