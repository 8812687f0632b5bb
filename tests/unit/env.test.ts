import { describe, expect, it } from 'vitest';
import { parseEnv } from '../../server/env';

describe('environment', () => {
  it('starts with no variables at all, pointed at the local fakes', () => {
    const env = parseEnv({});
    expect(env).toMatchObject({ PORT: 3000, DATABASE_FILE: 'data/spoolyard.db', PAYMENTS_MODE: 'test', PAYMENTS_API_HOST: '127.0.0.1', MAIL_PORT: 12525 });
  });
  it('names a malformed variable', () => {
    expect(() => parseEnv({ PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => parseEnv({ PAYMENTS_SECRET_KEY: 'secret' })).toThrow(/PAYMENTS_SECRET_KEY/);
  });
  it('refuses the fakes’ settings in production', () => {
    expect(() => parseEnv({ NODE_ENV: 'production' })).toThrow(/PAYMENTS_MODE[\s\S]*PAYMENTS_SECRET_KEY[\s\S]*PAYMENTS_API_HOST[\s\S]*AUTH_SECRET[\s\S]*PUBLIC_URL/);
    const live = parseEnv({
      NODE_ENV: 'production',
      PAYMENTS_MODE: 'live',
      PAYMENTS_SECRET_KEY: 'sk_live_configured_elsewhere',
      PAYMENTS_API_HOST: 'payments.example',
      PAYMENTS_API_PROTOCOL: 'https',
      PAYMENTS_API_PORT: '443',
      AUTH_SECRET: 'a-production-secret-that-is-long-enough-0001',
      PUBLIC_URL: 'https://shop.example',
    });
    expect(live.PAYMENTS_MODE).toBe('live');
  });
});
