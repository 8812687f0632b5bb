import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { notices, serviceRequests, units, user } from '../db/schema';
import { formatMoney } from '../../shared/format';
import { priceInspectionFee } from '../../shared/service';
import { enqueueMail } from './mail-outbox';
import { renderServiceUpdate } from './mail-templates/service-update';
import type { Query } from './orders/order-reads';
import type { ServiceNotifier } from './service-requests';

/** What every packing note says: a unit travels drained, capped and guarded, and a large one is a two-person lift. */
export const PACKING_CAUTION =
  'Drain the oil and cap the oil feed and drain ports. Pack the unit so nothing can touch or strike the wheels. Large units weigh up to about 40 kg: lift them with two people.';
export const FITTING_CAUTION =
  'Prime the oil supply before the first start, never touch the wheels (they are sharp and spin past 100,000 rpm), and have a licensed mechanic fit the unit to local rules.';

/**
 * The Bench's e-mails and on-site notices, written in the transaction of each step (the outbox sends the mail after
 * the commit), so a step that rolls back leaves neither behind.
 */
export function createServiceNotifier(deps: { db: Db; publicUrl: string; taxRatePct: number }): ServiceNotifier {
  const url = (p: string) => `${deps.publicUrl.replace(/\/$/, '')}${p}`;
  const load = (q: Query, id: number) =>
    q
      .select({ r: serviceRequests, serial: units.serial, email: user.email, name: user.name })
      .from(serviceRequests)
      .innerJoin(units, eq(units.id, serviceRequests.unitId))
      .innerJoin(user, eq(user.id, serviceRequests.userId))
      .where(eq(serviceRequests.id, id))
      .get();
  type Loaded = NonNullable<ReturnType<typeof load>>;

  function tell(
    q: Query,
    s: Loaded,
    kind: 'service-booked' | 'service-quote' | 'service-decision' | 'service-shipped',
    m: { subjectTail: string; headline: string; lines: string[]; rows?: Array<{ label: string; value: string; strong?: boolean }>; caution?: { title: string; text: string }; trackingUrl?: string; action: string; notice: string },
  ) {
    const link = `/service/${s.r.reference}`;
    enqueueMail(q, kind, () => ({
      to: s.email,
      ...renderServiceUpdate({ customerName: s.name, reference: s.r.reference, serial: s.serial, requestUrl: url(link), ...m }),
    }));
    q.insert(notices).values({ userId: s.r.userId, orderId: null, kind: 'service', title: `${s.r.reference}: ${m.headline}`, body: m.notice, link }).run();
  }

  return {
    booked(q, id) {
      const s = load(q, id);
      if (!s) return;
      tell(q, s, 'service-booked', {
        subjectTail: 'booked in',
        headline: 'Booked in for service',
        lines: [`Unit ${s.serial} is booked in as ${s.r.reference}.`, 'Print the label, fix it to the box and send the unit to the Bench. We inspect it when it arrives and send you a quote before any work is done.'],
        rows: [{ label: 'Inspection fee if you decline the quote', value: formatMoney(s.r.inspectionFeeCents) + ' + tax' }],
        caution: { title: 'Packing the unit', text: PACKING_CAUTION },
        action: 'Print the label',
        notice: `Unit ${s.serial} booked in. Print the label and send the unit; a quote follows the inspection.`,
      });
    },
    quoted(q, id) {
      const s = load(q, id);
      if (!s || s.r.totalCents === null) return;
      tell(q, s, 'service-quote', {
        subjectTail: `quote ready, ${formatMoney(s.r.totalCents)}`,
        headline: 'Your quote is ready',
        lines: ['We have inspected the unit and quoted the rebuild. Approve it to have the work done, or decline it and the unit comes back unrepaired.'],
        rows: [
          { label: 'Rebuild, with tax', value: formatMoney(s.r.totalCents), strong: true },
          { label: 'If you decline: inspection fee with tax', value: formatMoney(priceInspectionFee(s.r.inspectionFeeCents, deps.taxRatePct).totalCents) },
        ],
        action: 'See the quote and decide',
        notice: `Quote ready: ${formatMoney(s.r.totalCents)} with tax. Approve or decline it on the request.`,
      });
    },
    decided(q, id) {
      const s = load(q, id);
      if (!s) return;
      const approved = s.r.decision === 'approve';
      const how = s.r.paymentMethod === 'card' ? 'paid by card' : `on your account, PO ${s.r.purchaseOrder ?? ''}`;
      tell(q, s, 'service-decision', {
        subjectTail: approved ? 'approved' : 'declined',
        headline: approved ? 'Quote approved' : 'Quote declined',
        lines: approved
          ? [`Thank you: the rebuild of ${s.serial} is under way. ${formatMoney(s.r.chargeCents)} ${how}.`, 'We e-mail you again with the tracking number when it ships back.']
          : [`The unit goes back to you unrepaired. The inspection fee, ${formatMoney(s.r.chargeCents)} with tax, is ${how}.`],
        action: 'See the request',
        notice: approved ? `Approved: ${formatMoney(s.r.chargeCents)} ${how}. The rebuild is under way.` : `Declined: the unit comes back unrepaired; inspection fee ${formatMoney(s.r.chargeCents)} ${how}.`,
      });
    },
    shipped(q, id, trackingLink) {
      const s = load(q, id);
      if (!s || !s.r.carrier || !s.r.trackingNumber) return;
      tell(q, s, 'service-shipped', {
        subjectTail: `shipped, ${s.r.carrier} ${s.r.trackingNumber}`,
        headline: 'Your unit is on its way back',
        lines: [
          s.r.decision === 'approve' ? `Unit ${s.serial} is rebuilt, balanced, tested and on its way back to you.` : `Unit ${s.serial} is on its way back to you, unrepaired as you asked.`,
          ...(s.r.invoiceNumber ? [`Invoice ${s.r.invoiceNumber}: ${formatMoney(s.r.chargeCents)}, ${s.r.paymentState === 'paid' ? 'paid by card' : 'on your account statement'}.`] : []),
        ],
        rows: [
          { label: 'Carrier', value: s.r.carrier },
          { label: 'Tracking number', value: s.r.trackingNumber },
        ],
        ...(trackingLink ? { trackingUrl: trackingLink } : {}),
        caution: { title: 'Fitting the unit', text: FITTING_CAUTION },
        action: 'See the request and invoice',
        notice: `Shipped with ${s.r.carrier} ${s.r.trackingNumber}${s.r.invoiceNumber ? `; invoice ${s.r.invoiceNumber}` : ''}.`,
      });
    },
  };
}
