import { duration, webUrl } from './format';
import { button, heading, html, paragraph, renderLayout, renderTextLayout } from './layout';
import type { RenderedMail } from './types';

export interface PasswordResetData {
  name: string;
  resetUrl: string;
  /** How long the link works, as configured for reset tokens. */
  expiresInMinutes: number;
}

export function renderPasswordReset(data: PasswordResetData): RenderedMail {
  const resetUrl = webUrl(data.resetUrl);
  const subject = 'Reset your Spoolyard password';
  const expiry = `The link works once, for ${duration(data.expiresInMinutes)}.`;
  const ignore = 'If you did not ask for this, ignore this message: your password stays as it is.';

  const body = html`${heading('Reset your password')}
${paragraph(`Hello ${data.name},`)}
${paragraph('Someone, hopefully you, asked to reset the password for your Spoolyard account. Choose a new one here:')}
${button(resetUrl, 'Choose a new password')}
${paragraph(expiry)}
${paragraph(ignore)}
${paragraph(html`If the button does not work, copy this address into your browser:<br><span style="word-break:break-all;">${resetUrl}</span>`)}`;
  return {
    subject,
    text: renderTextLayout([
      `Hello ${data.name},`,
      '',
      'Someone, hopefully you, asked to reset the password for your Spoolyard account. Choose a new one here:',
      resetUrl,
      '',
      expiry,
      ignore,
    ]),
    html: renderLayout({ title: subject, preheader: expiry, body }),
  };
}
