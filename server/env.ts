import { z } from 'zod';
import { TrackingUrlPatternsSchema } from '../shared/carriers';

const DEV_AUTH_SECRET = 'spoolyard-development-secret-change-me-0001';

const EnvSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    HOST: z.string().default('127.0.0.1'),
    /** The address buyers reach the app at; links in e-mails use it. */
    PUBLIC_URL: z.url().optional(),
    DATABASE_FILE: z.string().min(1).default('data/spoolyard.db'),
    /** Uploaded photos, kept outside the built client so they are only served through checked routes. */
    UPLOADS_DIR: z.string().min(1).default('data/uploads'),
    /**
     * Seed the demo catalogue, accounts and logs (`npm start` only, a development tool). Defaults on outside
     * production; a production start refuses it.
     */
    SEED_DEMO: z.enum(['true', 'false']).optional(),
    AUTH_SECRET: z.string().min(32, 'must be at least 32 characters').default(DEV_AUTH_SECRET),
    SIGNIN_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).max(10_000).default(10),
    ORDER_PAD_LIMIT_PER_MINUTE: z.coerce.number().int().min(1).max(10_000).default(20),
    /** App processes serving the one port on the one database file (Node's cluster module); 1 runs in-process. */
    APP_PROCESSES: z.coerce.number().int().min(1).max(64).default(1),
    /** How often the housekeeping job (unpaid-order expiry, counters) runs, in the one process holding its lease. */
    HOUSEKEEPING_SECONDS: z.coerce.number().int().min(1).max(3600).default(60),
    TAX_RATE_PCT: z.coerce.number().min(0).max(40).default(8),
    /** The Bench's labour rate per hour and the inspection fee charged when a quote is declined, in cents. */
    SERVICE_LABOUR_RATE_CENTS: z.coerce.number().int().min(0).max(1_000_000).default(9_500),
    SERVICE_INSPECTION_FEE_CENTS: z.coerce.number().int().min(0).max(1_000_000).default(6_500),
    /** "test" talks to the local payments fake; "live" to the real service with its browser script. */
    PAYMENTS_MODE: z.enum(['test', 'live']).default('test'),
    PAYMENTS_SECRET_KEY: z.string().regex(/^sk_(test|live)_/, 'must start with sk_test_ or sk_live_').default('sk_test_spoolyard_development_only'),
    PAYMENTS_PUBLISHABLE_KEY: z.string().regex(/^pk_(test|live)_/, 'must start with pk_test_ or pk_live_').default('pk_test_spoolyard_development_only'),
    PAYMENTS_WEBHOOK_SECRET: z.string().startsWith('whsec_', 'must start with whsec_').default('whsec_spoolyard_development_only'),
    PAYMENTS_API_HOST: z.string().min(1).default('127.0.0.1'),
    PAYMENTS_API_PORT: z.coerce.number().int().min(1).max(65535).default(12111),
    PAYMENTS_API_PROTOCOL: z.enum(['http', 'https']).default('http'),
    MAIL_HOST: z.string().min(1).default('127.0.0.1'),
    MAIL_PORT: z.coerce.number().int().min(1).max(65535).default(12525),
    MAIL_FROM: z.string().min(3).default('Spoolyard Turbo Supply <orders@spoolyard.test>'),
    /** How often each app process's mail worker looks for due messages in the outbox, in milliseconds. */
    MAIL_OUTBOX_INTERVAL_MS: z.coerce.number().int().min(10).max(600_000).default(2000),
    /** Attempts before a message is given up on and shown as failed in the Office (retries back off 5 s, 10 s … 15 min). */
    MAIL_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(100).default(12),
    /** The mail fake's message API, for the development inbox. */
    MAIL_INBOX_URL: z.url().default('http://127.0.0.1:12580'),
    /**
     * Carriers' tracking pages as JSON, {"Carrier name": "https://…{tracking}…"}, laid over the defaults in
     * shared/carriers.ts; a carrier with no pattern shows its number without a link.
     */
    CARRIER_TRACKING_URLS: z
      .string()
      .transform((text, ctx) => {
        try {
          return JSON.parse(text) as unknown;
        } catch {
          ctx.addIssue({ code: 'custom', message: 'must be JSON: {"Carrier name": "https://…{tracking}…"}' });
          return z.NEVER;
        }
      })
      .pipe(TrackingUrlPatternsSchema)
      .optional(),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV !== 'production') return;
    if (env.SEED_DEMO === 'true') {
      ctx.addIssue({ code: 'custom', path: ['SEED_DEMO'], message: 'demo accounts and data are a development tool: a production start refuses them' });
    }
    // Production refuses the fakes' settings, so a misconfigured deploy cannot take test payments.
    if (env.PAYMENTS_MODE !== 'live') ctx.addIssue({ code: 'custom', path: ['PAYMENTS_MODE'], message: 'must be "live" in production' });
    if (!env.PAYMENTS_SECRET_KEY.startsWith('sk_live_')) ctx.addIssue({ code: 'custom', path: ['PAYMENTS_SECRET_KEY'], message: 'must be a live key in production' });
    if (env.PAYMENTS_API_HOST === '127.0.0.1' || env.PAYMENTS_API_HOST === 'localhost' || env.PAYMENTS_API_PROTOCOL !== 'https') {
      ctx.addIssue({ code: 'custom', path: ['PAYMENTS_API_HOST'], message: 'must be the real payment service over https in production' });
    }
    if (env.AUTH_SECRET === DEV_AUTH_SECRET) ctx.addIssue({ code: 'custom', path: ['AUTH_SECRET'], message: 'must be set in production' });
    if (!env.PUBLIC_URL?.startsWith('https://')) ctx.addIssue({ code: 'custom', path: ['PUBLIC_URL'], message: 'must be an https address in production' });
  })
  .transform((env) => ({ ...env, SEED_DEMO: env.SEED_DEMO === undefined ? env.NODE_ENV !== 'production' : env.SEED_DEMO === 'true' }));

export type Env = z.infer<typeof EnvSchema>;

/** Parses the environment once at boot; a malformed variable stops start-up with a message that names it. */
export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const result = EnvSchema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  return result.data;
}

export function publicUrl(env: Env): string {
  return env.PUBLIC_URL ?? `http://localhost:${env.PORT}`;
}
