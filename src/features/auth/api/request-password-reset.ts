import { useMutation } from '@tanstack/react-query';
import { AuthStatusReplySchema } from '../../../../shared/schemas/account-replies';
import { api } from '../../../lib/api-client';

/** The mailed link comes back to /reset-password with a token; the answer is the same for unknown addresses. */
export const requestPasswordReset = (email: string) =>
  api('/auth/request-password-reset', AuthStatusReplySchema, { method: 'POST', body: { email, redirectTo: '/reset-password' } });

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset });
