import { fittingCautionHtml, fittingCautionText, needsFittingCaution } from './fitting-caution';
import { addressLines, calendarDate, minusMoney, money, oneLine, webUrl } from './format';
import {
  addressBlock,
  button,
  dataTable,
  heading,
  html,
  keyValueTable,
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

export interface OrderConfirmationLine extends MailPartRef {
  quantity: number;
  unitPriceCents: number;
  lineTotalCents: number;
  /** Refundable deposit per unit on exchange units. */
  coreDepositCents?: number | undefined;
  /** How many of `quantity` wait for stock (dealers may back-order the rest). */
  backOrderedQuantity?: number | undefined;
  /** A complete unit's clocked housings, in words (shared/exploded-view.ts orientationText). */
  orientation?: string | undefined;
}

export interface OrderTotals {
  goodsCents: number;
  /** Taken off the goods for dealer accounts; 0 for retail. */
  dealerDiscountCents: number;
  coreDepositsCents: number;
  freightCents: number;
  taxCents: number;
  totalCents: number;
}

export type OrderPayment =
  | { method: 'card'; status: 'paid' | 'pending'; cardLast4?: string | undefined }
  | { method: 'account'; purchaseOrder: string; paymentTerms: string };

export interface OrderConfirmationData {
  orderNumber: string;
  customerName: string;
  placedAt: Date;
  lines: OrderConfirmationLine[];
  totals: OrderTotals;
  deliveryAddress: MailAddress;
  payment: OrderPayment;
  orderUrl: string;
}

function backOrdered(line: OrderConfirmationLine): number {
  return Math.min(line.backOrderedQuantity ?? 0, line.quantity);
}

function backOrderWords(line: OrderConfirmationLine): string {
  const waiting = backOrdered(line);
  const now = line.quantity - waiting;
  return now > 0
    ? `${now} ship${now === 1 ? 's' : ''} now, ${waiting} on back-order until stock arrives`
    : `all ${waiting} on back-order until stock arrives`;
}

function paymentWords(payment: OrderPayment): string {
  if (payment.method === 'account') return `On account, payment terms ${payment.paymentTerms}`;
  const card = payment.cardLast4 ? `Card ending ${payment.cardLast4}` : 'Card';
  return payment.status === 'paid' ? `${card}, paid` : `${card}, payment being confirmed`;
}

function totalRows(totals: OrderTotals): KeyValueRow[] {
  const rows: KeyValueRow[] = [{ label: 'Goods', value: money(totals.goodsCents) }];
  if (totals.dealerDiscountCents !== 0) rows.push({ label: 'Dealer discount', value: minusMoney(totals.dealerDiscountCents) });
  if (totals.coreDepositsCents !== 0) rows.push({ label: 'Core deposits (refundable)', value: money(totals.coreDepositsCents) });
  rows.push({ label: 'Freight', value: money(totals.freightCents) });
  rows.push({ label: 'Tax', value: money(totals.taxCents) });
  rows.push({ label: 'Total', value: money(totals.totalCents), strong: true });
  return rows;
}

export function renderOrderConfirmation(data: OrderConfirmationData): RenderedMail {
  const orderUrl = webUrl(data.orderUrl);
  const anyBackOrder = data.lines.some((line) => backOrdered(line) > 0);
  const payment = data.payment;
  const subject = oneLine(
    `Order ${data.orderNumber} confirmed` +
      (payment.method === 'account' ? ` (PO: ${payment.purchaseOrder})` : '') +
      (anyBackOrder ? ' (part on back-order)' : ''),
  );
  const totals = totalRows(data.totals);
  const address = addressLines(data.deliveryAddress);
  const intro =
    payment.method === 'card' && payment.status === 'pending'
      ? 'We have your order and are waiting for the card payment to be confirmed; we start picking as soon as it is.'
      : 'We have your order and will start picking it shortly.';

  const text: string[] = [
    `Hello ${data.customerName},`,
    '',
    `Thank you for order ${data.orderNumber}, placed ${calendarDate(data.placedAt)}.`,
    intro,
  ];
  if (anyBackOrder) {
    text.push('', 'BACK-ORDER: some parts are not in stock yet. We send them as soon as they arrive; the lines marked below say how many.');
  }
  text.push(...textHeading('Lines'));
  for (const line of data.lines) {
    text.push('', `${line.partNumber}  ${line.title}`);
    text.push(...indent([`Qty ${line.quantity} x ${money(line.unitPriceCents)} = ${money(line.lineTotalCents)}`]));
    if (line.orientation) text.push(...indent([`Built with: ${line.orientation}`]));
    if (backOrdered(line) > 0) text.push(...indent([`BACK-ORDER: ${backOrderWords(line)}`]));
    if (line.coreDepositCents) {
      text.push(
        ...indent([
          `Core deposit (refundable): ${line.quantity} x ${money(line.coreDepositCents)} = ${money(line.coreDepositCents * line.quantity)}`,
        ]),
      );
    }
  }
  text.push(...textHeading('Totals'), ...textKeyValues(totals, 'right'));
  text.push(...textHeading('Deliver to'), ...address);
  text.push(...textHeading('Payment'), paymentWords(payment));
  if (payment.method === 'account') text.push(`Purchase order: ${payment.purchaseOrder}`);
  if (data.lines.some((l) => l.coreDepositCents)) {
    text.push('', 'Core deposits are refunded once your old unit comes back and passes inspection.');
  }
  if (needsFittingCaution(data.lines)) text.push(...fittingCautionText());
  text.push('', `See your order: ${orderUrl}`);

  const rows: unknown[][] = [];
  for (const line of data.lines) {
    const waiting = backOrdered(line);
    rows.push([
      partNumber(line.partNumber),
      html`${line.title}${line.orientation ? html`<br>Built with: ${line.orientation}` : ''}${waiting > 0 ? html`<br>${tag('Back-order')} ${backOrderWords(line)}` : ''}`,
      line.quantity,
      money(line.unitPriceCents),
      money(line.lineTotalCents),
    ]);
    if (line.coreDepositCents) {
      rows.push([
        '',
        html`Core deposit for ${partNumber(line.partNumber)}, refundable`,
        line.quantity,
        money(line.coreDepositCents),
        money(line.coreDepositCents * line.quantity),
      ]);
    }
  }
  const table = dataTable(
    [
      { header: 'Part number' },
      { header: 'Description' },
      { header: 'Qty', align: 'right' },
      { header: 'Unit price', align: 'right' },
      { header: 'Line total', align: 'right' },
    ],
    rows,
  );
  const paymentRows: KeyValueRow[] = [{ label: 'Payment', value: paymentWords(payment) }];
  if (payment.method === 'account') paymentRows.push({ label: 'Purchase order', value: payment.purchaseOrder });

  const body = html`${heading(`Order ${data.orderNumber} confirmed`)}
${paragraph(`Hello ${data.customerName},`)}
${paragraph(`Thank you for order ${data.orderNumber}, placed ${calendarDate(data.placedAt)}. ${intro}`)}
${anyBackOrder ? paragraph(html`${tag('Back-order')} Some parts are not in stock yet. We send them as soon as they arrive; the lines marked below say how many.`) : ''}
${table}
${keyValueTable(totals)}
${data.lines.some((l) => l.coreDepositCents) ? paragraph('Core deposits are refunded once your old unit comes back and passes inspection.') : ''}
${subheading('Deliver to')}
${addressBlock(address)}
${subheading('Payment')}
${keyValueTable(paymentRows)}
${needsFittingCaution(data.lines) ? fittingCautionHtml() : ''}
${button(orderUrl, 'See your order')}`;

  return {
    subject,
    text: renderTextLayout(text, 'You receive this because you placed an order with us.'),
    html: renderLayout({
      title: subject,
      preheader: `Order ${data.orderNumber}: ${data.lines.length} line${data.lines.length === 1 ? '' : 's'}, total ${money(data.totals.totalCents)}`,
      body,
      footerNote: 'You receive this because you placed an order with us.',
    }),
  };
}
