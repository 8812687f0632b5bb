import { useMutation, useQueryClient } from '@tanstack/react-query';
import { MailResendReplySchema } from '../../../../shared/schemas/mail-outbox';
import { api } from '../../../lib/api-client';
import { officeKeys } from './keys';

export const resendMail = (id: number) => api(`/admin/mail/${id}/resend`, MailResendReplySchema, { method: 'POST' });

/** Queues a message again: a failed one gets a fresh set of attempts, a sent one goes once more. */
export function useResendMail() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: resendMail,
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: officeKeys.mail() });
    },
  });
}
