import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { admin } from 'better-auth/plugins';
import type { Db } from '../db/client';
import * as schema from '../db/schema';
import { PASSWORD_MAX, PASSWORD_MIN } from '../../shared/schemas/accounts';

export { ROLES, type Role } from '../../shared/allowed-values';

export interface AuthOptions {
  db: Db;
  baseURL: string;
  secret: string;
  trustedOrigins: string[];
  /** Called with the reset link; the mailer sends it. */
  sendResetPassword: (to: { email: string; name: string }, url: string) => Promise<void>;
  /** Called with the link that confirms a new account's e-mail address. */
  sendConfirmEmail: (to: { email: string; name: string }, url: string) => Promise<void>;
  /** Someone tried to sign up with an address that already has an account: its owner is told, the asker is not. */
  sendExistingAccountNotice: (to: { email: string; name: string }) => Promise<void>;
  /** Takes the mail the auth library sends, so no answer waits for the mail server (and none is faster for it). */
  background: (task: Promise<unknown>) => void;
  secureCookies: boolean;
}

/** Where a confirmation link lands, in the client: it says what happened, and explains a link that no longer works. */
export const CONFIRM_PAGE = '/email-confirmed';

/**
 * The confirmation link goes back through our own page: the auth library appends `?error=TOKEN_EXPIRED` (or another
 * code) to its way back when the link fails, which no other page would explain. The page the buyer was headed for
 * rides along as `next`.
 */
export function throughConfirmPage(url: string): string {
  const link = new URL(url);
  const back = link.searchParams.get('callbackURL');
  const next = back && back.startsWith('/') && !back.startsWith('//') && !back.startsWith(CONFIRM_PAGE) ? back : '/';
  link.searchParams.set('callbackURL', `${CONFIRM_PAGE}?next=${encodeURIComponent(next)}`);
  return link.toString();
}

/** Sign-in with e-mail and password through better-auth, its users and sessions in our SQLite file. */
export function createAuth(options: AuthOptions) {
  return betterAuth({
    baseURL: options.baseURL,
    basePath: '/api/auth',
    secret: options.secret,
    trustedOrigins: options.trustedOrigins,
    database: drizzleAdapter(options.db, {
      provider: 'sqlite',
      schema: { user: schema.user, session: schema.session, account: schema.account, verification: schema.verification },
    }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: PASSWORD_MIN,
      maxPasswordLength: PASSWORD_MAX,
      resetPasswordTokenExpiresIn: 60 * 60,
      revokeSessionsOnPasswordReset: true,
      // A new account signs in once its address is confirmed. That is what lets sign-up answer the same for an
      // address that already has an account: the owner gets a notice instead of a confirmation link.
      requireEmailVerification: true,
      onExistingUserSignUp: async ({ user }) => {
        await options.sendExistingAccountNotice({ email: user.email, name: user.name });
      },
      sendResetPassword: async ({ user, url }) => {
        await options.sendResetPassword({ email: user.email, name: user.name }, url);
      },
    },
    emailVerification: {
      sendOnSignUp: true,
      sendOnSignIn: true,
      autoSignInAfterVerification: true,
      expiresIn: 60 * 60 * 24,
      sendVerificationEmail: async ({ user, url }) => {
        await options.sendConfirmEmail({ email: user.email, name: user.name }, throughConfirmPage(url));
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
    // Sign-in and reset are rate-limited by our own middleware in front of this handler (per address and per account).
    rateLimit: { enabled: false },
    advanced: {
      backgroundTasks: { handler: options.background },
      useSecureCookies: options.secureCookies,
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax', secure: options.secureCookies },
    },
    telemetry: { enabled: false },
    plugins: [admin({ defaultRole: 'customer', adminRoles: ['admin'] })],
  });
}

export type Auth = ReturnType<typeof createAuth>;
