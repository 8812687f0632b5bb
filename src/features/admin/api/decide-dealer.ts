import { useMutation, useQueryClient } from '@tanstack/react-query';
import { DealerDecisionReplySchema } from '../../../../shared/schemas/account-replies';
import type { DealerDecision } from '../../../../shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { adminKeys } from './keys';

export const decideDealer = ({ id, decision }: { id: number; decision: DealerDecision }) =>
  api(`/admin/dealers/${id}/decision`, DealerDecisionReplySchema, { method: 'POST', body: decision });

export function useDecideDealer() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: decideDealer,
    // Not awaited: the form that asked must hear of its success before the refreshed list can unmount it.
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: adminKeys.dealers() });
    },
  });
}
