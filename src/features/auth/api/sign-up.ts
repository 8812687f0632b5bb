import { useMutation, useQueryClient } from '@tanstack/react-query';
import { SignUpReplySchema } from '../../../../shared/schemas/account-replies';
import type { SignUp } from '../../../../shared/schemas/sign-up';
import { api } from '../../../lib/api-client';
import { authKeys } from './keys';

/**
 * Self sign-up always makes a customer; the server decides the role. The answer is the same whether or not the
 * address has an account: the next step comes by e-mail, and its link signs the new account in and opens `next`.
 */
export const signUp = (input: SignUp & { callbackURL?: string }) => api('/auth/sign-up/email', SignUpReplySchema, { method: 'POST', body: input });

export function useSignUp() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: () => client.invalidateQueries({ queryKey: authKeys.all }),
  });
}
