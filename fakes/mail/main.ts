import { z } from 'zod';
import { startMailFake } from './mail-fake';

const EnvSchema = z.object({
  MAIL_FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(12525),
  MAIL_FAKE_HTTP_PORT: z.coerce.number().int().min(0).max(65535).default(12580),
  MAIL_FAKE_HOST: z.string().min(1).default('127.0.0.1'),
});

const parsed = EnvSchema.safeParse(process.env);
if (!parsed.success) {
  const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
  console.error(`mail fake: invalid environment\n${lines.join('\n')}`);
  process.exit(1);
}
const env = parsed.data;

const fake = await startMailFake({
  smtpPort: env.MAIL_FAKE_SMTP_PORT,
  httpPort: env.MAIL_FAKE_HTTP_PORT,
  host: env.MAIL_FAKE_HOST,
});
console.log(`mail fake: SMTP on ${env.MAIL_FAKE_HOST}:${fake.smtpPort} (no TLS), messages at ${fake.httpUrl}/messages`);

let stopping = false;
const stop = () => {
  if (stopping) return;
  stopping = true;
  void fake.close().then(() => process.exit(0));
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
