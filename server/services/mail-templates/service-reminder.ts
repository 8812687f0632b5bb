import { webUrl } from './format';
import { button, caution, heading, html, keyValueTable, paragraph, renderLayout, renderTextLayout } from './layout';
import { textKeyValues } from './text-blocks';
import type { RenderedMail } from './types';

export interface ServiceReminderData {
  name: string;
  serial: string;
  /** The part it is, e.g. "GIM-10-0201 Vanecraft Gimlet (GIM) turbocharger, journal bearing …". */
  what: string;
  bearingAndUse: string;
  intervalMonths: number;
  /** YYYY-MM-DD. */
  dueOn: string;
  lastService: string;
  bookUrl: string;
  unitUrl: string;
}

export function renderServiceReminder(data: ServiceReminderData): RenderedMail {
  const bookUrl = webUrl(data.bookUrl);
  const unitUrl = webUrl(data.unitUrl);
  const subject = `Service due for unit ${data.serial}`;
  const intro = `Your unit ${data.serial} is due for a service on ${data.dueOn}: for a ${data.bearingAndUse} unit we suggest one every ${data.intervalMonths} month${data.intervalMonths === 1 ? '' : 's'} (common practice; your use may call for more or less).`;
  const rows = [
    { label: 'Unit', value: data.serial },
    { label: 'Part', value: data.what },
    { label: 'Last service (or sale)', value: data.lastService },
    { label: 'Due', value: data.dueOn },
  ];
  const cautionText = 'Let the unit cool before you take it off, and prime the oil supply before the first start after a rebuild. Have the work done by a qualified workshop.';
  const body = html`${heading('Service due')}
${paragraph(`Hello ${data.name},`)}
${paragraph(intro)}
${keyValueTable(rows)}
${button(bookUrl, 'Book a service')}
${caution('Caution', cautionText)}
${paragraph(html`The unit's history: <a href="${unitUrl}">${unitUrl}</a>`)}`;
  return {
    subject,
    text: renderTextLayout([`Hello ${data.name},`, '', intro, '', ...textKeyValues(rows), '', `Book a service: ${bookUrl}`, '', `Caution: ${cautionText}`, '', `The unit's history: ${unitUrl}`]),
    html: renderLayout({ title: subject, preheader: intro, body }),
  };
}
