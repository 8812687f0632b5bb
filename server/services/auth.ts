import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { admin } from 'better-auth/plugins';
import type { Db } from '../db/client';
import * as schema from '../db/schema';

export { ROLES, type Role } from '../../shared/allowed-values';

export interface AuthOptions {
  db: Db;
  baseURL: string;
  secret: string;
  trustedOrigins: string[];
  /** Called with the reset link; the mailer sends it. */
  sendResetPassword: (to: { email: string; name: string }, url: string) => Promise<void>;
  secureCookies: boolean;
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
      minPasswordLength: 10,
      maxPasswordLength: 128,
      resetPasswordTokenExpiresIn: 60 * 60,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user, url }) => {
        await options.sendResetPassword({ email: user.email, name: user.name }, url);
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
    // Sign-in is rate-limited by our own middleware in front of this handler (per client address).
    rateLimit: { enabled: false },
    advanced: {
      useSecureCookies: options.secureCookies,
      defaultCookieAttributes: { httpOnly: true, sameSite: 'lax', secure: options.secureCookies },
    },
    telemetry: { enabled: false },
    plugins: [admin({ defaultRole: 'customer', adminRoles: ['admin'] })],
  });
}

export type Auth = ReturnType<typeof createAuth>;
