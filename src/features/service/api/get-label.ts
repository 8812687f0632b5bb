import { queryOptions, useQuery } from '@tanstack/react-query';
import { ServiceLabelSchema } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

export const getServiceLabel = (reference: string, signal?: AbortSignal) => api(`/service/${encodeURIComponent(reference)}/label`, ServiceLabelSchema, { signal });
export const serviceLabelQueryOptions = (reference: string) =>
  queryOptions({ queryKey: serviceKeys.label(reference), queryFn: ({ signal }) => getServiceLabel(reference, signal), staleTime: 60_000, retry: false });
/** The printable label of a booked request. */
export const useServiceLabel = (reference: string) => useQuery(serviceLabelQueryOptions(reference));
