import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';
import { adminKeys } from './keys';

const ReplySchema = z.object({ number: z.string(), paymentState: z.literal('paid') });

export const recordInvoicePaid = ({ dealerId, number, reference }: { dealerId: number; number: string; reference: string }) =>
  api(`/admin/dealers/${dealerId}/invoices/${encodeURIComponent(number)}/paid`, ReplySchema, { method: 'POST', body: { reference } });

/** Marks an on-account invoice paid; the dealer's open balance and the list follow. */
export function useRecordInvoicePaid() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: recordInvoicePaid,
    onSuccess: (_reply, vars) => {
      void client.invalidateQueries({ queryKey: adminKeys.invoices(vars.dealerId) });
      void client.invalidateQueries({ queryKey: adminKeys.dealerPages() });
    },
  });
}
