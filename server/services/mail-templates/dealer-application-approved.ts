import { money, oneLine, percent, webUrl } from './format';
import { button, heading, html, keyValueTable, paragraph, renderLayout, renderTextLayout, type KeyValueRow } from './layout';
import { textKeyValues } from './text-blocks';
import type { RenderedMail } from './types';

export interface DealerApplicationApprovedData {
  contactName: string;
  companyName: string;
  /** The trade tier's name as staff see it, e.g. "Trade 2". */
  tier: string;
  discountPercent: number;
  creditLimitCents: number;
  /** As printed on invoices, e.g. "Net 30 days". */
  paymentTerms: string;
  signInUrl: string;
}

export function renderDealerApplicationApproved(data: DealerApplicationApprovedData): RenderedMail {
  const signInUrl = webUrl(data.signInUrl);
  const subject = oneLine(`Dealer account approved for ${data.companyName}`);
  const rows: KeyValueRow[] = [
    { label: 'Trade tier', value: data.tier },
    { label: 'Discount off list price', value: percent(data.discountPercent) },
    { label: 'Credit limit', value: money(data.creditLimitCents) },
    { label: 'Payment terms', value: data.paymentTerms },
  ];
  const intro = `Good news: ${data.companyName} now has a dealer account with us.`;
  const howTo =
    'Sign in to see trade prices. At checkout you can order on account with your purchase-order number, as long as your open balance plus the order stays within the credit limit.';

  const body = html`${heading('Your dealer account is approved')}
${paragraph(`Hello ${data.contactName},`)}
${paragraph(intro)}
${keyValueTable(rows)}
${paragraph(howTo)}
${button(signInUrl, 'Sign in')}`;
  return {
    subject,
    text: renderTextLayout([
      `Hello ${data.contactName},`,
      '',
      intro,
      '',
      ...textKeyValues(rows),
      '',
      howTo,
      `Sign in: ${signInUrl}`,
    ]),
    html: renderLayout({
      title: subject,
      preheader: `${data.tier}: ${percent(data.discountPercent)} off, credit limit ${money(data.creditLimitCents)}`,
      body,
    }),
  };
}
