import { queryOptions, useQuery } from '@tanstack/react-query';
import { PartDetailSchema } from '../../../../shared/schemas/parts';
import { api } from '../../../lib/api-client';
import { fitmentKeys } from './keys';

export const getPart = (partNumber: string, signal?: AbortSignal) => api(`/parts/${encodeURIComponent(partNumber)}`, PartDetailSchema, { signal });

export const partQueryOptions = (partNumber: string) =>
  queryOptions({ queryKey: fitmentKeys.part(partNumber), queryFn: ({ signal }) => getPart(partNumber, signal) });

/** One part with its goes-with links, from which a build takes its gaskets and lines. */
export const usePart = (partNumber: string | null) => useQuery({ ...partQueryOptions(partNumber ?? ''), enabled: partNumber !== null });
