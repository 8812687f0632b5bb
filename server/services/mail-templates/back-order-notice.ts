import { calendarDate, oneLine, webUrl } from './format';
import { button, dataTable, heading, html, paragraph, partNumber, renderLayout, renderTextLayout, tag } from './layout';
import { indent, textHeading } from './text-blocks';
import type { RenderedMail } from './types';

export interface BackOrderLine {
  partNumber: string;
  title: string;
  orderedQuantity: number;
  backOrderedQuantity: number;
  /** When stock is due, if the supplier has said. */
  expectedDate?: Date | undefined;
}

export interface BackOrderNoticeData {
  orderNumber: string;
  customerName: string;
  /** `checkout`: chosen when ordering; `short-pick`: the shelf held fewer than the stock count said. */
  cause: 'checkout' | 'short-pick';
  lines: BackOrderLine[];
  orderUrl: string;
}

function when(line: BackOrderLine): string {
  return line.expectedDate ? `expected ${calendarDate(line.expectedDate)}` : 'awaiting stock';
}

export function renderBackOrderNotice(data: BackOrderNoticeData): RenderedMail {
  const orderUrl = webUrl(data.orderUrl);
  const units = data.lines.reduce((sum, l) => sum + l.backOrderedQuantity, 0);
  const subject = oneLine(`Order ${data.orderNumber}: ${units} item${units === 1 ? '' : 's'} on back-order`);
  const why =
    data.cause === 'short-pick'
      ? `While picking order ${data.orderNumber} we found fewer on the shelf than our stock count showed. We are sorry for the wait.`
      : `Some parts on order ${data.orderNumber} are not in stock yet, as agreed at checkout.`;
  const rest =
    'Everything else on the order goes out as normal. The parts below follow as soon as stock arrives, and we e-mail you when they ship. Freight for them is not charged again.';

  const text = [`Hello ${data.customerName},`, '', why, rest, ...textHeading('Waiting for stock')];
  for (const line of data.lines) {
    text.push(
      '',
      `${line.partNumber}  ${line.title}`,
      ...indent([`BACK-ORDER: ${line.backOrderedQuantity} of ${line.orderedQuantity} waiting, ${when(line)}`]),
    );
  }
  text.push('', `See your order: ${orderUrl}`);

  const table = dataTable(
    [
      { header: 'Part number' },
      { header: 'Description' },
      { header: 'Waiting', align: 'right' },
      { header: 'Ordered', align: 'right' },
      { header: 'When' },
    ],
    data.lines.map((line) => [
      partNumber(line.partNumber),
      html`${line.title}<br>${tag('Back-order')}`,
      line.backOrderedQuantity,
      line.orderedQuantity,
      when(line),
    ]),
  );
  const body = html`${heading(`Part of order ${data.orderNumber} is on back-order`)}
${paragraph(`Hello ${data.customerName},`)}
${paragraph(why)}
${paragraph(rest)}
${table}
${button(orderUrl, 'See your order')}`;

  return {
    subject,
    text: renderTextLayout(text),
    html: renderLayout({ title: subject, preheader: `${units} waiting for stock; the rest goes out as normal.`, body }),
  };
}
