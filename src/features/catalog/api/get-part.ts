import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PartDetail } from '../../../../shared/schemas/parts';
import { apiRead } from '../../../lib/api-client';
import { catalogKeys } from './keys';

// Read without the validation library, as the shared schema's type: a first page makes this request (see apiRead).
export const getPart = (partNumber: string, signal?: AbortSignal) => apiRead<PartDetail>(`/parts/${encodeURIComponent(partNumber)}`, { signal });

export const partQueryOptions = (partNumber: string) =>
  queryOptions({ queryKey: catalogKeys.part(partNumber), queryFn: ({ signal }) => getPart(partNumber, signal) });

export const usePart = (partNumber: string) => useQuery(partQueryOptions(partNumber));
