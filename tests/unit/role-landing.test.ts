import { describe, expect, it } from 'vitest';
import { landingPath } from '../../src/features/auth/next-path';
import { ROLE_HOME } from '../../src/features/auth/roles';

describe('where sign-in lands', () => {
  it('sends each role to its workspace when no page was asked for', () => {
    expect(landingPath(null, ROLE_HOME.warehouse)).toBe('/floor');
    expect(landingPath(null, ROLE_HOME.admin)).toBe('/office');
    expect(landingPath(null, ROLE_HOME.dealer)).toBe('/');
    expect(landingPath(null, ROLE_HOME.customer)).toBe('/');
    // The shop home as `next` is what the header's link sends from the home page: no page in particular.
    expect(landingPath('/', ROLE_HOME.warehouse)).toBe('/floor');
  });

  it('keeps an explicit return-to path on this site, whatever the role', () => {
    expect(landingPath('/floor/goods-in', ROLE_HOME.warehouse)).toBe('/floor/goods-in');
    expect(landingPath('/office/mail?state=failed', ROLE_HOME.admin)).toBe('/office/mail?state=failed');
    expect(landingPath('/checkout', ROLE_HOME.admin)).toBe('/checkout');
  });

  it('never follows a return-to path off the site or back to a sign-in page', () => {
    expect(landingPath('//elsewhere.test/x', ROLE_HOME.admin)).toBe('/office');
    expect(landingPath('https://elsewhere.test/', ROLE_HOME.warehouse)).toBe('/floor');
    expect(landingPath('/sign-in?next=/x', ROLE_HOME.warehouse)).toBe('/floor');
  });
});
