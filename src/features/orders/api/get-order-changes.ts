import { queryOptions, useQuery } from '@tanstack/react-query';
import { OrderChangesSchema } from '../../../../shared/schemas/order-changes';
import { api } from '../../../lib/api-client';
import { orderKeys } from '../../../lib/orders';

/** Under the order's own key, so anything that refreshes the order refreshes this too. */
export const orderChangesKey = (number: string) => [...orderKeys.detail(number), 'changes'] as const;

export const getOrderChanges = (number: string, signal?: AbortSignal) => api(`/orders/${encodeURIComponent(number)}/changes`, OrderChangesSchema, { signal });

// Picking may start on the Floor while the page is open: read it fresh on each visit.
export const orderChangesQueryOptions = (number: string) => queryOptions({ queryKey: orderChangesKey(number), queryFn: ({ signal }) => getOrderChanges(number, signal), staleTime: 0 });

/** What the buyer may still do to the order, and what they changed before. */
export const useOrderChanges = (number: string) => useQuery(orderChangesQueryOptions(number));
