import { duration, webUrl } from './format';
import { button, heading, html, paragraph, renderLayout, renderTextLayout } from './layout';
import type { RenderedMail } from './types';

export interface AccountConfirmData {
  name: string;
  confirmUrl: string;
  expiresInMinutes: number;
}

/** The link that confirms a new account's address and signs its owner in. */
export function renderAccountConfirm(data: AccountConfirmData): RenderedMail {
  const confirmUrl = webUrl(data.confirmUrl);
  const subject = 'Confirm your Spoolyard account';
  const expiry = `The link works for ${duration(data.expiresInMinutes)}.`;
  const ignore = 'If you did not create an account, ignore this message: nothing happens until the link is used.';
  const intro = 'Thank you for creating a Spoolyard account. Confirm that this address is yours to start using it:';
  const body = html`${heading('Confirm your e-mail address')}
${paragraph(`Hello ${data.name},`)}
${paragraph(intro)}
${button(confirmUrl, 'Confirm my address')}
${paragraph(expiry)}
${paragraph(ignore)}
${paragraph(html`If the button does not work, copy this address into your browser:<br><span style="word-break:break-all;">${confirmUrl}</span>`)}`;
  return {
    subject,
    text: renderTextLayout([`Hello ${data.name},`, '', intro, confirmUrl, '', expiry, ignore]),
    html: renderLayout({ title: subject, preheader: expiry, body }),
  };
}

export interface ExistingAccountData {
  name: string;
  signInUrl: string;
  resetUrl: string;
}

/** Someone tried to create an account with an address that has one: the owner hears of it, the asker does not. */
export function renderExistingAccountNotice(data: ExistingAccountData): RenderedMail {
  const signInUrl = webUrl(data.signInUrl);
  const resetUrl = webUrl(data.resetUrl);
  const subject = 'You already have a Spoolyard account';
  const intro = 'Someone, hopefully you, tried to create a new Spoolyard account with this address. It already has one, so nothing was changed.';
  const next = 'To use it, sign in. If you have forgotten the password, ask for a reset link:';
  const ignore = 'If this was not you, ignore this message: your account and password stay as they are.';
  const body = html`${heading('You already have an account')}
${paragraph(`Hello ${data.name},`)}
${paragraph(intro)}
${paragraph(next)}
${button(signInUrl, 'Sign in')}
${paragraph(html`Forgotten password: <span style="word-break:break-all;">${resetUrl}</span>`)}
${paragraph(ignore)}`;
  return {
    subject,
    text: renderTextLayout([`Hello ${data.name},`, '', intro, next, signInUrl, `Forgotten password: ${resetUrl}`, '', ignore]),
    html: renderLayout({ title: subject, preheader: intro, body }),
  };
}
