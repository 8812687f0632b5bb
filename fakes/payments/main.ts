import { z } from 'zod';
import { startPaymentsFake } from './payments-fake';

// Defaults match the app's development settings so `npm start` works with no env at all.
const EnvSchema = z.object({
  PAYMENTS_FAKE_PORT: z.coerce.number().int().min(0).max(65535).default(12111),
  PAYMENTS_FAKE_HOST: z.string().min(1).default('127.0.0.1'),
  /** An empty value keeps events in the fake without posting them. */
  PAYMENTS_WEBHOOK_URL: z
    .union([z.literal(''), z.url()])
    .default('http://127.0.0.1:3000/api/webhooks/payments'),
  PAYMENTS_WEBHOOK_SECRET: z.string().startsWith('whsec_').default('whsec_spoolyard_development_only'),
  /** When set, only this key is accepted; otherwise any sk_test_ key is. */
  PAYMENTS_API_KEY: z.string().startsWith('sk_test_').optional(),
  /** Comma-separated delays between webhook attempts, e.g. "1000,5000,20000". */
  PAYMENTS_WEBHOOK_RETRY_DELAYS_MS: z
    .string()
    .regex(/^\d+(,\d+)*$/, 'comma-separated whole milliseconds')
    .transform((s) => s.split(',').map(Number))
    .optional(),
  /** Whole milliseconds between a payment and its webhook's first post. */
  PAYMENTS_WEBHOOK_DELAY_MS: z.coerce.number().int().min(0).optional(),
});

const parsed = EnvSchema.safeParse(process.env);
if (!parsed.success) {
  const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
  console.error(`payments fake: invalid environment\n${lines.join('\n')}`);
  process.exit(1);
}
const env = parsed.data;

const fake = await startPaymentsFake({
  port: env.PAYMENTS_FAKE_PORT,
  host: env.PAYMENTS_FAKE_HOST,
  webhookUrl: env.PAYMENTS_WEBHOOK_URL || null,
  webhookSecret: env.PAYMENTS_WEBHOOK_SECRET,
  apiKey: env.PAYMENTS_API_KEY,
  retryDelaysMs: env.PAYMENTS_WEBHOOK_RETRY_DELAYS_MS,
  webhookDelayMs: env.PAYMENTS_WEBHOOK_DELAY_MS,
});
console.log(`payments fake listening on ${fake.url}; webhooks -> ${env.PAYMENTS_WEBHOOK_URL || '(not posted)'}`);

let stopping = false;
const stop = () => {
  if (stopping) return;
  stopping = true;
  void fake.close().then(() => process.exit(0));
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
