import { queryOptions, useQuery } from '@tanstack/react-query';
import { ServiceInvoiceSchema } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

export const getServiceInvoice = (reference: string, signal?: AbortSignal) => api(`/service/${encodeURIComponent(reference)}/invoice`, ServiceInvoiceSchema, { signal });
export const serviceInvoiceQueryOptions = (reference: string) =>
  queryOptions({ queryKey: serviceKeys.invoice(reference), queryFn: ({ signal }) => getServiceInvoice(reference, signal), retry: false });
/** The invoice of a request that has shipped back. */
export const useServiceInvoice = (reference: string) => useQuery(serviceInvoiceQueryOptions(reference));
