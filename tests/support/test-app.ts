import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Server } from 'node:http';
import { generateCatalogue, type GenerateOptions } from '../../catalog-seed/generate';
import { loadCatalogue } from '../../catalog-seed/load';
import { seedDemoAccounts } from '../../catalog-seed/accounts';
import { startMailFake, type MailFake } from '../../fakes/mail/mail-fake';
import { startPaymentsFake, type PaymentsFake } from '../../fakes/payments/payments-fake';
import { createApp, type AppConfig, type AppDeps } from '../../server/app';
import { openDatabase, type Db } from '../../server/db/client';
import { createMailer, createRecordingMailer } from '../../server/services/mailer';
import { offlineDeps, paymentsClient, testConfig, TEST_WEBHOOK_SECRET } from './app-deps';
import { freePort } from './server-process';

export interface Reply {
  status: number;
  body: unknown;
  headers: Headers;
}

export interface TestApp {
  db: Db;
  url: string;
  dir: string;
  app: ReturnType<typeof createApp>;
  payments: PaymentsFake | null;
  mail: MailFake | null;
  /**
   * Runs the mail outbox until nothing is due: resolves when every message queued so far has been handed to the mail
   * server (or has had its attempt fail and waits for a later one).
   */
  mailSettled: () => Promise<void>;
  get: (p: string, init?: RequestInit) => Promise<Reply>;
  send: (method: string, p: string, body?: unknown, headers?: Record<string, string>) => Promise<Reply>;
  close: () => Promise<void>;
}

/** A fresh, migrated SQLite file with the demo catalogue. */
export function createTestDb(options: GenerateOptions = {}): { db: Db; dir: string } {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-test-'));
  const db = openDatabase(path.join(dir, 'test.db'));
  loadCatalogue(db, generateCatalogue(options));
  return { db, dir };
}

/** How often the test app's mail worker looks for due messages. */
export const MAIL_WORKER_MS = 20;

export interface StartOptions {
  /** Run the payments and mail fakes as real local servers and point the app at them. */
  fakes?: boolean;
  /** Seed the demo accounts (one per role). */
  accounts?: boolean;
  config?: Partial<AppConfig>;
  deps?: Partial<AppDeps>;
  catalogue?: GenerateOptions;
}

export async function startTestApp(options: StartOptions = {}): Promise<TestApp> {
  const { db, dir } = createTestDb(options.catalogue);
  let payments: PaymentsFake | null = null;
  let mail: MailFake | null = null;
  if (options.fakes) {
    payments = await startPaymentsFake({ port: 0, host: '127.0.0.1', webhookUrl: null, webhookSecret: TEST_WEBHOOK_SECRET, retryDelaysMs: [50, 100, 200] });
    mail = await startMailFake({ smtpPort: 0, httpPort: 0, host: '127.0.0.1' });
  }
  const mailer = mail ? createMailer({ host: '127.0.0.1', port: mail.smtpPort, from: 'Spoolyard Turbo Supply <orders@spoolyard.test>' }) : createRecordingMailer();
  const base = offlineDeps(db);
  // The app is created before it listens, so its public URL is set to the port it will get below.
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const app = createApp({
    ...base,
    payments: payments ? paymentsClient(payments.port) : base.payments,
    mailer,
    // Fast retries, so an outage in a test lasts a moment rather than minutes.
    mailPolicy: { baseDelayMs: 50, maxDelayMs: 1_000 },
    config: testConfig({
      publicUrl: url,
      ...(payments ? { paymentsApiUrl: payments.url } : {}),
      ...(mail ? { mailInboxUrl: mail.httpUrl } : {}),
      // Under a dot-folder on purpose, as the end-to-end server's is.
      uploadsDir: path.join(dir, '.uploads'),
      ...options.config,
    }),
    ...options.deps,
  });
  if (options.accounts) await seedDemoAccounts(app.auth, db);
  // The worker runs as in the real server, only faster; tests that wait for a message in the fake's inbox rely on it.
  app.mailOutbox.start(MAIL_WORKER_MS);
  const listening: Server = await new Promise((resolve) => {
    const s = app.app.listen(port, '127.0.0.1', () => resolve(s));
  });
  // The test client (fetch) drops idle sockets after 4 s; the server's 5 s default can close one just as a slow,
  // loaded machine hands it a request (ECONNRESET). Keeping the server's side open longer leaves the closing to the client.
  listening.keepAliveTimeout = 65_000;
  payments?.setWebhookUrl(`${url}/api/webhooks/payments`);

  const read = async (res: Response): Promise<Reply> => {
    const text = await res.text();
    let body: unknown = text;
    try {
      body = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON */
    }
    return { status: res.status, body, headers: res.headers };
  };
  return {
    db,
    url,
    dir,
    app,
    payments,
    mail,
    mailSettled: async () => {
      await app.mailOutbox.drain();
    },
    get: async (p, init) => read(await fetch(`${url}${p}`, init)),
    send: async (method, p, body, headers = {}) =>
      read(await fetch(`${url}${p}`, { method, headers: { 'content-type': 'application/json', ...headers }, body: body === undefined ? undefined : JSON.stringify(body) })),
    close: async () => {
      await app.mailOutbox.stop();
      listening.closeAllConnections();
      await new Promise<void>((resolve) => listening.close(() => resolve()));
      await payments?.close();
      await mail?.close();
      if ('close' in mailer && typeof mailer.close === 'function') await mailer.close();
      db.$client.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
