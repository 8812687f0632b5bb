import { money, oneLine, webUrl } from './format';
import { button, heading, html, keyValueTable, paragraph, renderLayout, renderTextLayout, type KeyValueRow } from './layout';
import { textKeyValues } from './text-blocks';
import type { RenderedMail } from './types';

/** Card orders are refunded to the card; on-account orders get a credit note against the balance. */
export type RefundRoute = { via: 'card' } | { via: 'credit-note'; creditNoteNumber: string };

export type ReturnOutcome =
  | { kind: 'refund'; amountCents: number; partial: boolean; route: RefundRoute; /** Why a partial refund is less. */ reason?: string | undefined }
  | { kind: 'core-deposit-refund'; amountCents: number; route: RefundRoute; partial?: boolean | undefined; reason?: string | undefined }
  | { kind: 'rejected'; reason: string };

export interface ReturnDecisionData {
  customerName: string;
  returnReference: string;
  orderNumber: string;
  partNumber: string;
  title: string;
  quantity: number;
  /** The condition the warehouse graded the part in, in plain words. */
  conditionGrade?: string | undefined;
  outcome: ReturnOutcome;
  orderUrl: string;
}

function routeWords(route: RefundRoute): string {
  return route.via === 'card'
    ? 'It goes back to the card you paid with; your bank may take a few business days to show it.'
    : `It is credited to your account as credit note ${route.creditNoteNumber}.`;
}

function decision(outcome: ReturnOutcome): { headline: string; subjectTail: string; lines: string[]; rows: KeyValueRow[] } {
  switch (outcome.kind) {
    case 'refund':
      return {
        headline: outcome.partial ? 'Partial refund approved' : 'Refund approved',
        subjectTail: `${outcome.partial ? 'partial refund' : 'refund'} of ${money(outcome.amountCents)}`,
        lines: [
          `We have approved a ${outcome.partial ? 'partial ' : ''}refund of ${money(outcome.amountCents)}.`,
          ...(outcome.reason ? [`Why it is less than the full value: ${outcome.reason}`] : []),
          routeWords(outcome.route),
        ],
        rows: refundRows('Refund', outcome.amountCents, outcome.route),
      };
    case 'core-deposit-refund':
      return {
        headline: outcome.partial ? 'Part of the core deposit refunded' : 'Core deposit refunded',
        subjectTail: `${outcome.partial ? 'partial ' : ''}core deposit refund of ${money(outcome.amountCents)}`,
        lines: [
          outcome.partial
            ? `Your core came back with faults, so we are refunding ${money(outcome.amountCents)} of the core deposit.`
            : `Your core passed inspection, so we are refunding the core deposit of ${money(outcome.amountCents)}.`,
          ...(outcome.reason ? [`Why: ${outcome.reason}`] : []),
          routeWords(outcome.route),
        ],
        rows: refundRows('Core deposit refund', outcome.amountCents, outcome.route),
      };
    case 'rejected':
      return {
        headline: 'Return not accepted',
        subjectTail: 'not accepted',
        lines: ['We are not able to accept this return, so no refund is due.', `Reason: ${outcome.reason}`],
        rows: [],
      };
  }
}

function refundRows(label: string, cents: number, route: RefundRoute): KeyValueRow[] {
  const rows: KeyValueRow[] = [{ label, value: money(cents), strong: true }];
  rows.push(
    route.via === 'card'
      ? { label: 'Refunded to', value: 'Card' }
      : { label: 'Credit note', value: route.creditNoteNumber },
  );
  return rows;
}

export function renderReturnDecision(data: ReturnDecisionData): RenderedMail {
  const orderUrl = webUrl(data.orderUrl);
  const d = decision(data.outcome);
  const subject = oneLine(`Return ${data.returnReference}: ${d.subjectTail}`);
  const what = `Return ${data.returnReference} from order ${data.orderNumber}: ${data.quantity} x ${data.partNumber} ${data.title}.`;
  const graded = data.conditionGrade ? `Our warehouse graded it: ${data.conditionGrade}.` : undefined;
  const afterRejection =
    data.outcome.kind === 'rejected' ? 'Reply to this message if you would like the part sent back to you or have questions.' : undefined;

  const text = [`Hello ${data.customerName},`, '', what];
  if (graded) text.push(graded);
  text.push('', ...d.lines);
  if (d.rows.length > 0) text.push('', ...textKeyValues(d.rows));
  if (afterRejection) text.push('', afterRejection);
  text.push('', `See your order: ${orderUrl}`);

  const [first, ...more] = d.lines;
  const body = html`${heading(d.headline)}
${paragraph(`Hello ${data.customerName},`)}
${paragraph(what)}
${graded ? paragraph(graded) : ''}
${paragraph(first ?? '')}
${data.outcome.kind === 'rejected' ? paragraph(html`<strong>Reason:</strong> ${data.outcome.reason}`) : more.map((line) => paragraph(line))}
${d.rows.length > 0 ? keyValueTable(d.rows) : ''}
${afterRejection ? paragraph(afterRejection) : ''}
${button(orderUrl, 'See your order')}`;

  return {
    subject,
    text: renderTextLayout(text),
    html: renderLayout({ title: subject, preheader: d.lines[0] ?? d.headline, body }),
  };
}
