import cluster from 'node:cluster';
import { randomUUID } from 'node:crypto';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { demoAccountList } from '../catalog-seed/accounts';
import Stripe from 'stripe';
import { createApp } from './app';
import { pruneChangeLog } from './db/change-feed';
import { keepCheckpointing } from './db/checkpoints';
import { openDatabase } from './db/client';
import { pruneRateLimits, runIfLeaseHeld } from './db/shared-state';
import { parseEnv, publicUrl, type Env } from './env';
import { PROJECT_ROOT } from './paths';
import { createMailer } from './services/mailer';
import { PAYMENTS_TIMEOUT_MS } from './services/orders/order-payments';

let env: Env;
try {
  env = parseEnv();
} catch (err) {
  console.error((err as Error).message);
  process.exit(1);
}

if (env.APP_PROCESSES > 1 && cluster.isPrimary) {
  runPrimary(env);
} else {
  runApp(env);
}

/**
 * Several processes on one port (Node's cluster module shares the listening socket). The primary migrates the
 * database first, so the workers start on a ready file (each builds its own search index in memory); it restarts a worker
 * that dies and stops them all on a signal.
 */
function runPrimary(env: Env) {
  // The primary serves no requests: it keeps a connection to copy the write-ahead log back into the file.
  const db = openDatabase(env.DATABASE_FILE);
  const stopCheckpoints = keepCheckpointing(db.$client);
  cluster.setupPrimary({ exec: fileURLToPath(import.meta.url) });
  let stopping = false;
  for (let i = 0; i < env.APP_PROCESSES; i += 1) cluster.fork();
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) return;
    console.warn(`app process ${worker.process.pid} ended (${signal ?? code}); starting another`);
    cluster.fork();
  });
  console.log(`${env.APP_PROCESSES} app processes share port ${env.PORT} and ${env.DATABASE_FILE}`);
  const stop = (signal: NodeJS.Signals) => {
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill(signal);
    setTimeout(() => process.exit(0), 6000).unref();
    cluster.on('exit', () => {
      if (Object.keys(cluster.workers ?? {}).length > 0) return;
      stopCheckpoints();
      db.$client.close();
      process.exit(0);
    });
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

function runApp(env: Env) {
  const db = openDatabase(env.DATABASE_FILE);
  const stopCheckpoints = cluster.isWorker ? () => {} : keepCheckpointing(db.$client);
  const payments = new Stripe(env.PAYMENTS_SECRET_KEY, {
    host: env.PAYMENTS_API_HOST,
    port: env.PAYMENTS_API_PORT,
    protocol: env.PAYMENTS_API_PROTOCOL,
    // An explicit bound on every call (the SDK's default is 80 s) and one retry on a network error, with the same
    // idempotency key; checkout keeps its own tighter deadline on top (order-payments.ts).
    timeout: PAYMENTS_TIMEOUT_MS,
    maxNetworkRetries: 1,
    telemetry: false,
  });
  const mailer = createMailer({ host: env.MAIL_HOST, port: env.MAIL_PORT, from: env.MAIL_FROM, ignoreTLS: env.NODE_ENV !== 'production' });
  const devTools = env.NODE_ENV !== 'production';
  const { app, orders, mailOutbox, reminders } = createApp({
    db,
    payments,
    mailer,
    mailPolicy: { maxAttempts: env.MAIL_MAX_ATTEMPTS },
    clientDir: path.join(PROJECT_ROOT, 'dist/client'),
    config: {
      publicUrl: publicUrl(env),
      authSecret: env.AUTH_SECRET,
      taxRatePct: env.TAX_RATE_PCT,
      signinLimitPerMinute: env.SIGNIN_LIMIT_PER_MINUTE,
      orderPadLimitPerMinute: env.ORDER_PAD_LIMIT_PER_MINUTE,
      paymentsMode: env.PAYMENTS_MODE,
      publishableKey: env.PAYMENTS_PUBLISHABLE_KEY,
      webhookSecret: env.PAYMENTS_WEBHOOK_SECRET,
      paymentsApiUrl: `${env.PAYMENTS_API_PROTOCOL}://${env.PAYMENTS_API_HOST}:${env.PAYMENTS_API_PORT}`,
      mailInboxUrl: env.MAIL_INBOX_URL,
      devTools,
      uploadsDir: path.resolve(env.UPLOADS_DIR),
      demoAccounts: devTools ? demoAccountList() : undefined,
      trackingUrls: env.CARRIER_TRACKING_URLS,
      serviceRates: { labourRateCents: env.SERVICE_LABOUR_RATE_CENTS, inspectionFeeCents: env.SERVICE_INSPECTION_FEE_CENTS },
      trustedOrigins: [`http://127.0.0.1:${env.PORT}`, `http://localhost:${env.PORT}`, 'http://localhost:5173', 'http://127.0.0.1:5173'],
    },
  });
  // With several processes, the first one speaks for all.
  const speaks = !cluster.isWorker || cluster.worker?.id === 1;
  const server = app.listen(env.PORT, env.HOST, () => {
    if (!speaks) return;
    console.log(`Spoolyard is running at ${publicUrl(env)}/`);
    if (devTools) {
      console.log('Demo sign-in accounts (development only):');
      for (const a of demoAccountList()) console.log(`  ${a.role.padEnd(22)} ${a.email.padEnd(28)} ${a.password}`);
    }
  });

  // Housekeeping runs in exactly one process at a time, the one holding its lease: unpaid card orders give their stock
  // back after 30 minutes, open card payments are reconciled with the provider, units due for service are reminded, ended rate-limit windows and old
  // entries of the change log are dropped.
  const holder = `${process.pid}-${randomUUID().slice(0, 8)}`;
  const everyMs = env.HOUSEKEEPING_SECONDS * 1000;
  const sweep = setInterval(() => {
    runIfLeaseHeld(db, 'housekeeping', holder, everyMs * 2.5, async () => {
      const expired = await orders.expireUnpaid(30);
      if (expired > 0) console.log(`housekeeping: ${expired} unpaid order${expired === 1 ? '' : 's'} expired`);
      // Open card orders are compared with the provider: paid, failed or refunded payments the webhook missed.
      const drift = await orders.reconcilePayments();
      if (drift.paid + drift.cancelled + drift.refunded > 0) console.log(`housekeeping: payments reconciled ${JSON.stringify(drift)}`);
      // Units due for service get one reminder each (mail, history line, notice), never twice for one due date.
      const reminded = reminders.sendDue();
      if (reminded > 0) console.log(`housekeeping: ${reminded} service reminder${reminded === 1 ? '' : 's'} sent`);
      pruneRateLimits(db);
      pruneChangeLog(db);
    }).catch((err: unknown) => console.warn('housekeeping failed:', (err as Error).message));
  }, everyMs);
  sweep.unref();

  // Every process runs the mail worker; each claims its messages in one UPDATE, so a message goes from one process only.
  mailOutbox.start(env.MAIL_OUTBOX_INTERVAL_MS);

  function shutdown(signal: string) {
    console.log(`${signal}: shutting down`);
    server.close(() => {
      // A send in progress finishes and is marked before the database closes; what is still queued waits for the next start.
      void mailOutbox
        .stop()
        .then(() => mailer.close())
        .finally(() => {
          stopCheckpoints();
          db.$client.close();
          process.exit(0);
        });
    });
    setTimeout(() => process.exit(0), 5000).unref();
  }
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}
