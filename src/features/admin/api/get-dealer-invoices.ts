import { queryOptions, useQuery } from '@tanstack/react-query';
import { OpenInvoicesSchema } from '../../../../shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { adminKeys } from './keys';

export const getDealerInvoices = (dealerId: number, signal?: AbortSignal) => api(`/admin/dealers/${dealerId}/invoices`, OpenInvoicesSchema, { signal });

export const dealerInvoicesQueryOptions = (dealerId: number) =>
  queryOptions({ queryKey: adminKeys.invoices(dealerId), queryFn: ({ signal }) => getDealerInvoices(dealerId, signal) });

/** A dealer's open on-account invoices, oldest first. */
export const useDealerInvoices = (dealerId: number | null) => useQuery({ ...dealerInvoicesQueryOptions(dealerId ?? 0), enabled: dealerId !== null });
