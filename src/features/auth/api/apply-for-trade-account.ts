import { useMutation, useQueryClient } from '@tanstack/react-query';
import { DealerApplicationReplySchema } from '../../../../shared/schemas/account-replies';
import type { DealerApplication } from '../../../../shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

export const applyForTradeAccount = (input: DealerApplication) =>
  api('/account/dealer-applications', DealerApplicationReplySchema, { method: 'POST', body: input });

export function useApplyForTradeAccount() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: applyForTradeAccount,
    // The account page reads the application's state from /me.
    onSuccess: () => client.invalidateQueries({ queryKey: authKeys.me() }),
  });
}
