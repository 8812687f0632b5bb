import { queryOptions, useQuery } from '@tanstack/react-query';
import { PartDetailSchema } from '../../../../shared/schemas/parts';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const lookupPart = (partNumber: string, signal?: AbortSignal) => api(`/parts/${encodeURIComponent(partNumber)}`, PartDetailSchema, { signal });

export const lookupPartQueryOptions = (partNumber: string) =>
  queryOptions({ queryKey: officeKeys.lookup(partNumber), queryFn: ({ signal }) => lookupPart(partNumber, signal), staleTime: 60_000 });

/** Live look-up of a typed part number (off until it looks like one). */
export const useLookupPart = (partNumber: string) => useQuery({ ...lookupPartQueryOptions(partNumber), enabled: partNumber.length >= 4 });
