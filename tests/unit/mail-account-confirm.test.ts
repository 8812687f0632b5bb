import { describe, expect, it } from 'vitest';
import { renderAccountConfirm, renderExistingAccountNotice } from '../../server/services/mail-templates/account-confirm';

describe('account confirmation mails', () => {
  it('carries the confirmation link and its lifetime, with the name escaped in HTML', () => {
    const mail = renderAccountConfirm({ name: '<b>Rae</b>', confirmUrl: 'http://127.0.0.1:3000/api/auth/verify-email?token=abc', expiresInMinutes: 24 * 60 });
    expect(mail.subject).toBe('Confirm your Spoolyard account');
    expect(mail.text).toContain('http://127.0.0.1:3000/api/auth/verify-email?token=abc');
    expect(mail.text).toMatch(/works for 1 day/);
    expect(mail.html).not.toContain('<b>Rae</b>');
    expect(mail.html).toContain('&lt;b&gt;Rae&lt;/b&gt;');
  });

  it('tells the owner of an existing account that nothing changed, and how to sign in or reset', () => {
    const mail = renderExistingAccountNotice({ name: 'Mina', signInUrl: 'http://127.0.0.1:3000/sign-in', resetUrl: 'http://127.0.0.1:3000/forgot-password' });
    expect(mail.subject).toBe('You already have a Spoolyard account');
    expect(mail.text).toContain('nothing was changed');
    expect(mail.text).toContain('http://127.0.0.1:3000/forgot-password');
    expect(mail.text).not.toMatch(/verify-email/);
  });
});
