import { useMutation, useQueryClient } from '@tanstack/react-query';
import { ServiceRequestViewSchema, type ServiceDecision } from '../../../../shared/schemas/service';
import { api } from '../../../lib/api-client';
import { serviceKeys } from './keys';

export const decideServiceQuote = ({ reference, decision }: { reference: string; decision: ServiceDecision }) =>
  api(`/service/${encodeURIComponent(reference)}/decision`, ServiceRequestViewSchema, { method: 'POST', body: decision });

/** The customer approves or declines the quote, paying by card or on account. */
export function useDecideServiceQuote() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: decideServiceQuote,
    onSuccess: (view) => {
      client.setQueryData(serviceKeys.detail(view.reference), view);
      void client.invalidateQueries({ queryKey: serviceKeys.all });
    },
  });
}
