import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DealerAccountsSchema, MeSchema } from '../../shared/schemas/accounts';
import type { StoredMessage } from '../../fakes/mail/mail-fake';
import { createAccount, createCustomer, createDealer, createUser } from '../support/factories';
import { signUpAndConfirm } from '../support/session';
import { startTestApp, type Reply, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp({ fakes: true });
});
afterAll(async () => {
  await t.close();
});

/** The cookies a response sets, as one Cookie header. */
function cookiesOf(reply: Reply): string {
  return reply.headers
    .getSetCookie()
    .map((c) => c.split(';')[0]!)
    .join('; ');
}

async function signIn(app: TestApp, email: string, password: string): Promise<Reply & { cookie: string }> {
  const reply = await app.send('POST', '/api/auth/sign-in/email', { email, password }, { origin: app.url });
  return { ...reply, cookie: cookiesOf(reply) };
}

async function me(cookie: string) {
  const reply = await t.get('/api/account/me', { headers: { cookie } });
  expect(reply.status).toBe(200);
  return MeSchema.parse(reply.body);
}

const mailTo = (address: string, subject: RegExp) => (m: StoredMessage) => m.to.includes(address) && subject.test(m.subject);

const application = {
  companyName: 'Harrowgate Diesel Care',
  contactName: 'Pat Quillon',
  phone: '+10 555 0142',
  taxNumber: 'TX-0042-17',
  addressLine1: '9 Anvil Yard',
  city: 'Brackenford',
  postcode: 'BF2 7RW',
  deliveryZone: 'national',
};

describe('sign-up and sign-in', () => {
  it('self sign-up makes a customer, signed in once the mailed link confirms the address', async () => {
    const cookie = await signUpAndConfirm(t, { name: 'Lee Marrowby', email: 'lee@example.test', password: 'a-long-enough-password' });
    const row = t.db.$client.prepare('SELECT role, email_verified AS verified FROM user WHERE email = ?').get('lee@example.test') as { role: string; verified: number };
    expect(row).toEqual({ role: 'customer', verified: 1 });
    const who = await me(cookie);
    expect(who.user).toMatchObject({ email: 'lee@example.test', name: 'Lee Marrowby', role: 'customer', dealer: null });
  });

  it('sets the session cookie HttpOnly and SameSite=Lax', async () => {
    const buyer = await createAccount(t);
    const reply = await signIn(t, buyer.email, buyer.password);
    expect(reply.status).toBe(200);
    const session = reply.headers.getSetCookie().find((c) => c.startsWith('better-auth.session_token='));
    expect(session).toBeDefined();
    const attributes = session!.split(';').map((a) => a.trim().toLowerCase());
    expect(attributes).toContain('httponly');
    expect(attributes).toContain('samesite=lax');
    expect(attributes).toContain('path=/');
  });

  it('refuses a wrong password with 401 and sets no session', async () => {
    const buyer = await createAccount(t);
    const reply = await signIn(t, buyer.email, 'not-the-password');
    expect(reply.status).toBe(401);
    expect(reply.cookie).not.toContain('better-auth.session_token=');
  });

  it('rate-limits sign-in: 429 once the per-minute limit is spent', async () => {
    const limited = await startTestApp({ config: { signinLimitPerMinute: 3 } });
    try {
      const buyer = await createAccount(limited);
      const statuses: number[] = [];
      for (let i = 0; i < 3; i++) statuses.push((await signIn(limited, buyer.email, 'wrong-password-guess')).status);
      expect(statuses).toEqual([401, 401, 401]);
      // Even the right password is held back until the window passes.
      const blocked = await signIn(limited, buyer.email, buyer.password);
      expect(blocked.status).toBe(429);
      expect(blocked.body).toMatchObject({ error: { message: expect.stringMatching(/too many sign-in attempts/i) } });
      expect(blocked.cookie).not.toContain('better-auth.session_token=');
    } finally {
      await limited.close();
    }
  });
});

