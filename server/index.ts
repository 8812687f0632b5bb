import path from 'node:path';
import { demoAccountList } from '../catalog-seed/accounts';
import Stripe from 'stripe';
import { createApp } from './app';
import { openDatabase } from './db/client';
import { parseEnv, publicUrl } from './env';
import { createMailer } from './services/mailer';

let env;
try {
  env = parseEnv();
} catch (err) {
  console.error((err as Error).message);
  process.exit(1);
}
const db = openDatabase(env.DATABASE_FILE);
const payments = new Stripe(env.PAYMENTS_SECRET_KEY, {
  host: env.PAYMENTS_API_HOST,
  port: env.PAYMENTS_API_PORT,
  protocol: env.PAYMENTS_API_PROTOCOL,
  maxNetworkRetries: 1,
  telemetry: false,
});
const mailer = createMailer({ host: env.MAIL_HOST, port: env.MAIL_PORT, from: env.MAIL_FROM, ignoreTLS: env.NODE_ENV !== 'production' });
const devTools = env.NODE_ENV !== 'production';
const { app, orders } = createApp({
  db,
  payments,
  mailer,
  clientDir: path.resolve(import.meta.dirname, '../dist/client'),
  config: {
    publicUrl: publicUrl(env),
    authSecret: env.AUTH_SECRET,
    taxRatePct: env.TAX_RATE_PCT,
    signinLimitPerMinute: env.SIGNIN_LIMIT_PER_MINUTE,
    paymentsMode: env.PAYMENTS_MODE,
    publishableKey: env.PAYMENTS_PUBLISHABLE_KEY,
    webhookSecret: env.PAYMENTS_WEBHOOK_SECRET,
    paymentsApiUrl: `${env.PAYMENTS_API_PROTOCOL}://${env.PAYMENTS_API_HOST}:${env.PAYMENTS_API_PORT}`,
    mailInboxUrl: env.MAIL_INBOX_URL,
    devTools,
    uploadsDir: path.resolve(env.UPLOADS_DIR),
    demoAccounts: devTools ? demoAccountList() : undefined,
    trustedOrigins: [`http://127.0.0.1:${env.PORT}`, `http://localhost:${env.PORT}`, 'http://localhost:5173', 'http://127.0.0.1:5173'],
  },
});
const server = app.listen(env.PORT, env.HOST, () => {
  console.log(`Spoolyard is running at ${publicUrl(env)}/`);
  if (devTools) {
    console.log('Demo sign-in accounts (development only):');
    for (const a of demoAccountList()) console.log(`  ${a.role.padEnd(22)} ${a.email.padEnd(28)} ${a.password}`);
  }
});

// Unpaid card orders give their stock back after 30 minutes.
const sweep = setInterval(() => {
  orders.expireUnpaid(30).catch((err: unknown) => console.warn('unpaid-order sweep failed:', (err as Error).message));
}, 60_000);
sweep.unref();

function shutdown(signal: string) {
  console.log(`${signal}: shutting down`);
  server.close(() => {
    void mailer.close();
    db.$client.close();
    process.exit(0);
  });
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGINT', () => shutdown('SIGINT'));
process.on('SIGTERM', () => shutdown('SIGTERM'));
