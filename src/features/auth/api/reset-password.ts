import { useMutation } from '@tanstack/react-query';
import { AuthStatusReplySchema } from '../../../../shared/schemas/account-replies';
import { api } from '../../../lib/api-client';

export const resetPassword = (input: { token: string; newPassword: string }) =>
  api('/auth/reset-password', AuthStatusReplySchema, { method: 'POST', body: input });

export const useResetPassword = () => useMutation({ mutationFn: resetPassword });
