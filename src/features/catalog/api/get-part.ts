import { queryOptions, useQuery } from '@tanstack/react-query';
import { PartDetailSchema } from '../../../../shared/schemas/parts';
import { api } from '../../../lib/api-client';
import { catalogKeys } from './keys';

export const getPart = (partNumber: string, signal?: AbortSignal) => api(`/parts/${encodeURIComponent(partNumber)}`, PartDetailSchema, { signal });

export const partQueryOptions = (partNumber: string) =>
  queryOptions({ queryKey: catalogKeys.part(partNumber), queryFn: ({ signal }) => getPart(partNumber, signal) });

export const usePart = (partNumber: string) => useQuery(partQueryOptions(partNumber));
