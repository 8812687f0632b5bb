import { test as base, expect } from '@playwright/test';
import { expectNoSeriousA11yViolations, type AxeOptions } from './support/axe';

/** The people who use the storefront (see PRODUCT.md). */
export type Role = 'retail' | 'dealer' | 'warehouse' | 'admin';

interface Fixtures {
  /** Signs the page in as a user with this role. */
  login: (role: Role) => Promise<void>;
  /** Fails the test on serious or critical accessibility violations on the current page. */
  axe: (options?: AxeOptions) => Promise<void>;
}

// The fixture callback is named `provide`, not Playwright's usual `use`, so the React hooks lint rule leaves it alone.
export const test = base.extend<Fixtures>({
  login: async ({ page: _page }, provide) => {
    await provide(async (role) => {
      // Accounts arrive with authentication; until then a journey that needs one fails loudly.
      throw new Error(`login(${role}): not yet — there is no sign-in until authentication exists`);
    });
  },
  axe: async ({ page }, provide) => {
    await provide((options) => expectNoSeriousA11yViolations(page, options));
  },
});

export { expect };
