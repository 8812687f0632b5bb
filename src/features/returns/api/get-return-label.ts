import { queryOptions, useQuery } from '@tanstack/react-query';
import { ReturnLabelSchema } from '../../../../shared/schemas/warehouse';
import { api } from '../../../lib/api-client';
import { returnsKeys } from './keys';

export const getReturnLabel = (reference: string, signal?: AbortSignal) => api(`/returns/${encodeURIComponent(reference)}/label`, ReturnLabelSchema, { signal });

export const returnLabelQueryOptions = (reference: string) =>
  queryOptions({ queryKey: returnsKeys.label(reference), queryFn: ({ signal }) => getReturnLabel(reference, signal), staleTime: 60_000, retry: false });

/** The printable label of one of the buyer's open returns. */
export const useReturnLabel = (reference: string) => useQuery(returnLabelQueryOptions(reference));
