import { oneLine, webUrl } from './format';
import { button, caution, heading, html, keyValueTable, link, paragraph, renderLayout, renderTextLayout, type KeyValueRow } from './layout';
import { textKeyValues } from './text-blocks';
import type { RenderedMail } from './types';

/** One message about a service request on the Bench: booked, quote ready, decision recorded, shipped back. */
export interface ServiceUpdateData {
  customerName: string;
  reference: string;
  serial: string;
  subjectTail: string;
  headline: string;
  lines: string[];
  rows?: KeyValueRow[] | undefined;
  /** A caution block (packing a unit, fitting a rebuilt one). */
  caution?: { title: string; text: string } | undefined;
  trackingUrl?: string | undefined;
  requestUrl: string;
  action: string;
}

export function renderServiceUpdate(data: ServiceUpdateData): RenderedMail {
  const requestUrl = webUrl(data.requestUrl);
  const trackingUrl = data.trackingUrl ? webUrl(data.trackingUrl) : undefined;
  const subject = oneLine(`Service ${data.reference} (unit ${data.serial}): ${data.subjectTail}`);
  const rows = data.rows ?? [];
  const text = [`Hello ${data.customerName},`, '', ...data.lines];
  if (rows.length > 0) text.push('', ...textKeyValues(rows));
  if (trackingUrl) text.push('', `Track it: ${trackingUrl}`);
  if (data.caution) text.push('', `${data.caution.title.toUpperCase()}: ${data.caution.text}`);
  text.push('', `${data.action}: ${requestUrl}`);
  const body = html`${heading(data.headline)}
${paragraph(`Hello ${data.customerName},`)}
${data.lines.map((l) => paragraph(l))}
${rows.length > 0 ? keyValueTable(rows) : ''}
${trackingUrl ? paragraph(link(trackingUrl, 'Track the parcel')) : ''}
${data.caution ? caution(data.caution.title, data.caution.text) : ''}
${button(requestUrl, data.action)}`;
  return { subject, text: renderTextLayout(text), html: renderLayout({ title: subject, preheader: data.lines[0] ?? data.headline, body }) };
}
