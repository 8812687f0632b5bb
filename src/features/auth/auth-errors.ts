import { ApiError } from '../../lib/api-client';

/** Turns the auth library's answers into words a person can act on. */
export function authErrorMessage(error: unknown, action: 'sign-in' | 'sign-up' | 'reset-request' | 'reset'): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Please try again.';
  if (error.status === 0) return error.message;
  if (error.status === 429) return 'Too many attempts from here. Wait a minute, then try again.';
  if (action === 'sign-in' && error.status === 401) return 'That e-mail address and password do not match an account. Check both and try again, or reset your password.';
  if (action === 'sign-in' && error.status === 403) return 'This account cannot sign in at the moment. Contact the trade counter.';
  if (action === 'sign-up' && error.status === 422) return 'An account with this e-mail address already exists. Sign in instead, or reset its password.';
  if (action === 'reset' && error.status === 400) return 'This reset link has expired or was already used. Ask for a new link.';
  if (error.status >= 500) return 'Something went wrong on our side. Please try again in a moment.';
  return error.message;
}
