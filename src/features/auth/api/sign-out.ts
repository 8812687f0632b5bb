import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';

import { AuthStatusReplySchema } from '../../../../shared/schemas/account-replies';

export const signOut = () => api('/auth/sign-out', AuthStatusReplySchema, { method: 'POST', body: {} });

/** Signs out; `onSignedOut` runs once the cache has started over, even if the menu that asked has gone by then. */
export function useSignOut(onSignedOut?: () => void) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    // Everything cached belonged to the person who just left (orders, cart, account): start over.
    onSuccess: async () => {
      await client.resetQueries();
      onSignedOut?.();
    },
  });
}
