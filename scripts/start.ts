import { startMailFake } from '../fakes/mail/mail-fake';
import { startPaymentsFake } from '../fakes/payments/payments-fake';
import { parseEnv, publicUrl } from '../server/env';

// `npm start`: the local stand-ins for the hosted services first, then the app pointed at them by configuration.
let env;
try {
  env = parseEnv();
} catch (err) {
  console.error((err as Error).message);
  process.exit(1);
}
if (env.PAYMENTS_MODE === 'test') {
  const mailHttpPort = Number(new URL(env.MAIL_INBOX_URL).port);
  const [payments, mail] = await Promise.all([
    startPaymentsFake({
      port: env.PAYMENTS_API_PORT,
      host: '127.0.0.1',
      webhookUrl: `http://127.0.0.1:${env.PORT}/api/webhooks/payments`,
      webhookSecret: env.PAYMENTS_WEBHOOK_SECRET,
    }),
    startMailFake({ smtpPort: env.MAIL_PORT, httpPort: mailHttpPort, host: '127.0.0.1' }),
  ]);
  console.log(`Payments fake at ${payments.url}; mail catcher SMTP 127.0.0.1:${mail.smtpPort}, inbox at ${publicUrl(env)}/dev/inbox`);
}
// Demo data is written before the app opens the database; the server itself never seeds.
if (env.SEED_DEMO) {
  const { seedDemo } = await import('../catalog-seed/seed-demo');
  await seedDemo(env);
}
await import('../server/index');
