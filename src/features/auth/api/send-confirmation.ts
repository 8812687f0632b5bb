import { useMutation } from '@tanstack/react-query';
import { AuthStatusReplySchema } from '../../../../shared/schemas/account-replies';
import { api } from '../../../lib/api-client';

/** A fresh confirmation link; the answer is the same whether or not the address has an unconfirmed account. */
export const sendConfirmation = ({ email, next }: { email: string; next: string }) =>
  api('/auth/send-verification-email', AuthStatusReplySchema, { method: 'POST', body: { email, callbackURL: next } });

export const useSendConfirmation = () => useMutation({ mutationFn: sendConfirmation });
