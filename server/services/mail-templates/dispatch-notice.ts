import { fittingCautionHtml, fittingCautionText, needsFittingCaution } from './fitting-caution';
import { addressLines, calendarDate, oneLine, plural, webUrl } from './format';
import {
  addressBlock,
  button,
  dataTable,
  heading,
  html,
  keyValueTable,
  link,
  paragraph,
  partNumber,
  renderLayout,
  renderTextLayout,
  subheading,
  tag,
  type KeyValueRow,
} from './layout';
import { indent, textHeading, textKeyValues } from './text-blocks';
import type { MailAddress, MailPartRef, RenderedMail } from './types';

export interface DispatchLine extends MailPartRef {
  quantity: number;
}

export interface DispatchNoticeData {
  orderNumber: string;
  customerName: string;
  dispatchedAt: Date;
  carrier: string;
  trackingNumber: string;
  /** The carrier's tracking page, when known. */
  trackingUrl?: string | undefined;
  cartons: number;
  weightKg?: number | undefined;
  lines: DispatchLine[];
  /** Lines of the order that still wait for stock and are not in this shipment. */
  stillBackOrdered?: Array<{ partNumber: string; title: string; quantity: number }> | undefined;
  deliveryAddress: MailAddress;
  orderUrl: string;
}

export function renderDispatchNotice(data: DispatchNoticeData): RenderedMail {
  const orderUrl = webUrl(data.orderUrl);
  const trackingUrl = data.trackingUrl === undefined ? undefined : webUrl(data.trackingUrl);
  const waiting = data.stillBackOrdered ?? [];
  const subject = oneLine(`Order ${data.orderNumber} is on its way: ${data.carrier} ${data.trackingNumber}`);
  const intro = `Order ${data.orderNumber} left our warehouse on ${calendarDate(data.dispatchedAt)}.`;
  const rows: KeyValueRow[] = [
    { label: 'Carrier', value: data.carrier },
    { label: 'Tracking number', value: data.trackingNumber },
    { label: 'Cartons', value: String(data.cartons) },
  ];
  if (data.weightKg !== undefined) rows.push({ label: 'Weight', value: `${data.weightKg.toFixed(1)} kg` });
  const caution = needsFittingCaution(data.lines);

  const text = [`Hello ${data.customerName},`, '', intro, '', ...textKeyValues(rows)];
  if (trackingUrl) text.push(`Track it: ${trackingUrl}`);
  text.push(...textHeading('In this shipment'));
  for (const line of data.lines) text.push(`${line.partNumber}  ${line.title}`, ...indent([`Qty ${line.quantity}`]));
  if (waiting.length > 0) {
    text.push(...textHeading('Still on back-order'));
    for (const line of waiting) {
      text.push(`${line.partNumber}  ${line.title}`, ...indent([`BACK-ORDER: ${line.quantity} to follow when stock arrives`]));
    }
  }
  text.push(...textHeading('Deliver to'), ...addressLines(data.deliveryAddress));
  if (caution) text.push(...fittingCautionText());
  text.push('', `See your order: ${orderUrl}`);

  const shipped = dataTable(
    [{ header: 'Part number' }, { header: 'Description' }, { header: 'Qty', align: 'right' }],
    data.lines.map((line) => [partNumber(line.partNumber), line.title, line.quantity]),
  );
  const following =
    waiting.length === 0
      ? ''
      : html`${subheading('Still on back-order')}${dataTable(
          [{ header: 'Part number' }, { header: 'Description' }, { header: 'To follow', align: 'right' }],
          waiting.map((line) => [partNumber(line.partNumber), html`${line.title}<br>${tag('Back-order')}`, line.quantity]),
        )}`;
  const body = html`${heading('Your order is on its way')}
${paragraph(`Hello ${data.customerName},`)}
${paragraph(`${intro} It travels as ${plural(data.cartons, 'carton')}.`)}
${keyValueTable(rows)}
${trackingUrl ? paragraph(link(trackingUrl, `Track ${data.trackingNumber} with ${data.carrier}`)) : ''}
${subheading('In this shipment')}
${shipped}
${following}
${subheading('Deliver to')}
${addressBlock(addressLines(data.deliveryAddress))}
${caution ? fittingCautionHtml() : ''}
${button(orderUrl, 'See your order')}`;

  return {
    subject,
    text: renderTextLayout(text),
    html: renderLayout({ title: subject, preheader: `${data.carrier} tracking number ${data.trackingNumber}`, body }),
  };
}
