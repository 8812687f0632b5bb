import { test as base, expect } from '@playwright/test';
import { expectNoSeriousA11yViolations, type AxeOptions } from './support/axe';

/** The people who use the storefront (see PRODUCT.md). */
export type Role = 'retail' | 'dealer' | 'dealer2' | 'warehouse' | 'workshop' | 'admin' | 'dealerColleague';

/** The seeded demo accounts (catalog-seed/accounts.ts). */
export const DEMO_PASSWORD = 'spoolyard-demo-1';
export const DEMO_EMAILS: Record<Role, string> = {
  retail: 'retail@spoolyard.test',
  dealer: 'dealer@spoolyard.test',
  dealer2: 'dealer2@spoolyard.test',
  warehouse: 'warehouse@spoolyard.test',
  workshop: 'workshop@spoolyard.test',
  admin: 'admin@spoolyard.test',
  /** A second buyer of the first dealer's trade account. */
  dealerColleague: 'dealer-bench@spoolyard.test',
};

interface Fixtures {
  /** Signs the page in as a user with this role. */
  login: (role: Role) => Promise<void>;
  /** Fails the test on serious or critical accessibility violations on the current page. */
  axe: (options?: AxeOptions) => Promise<void>;
  /** Reads the development mail catcher for an address, as the administrator (the only role the server lets read it). */
  caughtMail: (to: string) => Promise<unknown>;
}

// The fixture callback is named `provide`, not Playwright's usual `use`, so the React hooks lint rule leaves it alone.
export const test = base.extend<Fixtures>({
  login: async ({ page, baseURL }, provide) => {
    await provide(async (role) => {
      // Signs in through the API; the session cookie lands in the page's browser context.
      const res = await page.request.post('/api/auth/sign-in/email', {
        data: { email: DEMO_EMAILS[role], password: DEMO_PASSWORD },
        headers: { origin: new URL(baseURL ?? 'http://127.0.0.1:3100').origin },
      });
      expect(res.ok(), `sign-in as ${role}`).toBe(true);
    });
  },
  axe: async ({ page }, provide) => {
    await provide((options) => expectNoSeriousA11yViolations(page, options));
  },
  caughtMail: async ({ playwright, baseURL }, provide) => {
    const base = baseURL ?? 'http://127.0.0.1:3100';
    // Its own request context, so the page stays signed in as whoever the test is.
    const admin = await playwright.request.newContext({ baseURL: base });
    const res = await admin.post('/api/auth/sign-in/email', { data: { email: DEMO_EMAILS.admin, password: DEMO_PASSWORD }, headers: { origin: new URL(base).origin } });
    expect(res.ok(), 'sign-in as admin to read caught mail').toBe(true);
    await provide(async (to) => (await admin.get(`/api/dev/mail?to=${encodeURIComponent(to)}`)).json());
    await admin.dispose();
  },
});

export { expect };
