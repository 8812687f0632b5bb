import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AuthStatusReplySchema } from '../../../../shared/schemas/account-replies';
import { api } from '../../../lib/api-client';

export const signOut = () => api('/auth/sign-out', AuthStatusReplySchema, { method: 'POST', body: {} });

export function useSignOut() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    // Everything cached belonged to the person who just left (orders, cart, account): start over.
    onSuccess: () => client.resetQueries(),
  });
}