describe('cross-site requests', () => {
  it('refuses a POST from another site even with a valid session cookie', async () => {
    const cookie = (await createCustomer(t)).client.cookie();
    const evil = { origin: 'https://evil.example', cookie };
    const cart = await t.send('POST', '/api/cart/lines', { partNumber: 'QQQ-00-0000', quantity: 1 }, evil);
    expect(cart.status).toBe(403);
    const before = t.db.$client.prepare('SELECT COUNT(*) AS n FROM dealer_accounts').get() as { n: number };
    const apply = await t.send('POST', '/api/account/dealer-applications', application, evil);
    expect(apply.status).toBe(403);
    const after = t.db.$client.prepare('SELECT COUNT(*) AS n FROM dealer_accounts').get() as { n: number };
    expect(after.n).toBe(before.n);
    // Browsers mark a cross-site fetch even when they leave Origin out.
    const marked = await t.send('POST', '/api/cart/lines', { partNumber: 'QQQ-00-0000', quantity: 1 }, { cookie, 'sec-fetch-site': 'cross-site' });
    expect(marked.status).toBe(403);
  });
});

describe('dealer application and approval', () => {
  it('applies, is pending, gets a receipt mail; the admin approves and the applicant becomes a dealer', async () => {
    // An account approved before this application, so "pending first" below is about order, not about id.
    await createDealer(t);
    const email = 'pat.quillon@example.test';
    const cookie = await signUpAndConfirm(t, { name: 'Pat Quillon', email, password: 'harrowgate-diesel-9' });

    const invalid = await t.send('POST', '/api/account/dealer-applications', { ...application, phone: 'call me' }, { origin: t.url, cookie });
    expect(invalid.status).toBe(400);
    expect(invalid.body).toMatchObject({ error: { fieldErrors: { phone: [expect.any(String)] } } });

    const applied = await t.send('POST', '/api/account/dealer-applications', application, { origin: t.url, cookie });
    expect(applied.status, JSON.stringify(applied.body)).toBe(201);
    expect(applied.body).toMatchObject({ status: 'pending' });
    const dealerId = (applied.body as { id: number }).id;

    const pending = await me(cookie);
    expect(pending.user).toMatchObject({ role: 'customer', dealer: { id: dealerId, companyName: application.companyName, status: 'pending', tier: null } });
    const again = await t.send('POST', '/api/account/dealer-applications', application, { origin: t.url, cookie });
    expect(again.status).toBe(409);

    const receipt = await t.mail!.waitForMessage(mailTo(email, /dealer application/i));
    expect(receipt.subject).toContain(application.companyName);
    expect(receipt.text).toContain('Pat Quillon');

    const admin = (await createUser(t, { role: 'admin' })).client.cookie();
    const list = await t.get('/api/admin/dealers', { headers: { cookie: admin } });
    expect(list.status).toBe(200);
    const { items } = DealerAccountsSchema.parse(list.body);
    const statuses = items.map((i) => i.status);
    expect(statuses).toContain('approved');
    // Pending applications come first.
    expect(statuses.slice(0, statuses.lastIndexOf('pending') + 1).every((s) => s === 'pending')).toBe(true);
    expect(items.find((i) => i.id === dealerId)).toMatchObject({ email, status: 'pending', city: 'Brackenford' });

    const bad = await t.send('POST', `/api/admin/dealers/${dealerId}/decision`, { decision: 'approve', tier: 'partner', creditLimitCents: 750_000, paymentTermsDays: 10 }, { origin: t.url, cookie: admin });
    expect(bad.status).toBe(400);

    const decided = await t.send(
      'POST',
      `/api/admin/dealers/${dealerId}/decision`,
      { decision: 'approve', tier: 'partner', creditLimitCents: 750_000, paymentTermsDays: 45 },
      { origin: t.url, cookie: admin },
    );
    expect(decided.status, JSON.stringify(decided.body)).toBe(200);
    expect(decided.body).toEqual({ id: dealerId, status: 'approved' });

    const approved = await me(cookie);
    expect(approved.user).toMatchObject({
      role: 'dealer',
      dealer: { id: dealerId, status: 'approved', tier: 'partner', creditLimitCents: 750_000, paymentTermsDays: 45, openBalanceCents: 0 },
    });
    const mail = await t.mail!.waitForMessage(mailTo(email, /approved/i));
    expect(mail.subject).toContain(application.companyName);
    // Partner tier is 20 % off in shared/pricing.ts; the mail shows the limit in dollars.
    expect(mail.text).toMatch(/20\s?%/);
    expect(mail.text).toContain('7,500.00');
    expect(mail.text).toMatch(/45 days/);
  });

  it('declines with a reason and mails it', async () => {
    const email = 'dana.crewe@example.test';
    const cookie = await signUpAndConfirm(t, { name: 'Dana Crewe', email, password: 'crewe-garage-2024' });
    const applied = await t.send('POST', '/api/account/dealer-applications', { ...application, companyName: 'Crewe Garage' }, { origin: t.url, cookie });
    const dealerId = (applied.body as { id: number }).id;
    const admin = (await createUser(t, { role: 'admin' })).client.cookie();
    const decided = await t.send('POST', `/api/admin/dealers/${dealerId}/decision`, { decision: 'decline', reason: 'We could not confirm the trading address.' }, { origin: t.url, cookie: admin });
    expect(decided.body).toEqual({ id: dealerId, status: 'declined' });
    expect((await me(cookie)).user).toMatchObject({ role: 'customer', dealer: { status: 'declined' } });
    const mail = await t.mail!.waitForMessage(mailTo(email, /^your dealer application/i));
    expect(mail.text).toContain('We could not confirm the trading address.');
  });

  it('keeps the dealer list to admins: 401 signed out, 403 for other roles', async () => {
    expect((await t.get('/api/admin/dealers')).status).toBe(401);
    const others = await Promise.all([createCustomer(t), createDealer(t), createUser(t, { role: 'warehouse' })]);
    for (const { email, client } of others) {
      const cookie = client.cookie();
      expect((await t.get('/api/admin/dealers', { headers: { cookie } })).status, email).toBe(403);
      const decision = await t.send('POST', '/api/admin/dealers/1/decision', { decision: 'decline', reason: 'not mine to decide' }, { origin: t.url, cookie });
      expect(decision.status, email).toBe(403);
    }
    expect((await t.send('POST', '/api/admin/dealers/1/decision', { decision: 'decline', reason: 'nobody' }, { origin: t.url })).status).toBe(401);
  });
});

