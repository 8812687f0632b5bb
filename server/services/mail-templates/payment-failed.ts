import { money, oneLine, webUrl } from './format';
import { button, heading, html, paragraph, renderLayout, renderTextLayout } from './layout';
import type { RenderedMail } from './types';

export interface PaymentFailedData {
  orderNumber: string;
  customerName: string;
  amountCents: number;
  /** The card issuer's reason as the payment service reports it, e.g. "Your card was declined." */
  declineMessage: string;
  retryUrl: string;
}

export function renderPaymentFailed(data: PaymentFailedData): RenderedMail {
  const retryUrl = webUrl(data.retryUrl);
  const subject = oneLine(`Payment for order ${data.orderNumber} did not go through`);
  const what = `We tried to take ${money(data.amountCents)} for order ${data.orderNumber}, but the card payment was not accepted. No money has been taken.`;
  const next = 'Your order is saved. You can pay with the same card once the problem is sorted, or with another card.';

  const text = [
    `Hello ${data.customerName},`,
    '',
    what,
    '',
    `Reason given: ${data.declineMessage}`,
    '',
    next,
    `Pay for the order: ${retryUrl}`,
  ];
  const body = html`${heading('Your payment did not go through')}
${paragraph(`Hello ${data.customerName},`)}
${paragraph(what)}
${paragraph(html`<strong>Reason given:</strong> ${data.declineMessage}`)}
${paragraph(next)}
${button(retryUrl, 'Pay for the order')}`;

  return {
    subject,
    text: renderTextLayout(text),
    html: renderLayout({ title: subject, preheader: `Reason given: ${data.declineMessage}`, body }),
  };
}
