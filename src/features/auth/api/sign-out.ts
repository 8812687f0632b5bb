import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

// The schema (and the validation library) loads beside the request, not before the page's first paint.
const schema = () => import('../../../../shared/schemas/account-replies').then((m) => m.AuthStatusReplySchema);

export const signOut = () => api('/auth/sign-out', schema, { method: 'POST', body: {} });

export function useSignOut() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    // Everything cached belonged to the person who just left (orders, cart, account): start over.
    onSuccess: () => client.resetQueries(),
  });
}
