import { money, oneLine, webUrl } from './format';
import { button, dataTable, heading, html, keyValueTable, paragraph, partNumber, renderLayout, renderTextLayout, tag } from './layout';
import { indent, textHeading, textKeyValues } from './text-blocks';
import type { RenderedMail } from './types';

export interface OrderChangedData {
  orderNumber: string;
  customerName: string;
  kind: 'change' | 'cancel';
  lines: Array<{ partNumber: string; title: string; before: number; after: number }>;
  beforeTotalCents: number;
  afterTotalCents: number;
  adjustmentCents: number;
  /** How the money follows: back to the card, an amended (or cancelled) invoice, or a card payment never taken. */
  settlement: 'card-refund' | 'amended-invoice' | 'payment-cancelled';
  purchaseOrder?: string | undefined;
  orderUrl: string;
}

function moneyWords(d: OrderChangedData): string {
  if (d.settlement === 'payment-cancelled') return 'The card payment was cancelled before it was taken: no money left your account.';
  if (d.settlement === 'card-refund') {
    return `We are refunding ${money(d.adjustmentCents)} to the card you paid with. Card providers usually show a refund within a few working days.`;
  }
  const po = d.purchaseOrder ? ` (your purchase order ${d.purchaseOrder})` : '';
  return d.kind === 'cancel'
    ? `The invoice for this order${po} is cancelled: you owe nothing for it.`
    : `The invoice for this order${po} is amended from ${money(d.beforeTotalCents)} to ${money(d.afterTotalCents)}; your account balance is ${money(d.adjustmentCents)} lower.`;
}

/** To the buyer, when they changed or cancelled an order before picking started. */
export function renderOrderChanged(d: OrderChangedData): RenderedMail {
  const orderUrl = webUrl(d.orderUrl);
  const cancelled = d.kind === 'cancel';
  const subject = oneLine(cancelled ? `Order ${d.orderNumber} is cancelled` : `Order ${d.orderNumber} is changed`);
  const lead = cancelled
    ? `As you asked, order ${d.orderNumber} is cancelled. Nothing will be sent.`
    : `As you asked, order ${d.orderNumber} is changed. The rest of the order goes out as normal.`;
  const moneyLine = moneyWords(d);
  const totals = [
    { label: 'Total before', value: money(d.beforeTotalCents) },
    { label: cancelled ? 'Total now' : 'New total', value: money(d.afterTotalCents) },
  ];

  const text = [`Hello ${d.customerName},`, '', lead, moneyLine, ...textHeading(cancelled ? 'Cancelled' : 'What changed')];
  for (const l of d.lines) text.push('', `${l.partNumber}  ${l.title}`, ...indent([l.after === 0 ? `TAKEN OFF: was ${l.before}` : `QUANTITY: ${l.before} → ${l.after}`]));
  text.push('', ...textKeyValues(totals, 'right'), '', `See your order: ${orderUrl}`);

  const table = dataTable(
    [{ header: 'Part number' }, { header: 'Description' }, { header: 'Was', align: 'right' }, { header: 'Now', align: 'right' }],
    d.lines.map((l) => [partNumber(l.partNumber), l.after === 0 ? html`${l.title}<br>${tag('Taken off')}` : l.title, l.before, l.after]),
  );
  const body = html`${heading(cancelled ? `Order ${d.orderNumber} is cancelled` : `Order ${d.orderNumber} is changed`)}
${paragraph(`Hello ${d.customerName},`)}
${paragraph(lead)}
${paragraph(moneyLine)}
${table}
${keyValueTable(totals)}
${button(orderUrl, 'See your order')}`;
  return { subject, text: renderTextLayout(text), html: renderLayout({ title: subject, preheader: moneyLine, body }) };
}
