import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { throughConfirmPage } from '../../server/services/auth';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ fakes: true });
});
afterAll(async () => {
  await t.close();
});

const linkIn = (text: string | null) => /https?:\/\/\S+\/api\/auth\/verify-email\?\S+/.exec(text ?? '')?.[0];
const local = (link: string) => link.replace(/^https?:\/\/[^/]+/, t.url);

describe('the mailed confirmation link', () => {
  it('comes back through the confirmation page, carrying the page the buyer was headed for', () => {
    const link = new URL(throughConfirmPage('http://shop.test/api/auth/verify-email?token=abc&callbackURL=%2Fcheckout'));
    expect(link.searchParams.get('token')).toBe('abc');
    expect(link.searchParams.get('callbackURL')).toBe('/email-confirmed?next=%2Fcheckout');
    // No way back, or one off the site, becomes the shop home.
    expect(new URL(throughConfirmPage('http://shop.test/api/auth/verify-email?token=abc')).searchParams.get('callbackURL')).toBe('/email-confirmed?next=%2F');
    expect(new URL(throughConfirmPage('http://shop.test/api/auth/verify-email?token=abc&callbackURL=%2F%2Fevil.test')).searchParams.get('callbackURL')).toBe(
      '/email-confirmed?next=%2F',
    );
  });

  it('signs the new buyer in on the confirmation page; a broken link lands there with a reason, and a new link can be asked for', async () => {
    const email = `confirm-${Date.now()}@retail.test`;
    const signUp = await t.send('POST', '/api/auth/sign-up/email', { name: 'Dale Ormsby', email, password: 'dale-ormsby-garage-1', callbackURL: '/checkout' }, { origin: t.url });
    expect(signUp.status).toBe(200);
    const first = await t.mail!.waitForMessage((m) => m.to.includes(email) && /confirm your/i.test(m.subject));
    const link = linkIn(first.text);
    if (!link) throw new Error('no confirmation link');

    // A link cut short (a mail program broke it) answers with the page that explains it, not a bare code.
    const broken = await fetch(local(link.replace(/token=[^&]+/, (m) => m.slice(0, -12))), { redirect: 'manual' });
    expect(broken.status).toBe(302);
    expect(broken.headers.get('location')).toBe('/email-confirmed?next=%2Fcheckout&error=INVALID_TOKEN');

    // The page offers a new link: asking sends one, through the same page.
    const again = await t.send('POST', '/api/auth/send-verification-email', { email, callbackURL: '/checkout' }, { origin: t.url });
    expect(again.status).toBe(200);
    const second = await t.mail!.waitForMessage((m) => m.to.includes(email) && /confirm your/i.test(m.subject) && m.id !== first.id);
    const fresh = linkIn(second.text);
    if (!fresh) throw new Error('no second confirmation link');
    const confirmed = await fetch(local(fresh), { redirect: 'manual' });
    expect(confirmed.status).toBe(302);
    expect(confirmed.headers.get('location')).toBe('/email-confirmed?next=%2Fcheckout');
    expect(confirmed.headers.getSetCookie().some((c) => c.includes('session_token'))).toBe(true);
  });
});
