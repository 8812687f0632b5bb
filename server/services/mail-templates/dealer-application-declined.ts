import { oneLine } from './format';
import { heading, html, paragraph, renderLayout, renderTextLayout } from './layout';
import type { RenderedMail } from './types';

export interface DealerApplicationDeclinedData {
  contactName: string;
  companyName: string;
  /** Written by the reviewing administrator; shown as given. */
  reason: string;
}

export function renderDealerApplicationDeclined(data: DealerApplicationDeclinedData): RenderedMail {
  const subject = oneLine(`Your dealer application for ${data.companyName}`);
  const decision = `Thank you for applying for a dealer account for ${data.companyName}. We are not able to open one at this time.`;
  const after =
    'Your sign-in still works and you can keep ordering at retail prices. If something has changed, reply to this message or apply again.';

  const body = html`${heading('About your dealer application')}
${paragraph(`Hello ${data.contactName},`)}
${paragraph(decision)}
${paragraph(html`<strong>Reason:</strong> ${data.reason}`)}
${paragraph(after)}`;
  return {
    subject,
    text: renderTextLayout([`Hello ${data.contactName},`, '', decision, '', `Reason: ${data.reason}`, '', after]),
    html: renderLayout({ title: subject, preheader: 'The decision on your dealer application.', body }),
  };
}