describe('password reset by e-mailed link', () => {
  it('resets through the link in the mail; the new password works and the old one does not', async () => {
    const { email, password, client } = await createCustomer(t);
    const oldSession = client.cookie();
    t.mail!.clear();
    const requested = await t.send('POST', '/api/auth/request-password-reset', { email, redirectTo: '/reset-password' }, { origin: t.url });
    expect(requested.status, JSON.stringify(requested.body)).toBe(200);
    // An unknown address answers the same, so the form does not reveal who has an account.
    const unknown = await t.send('POST', '/api/auth/request-password-reset', { email: 'nobody@example.test', redirectTo: '/reset-password' }, { origin: t.url });
    expect(unknown.status).toBe(200);

    const mail = await t.mail!.waitForMessage(mailTo(email, /reset your spoolyard password/i));
    const link = /https?:\/\/\S+\/api\/auth\/reset-password\/\S+/.exec(mail.text ?? '')?.[0];
    expect(link, mail.text ?? '').toBeDefined();
    expect(new URL(link!).origin).toBe(t.url);
    expect(mail.html).toContain(link!.replace(/&/g, '&amp;'));

    const followed = await fetch(link!, { redirect: 'manual' });
    expect(followed.status).toBeGreaterThanOrEqual(300);
    expect(followed.status).toBeLessThan(400);
    const landing = new URL(followed.headers.get('location')!, t.url);
    expect(landing.pathname).toBe('/reset-password');
    const token = landing.searchParams.get('token');
    expect(token).toBeTruthy();

    const reset = await t.send('POST', '/api/auth/reset-password', { newPassword: 'a-brand-new-password-7', token }, { origin: t.url });
    expect(reset.status, JSON.stringify(reset.body)).toBe(200);
    // The link works once.
    const reused = await t.send('POST', '/api/auth/reset-password', { newPassword: 'yet-another-password-8', token }, { origin: t.url });
    expect(reused.status).toBe(400);

    expect((await signIn(t, email, 'a-brand-new-password-7')).status).toBe(200);
    expect((await signIn(t, email, password)).status).toBe(401);
    // Sessions made with the old password are ended by the reset.
    expect((await me(oldSession)).user).toBeNull();
  });

  it('sends a tampered link to the reset page with an error, not a token', async () => {
    const followed = await fetch(`${t.url}/api/auth/reset-password/not-a-real-token?callbackURL=/reset-password`, { redirect: 'manual' });
    const landing = new URL(followed.headers.get('location')!, t.url);
    expect(landing.pathname).toBe('/reset-password');
    expect(landing.searchParams.get('token')).toBeNull();
    expect(landing.searchParams.get('error')).toBeTruthy();
  });
});
