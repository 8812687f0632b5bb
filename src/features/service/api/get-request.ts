import { queryOptions, useQuery } from '@tanstack/react-query';
import { ServiceRequestViewSchema } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

export const getServiceRequest = (reference: string, signal?: AbortSignal) => api(`/service/${encodeURIComponent(reference)}`, ServiceRequestViewSchema, { signal });
export const serviceRequestQueryOptions = (reference: string) =>
  queryOptions({ queryKey: serviceKeys.detail(reference), queryFn: ({ signal }) => getServiceRequest(reference, signal), retry: false });
/** One service request with its quote and timeline. */
export const useServiceRequest = (reference: string) => useQuery(serviceRequestQueryOptions(reference));
