import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { PaymentAlertListSchema, PaymentAlertSchema } from '../../../../shared/schemas/payment-alerts';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const getPaymentAlerts = (signal?: AbortSignal) => api('/admin/payment-alerts', PaymentAlertListSchema, { signal });

export const paymentAlertsQueryOptions = () => queryOptions({ queryKey: officeKeys.paymentAlerts(), queryFn: ({ signal }) => getPaymentAlerts(signal) });

export const usePaymentAlerts = (enabled: boolean) => useQuery({ ...paymentAlertsQueryOptions(), enabled });

export const retryAlertRefund = (id: number) => api(`/admin/payment-alerts/${id}/retry-refund`, PaymentAlertSchema, { method: 'POST' });

export function useRetryAlertRefund() {
  const client = useQueryClient();
  return useMutation({ mutationFn: retryAlertRefund, onSettled: () => client.invalidateQueries({ queryKey: officeKeys.paymentAlerts() }) });
}
