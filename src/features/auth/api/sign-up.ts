import { useMutation, useQueryClient } from '@tanstack/react-query';
import { AuthUserReplySchema } from '../../../../shared/schemas/account-replies';
import type { SignUp } from '../../../../shared/schemas/accounts';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

/** Self sign-up always makes a customer; the server decides the role. */
export const signUp = (input: SignUp) => api('/auth/sign-up/email', AuthUserReplySchema, { method: 'POST', body: input });

export function useSignUp() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: () => client.invalidateQueries({ queryKey: authKeys.all }),
  });
}
