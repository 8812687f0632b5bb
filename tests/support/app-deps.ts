import os from 'node:os';
import path from 'node:path';
import Stripe from 'stripe';
import type { AppConfig, AppDeps } from '../../server/app';
import type { Db } from '../../server/db/client';
import { createRecordingMailer } from '../../server/services/mailer';
import { PAYMENTS_TIMEOUT_MS } from '../../server/services/orders/order-payments';

export const TEST_WEBHOOK_SECRET = 'whsec_spoolyard_test_suite';
export const TEST_SECRET_KEY = 'sk_test_spoolyard_test_suite';

export function testConfig(overrides: Partial<AppConfig> = {}): AppConfig {
  return {
    publicUrl: 'http://127.0.0.1:3999',
    authSecret: 'spoolyard-test-secret-0123456789-abcdefghij',
    taxRatePct: 8,
    signinLimitPerMinute: 1000,
    orderPadLimitPerMinute: 1000,
    paymentsMode: 'test',
    publishableKey: 'pk_test_spoolyard_test_suite',
    webhookSecret: TEST_WEBHOOK_SECRET,
    paymentsApiUrl: 'http://127.0.0.1:9',
    mailInboxUrl: 'http://127.0.0.1:9',
    devTools: true,
    uploadsDir: path.join(os.tmpdir(), `spoolyard-uploads-${process.pid}`),
    ...overrides,
  };
}

export function paymentsClient(port: number): Stripe {
  // The same timeout and retry policy as server/index.ts.
  return new Stripe(TEST_SECRET_KEY, { host: '127.0.0.1', port, protocol: 'http', timeout: PAYMENTS_TIMEOUT_MS, maxNetworkRetries: 1, telemetry: false });
}

/** The app's dependencies with nothing running behind them: a payment client aimed at a closed port, mail recorded. */
export function offlineDeps(db: Db, overrides: Partial<AppDeps> = {}): AppDeps {
  return { db, payments: paymentsClient(9), mailer: createRecordingMailer(), config: testConfig(), log: (err) => console.error(err), ...overrides };
}
