import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { catalogKeys } from './keys';

// The schema (and the validation library) loads beside the request, not before the page's first paint.
const schema = () => import('../../../../shared/schemas/parts').then((m) => m.PartDetailSchema);

export const getPart = (partNumber: string, signal?: AbortSignal) => api(`/parts/${encodeURIComponent(partNumber)}`, schema, { signal });

export const partQueryOptions = (partNumber: string) =>
  queryOptions({ queryKey: catalogKeys.part(partNumber), queryFn: ({ signal }) => getPart(partNumber, signal) });

export const usePart = (partNumber: string) => useQuery(partQueryOptions(partNumber));
