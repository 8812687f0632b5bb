import { calendarDate, oneLine } from './format';
import { heading, html, paragraph, renderLayout, renderTextLayout } from './layout';
import type { RenderedMail } from './types';

export interface DealerApplicationReceivedData {
  contactName: string;
  companyName: string;
  submittedAt: Date;
}

export function renderDealerApplicationReceived(data: DealerApplicationReceivedData): RenderedMail {
  const subject = oneLine(`We have your dealer application for ${data.companyName}`);
  const got = `Thank you for applying for a dealer account for ${data.companyName} on ${calendarDate(data.submittedAt)}.`;
  const next =
    'Our trade desk checks every application by hand. You will get another e-mail with the decision, and if it is approved, your trade tier, credit limit and payment terms.';
  const meanwhile = 'Until then you can keep shopping at retail prices with the same sign-in.';

  const body = html`${heading('Application received')}
${paragraph(`Hello ${data.contactName},`)}
${paragraph(got)}
${paragraph(next)}
${paragraph(meanwhile)}`;
  return {
    subject,
    text: renderTextLayout([`Hello ${data.contactName},`, '', got, '', next, '', meanwhile]),
    html: renderLayout({ title: subject, preheader: 'We will e-mail you with the decision.', body }),
  };
}
