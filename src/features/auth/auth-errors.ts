import { ApiError } from '../../lib/api-client';

/** Turns the auth library's answers into words a person can act on. */
export function authErrorMessage(error: unknown, action: 'sign-in' | 'sign-up' | 'reset-request' | 'reset'): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Please try again.';
  if (error.status === 0) return error.message;
  // The server's own words say which limit was met and for how long.
  if (error.status === 429) return error.message.startsWith('Request failed') ? 'Too many attempts. Wait a few minutes, then try again.' : error.message;
  if (action === 'sign-in' && error.status === 401) return 'That e-mail address and password do not match an account. Check both and try again, or reset your password.';
  if (action === 'sign-in' && error.status === 403) {
    return 'This account cannot sign in yet. If you have just created it, follow the link in the e-mail we sent (a new one is on its way). Otherwise contact the trade counter.';
  }
  if (action === 'reset' && error.status === 400) return 'This reset link has expired or was already used. Ask for a new link.';
  if (error.status >= 500) return 'Something went wrong on our side. Please try again in a moment.';
  return error.message;
}
