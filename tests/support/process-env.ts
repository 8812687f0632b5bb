import path from 'node:path';
import { TEST_WEBHOOK_SECRET } from './app-deps';
import type { TestApp } from './test-app';

/**
 * The environment for a real server process beside a test app: the same database file, and the test app's payment and
 * mail fakes when it runs them; `extra` adds or overrides settings.
 */
export function envBesideTestApp(t: TestApp, extra: Record<string, string> = {}): Record<string, string> {
  return {
    NODE_ENV: 'test',
    HOST: '127.0.0.1',
    DATABASE_FILE: path.join(t.dir, 'test.db'),
    UPLOADS_DIR: path.join(t.dir, 'uploads'),
    SEED_DEMO: 'false',
    ...(t.payments ? { PAYMENTS_API_PORT: String(t.payments.port), PAYMENTS_WEBHOOK_SECRET: TEST_WEBHOOK_SECRET } : {}),
    ...(t.mail ? { MAIL_PORT: String(t.mail.smtpPort), MAIL_INBOX_URL: t.mail.httpUrl } : {}),
    ...extra,
  };
}
