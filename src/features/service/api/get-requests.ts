import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { ServicePageSchema } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

export const getServiceRequests = (page: number, signal?: AbortSignal) => api(`/service?page=${page}`, ServicePageSchema, { signal });
export const serviceRequestsQueryOptions = (page: number) =>
  queryOptions({ queryKey: serviceKeys.list(page), queryFn: ({ signal }) => getServiceRequests(page, signal), placeholderData: keepPreviousData });
/** The buyer's service requests (and their trade account's), newest first, a page at a time. */
export const useServiceRequests = (page: number) => useQuery(serviceRequestsQueryOptions(page));
