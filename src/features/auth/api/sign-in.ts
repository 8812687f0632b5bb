import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AuthUserReplySchema } from '../../../../shared/schemas/account-replies';
import type { SignIn } from '../../../../shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

export const signIn = (input: SignIn) => api('/auth/sign-in/email', AuthUserReplySchema, { method: 'POST', body: input });

/** Signs in; the caller refreshes whatever else belongs to the user (the cart) in its own onSuccess. */
export function useSignIn() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: () => client.invalidateQueries({ queryKey: authKeys.all }),
  });
}
