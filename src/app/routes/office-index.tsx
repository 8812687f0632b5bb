import { AlertTriangle, Boxes, CalendarClock, CreditCard, FileSpreadsheet, History, Mail, Store, type LucideIcon } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { OfficeSummary } from '../../../shared/schemas/office-summary';
import { useMe } from '../../features/auth/api/get-me';
import { useOfficeSummary } from '../../features/office/api/get-office-summary';
import { OfficeGate, OfficeNav, OfficePageHeader } from '../../features/office/components/office-shell';
import { officeAccess } from '../../features/office/lib/office-access';

interface OfficeCard {
  to: string;
  title: string;
  what: string;
  Icon: LucideIcon;
  /** A short count from the summary, and whether it asks for attention. */
  count?: (s: OfficeSummary) => { text: string; attention: boolean };
}

const plural = (n: number, one: string, many: string) => `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;

/** Each Office screen, in the order a day's work usually takes; add a row for a new screen. */
export const OFFICE_CARDS: OfficeCard[] = [
  {
    to: '/office/dealers',
    title: 'Dealer accounts',
    what: 'Decide trade applications, set tiers and credit, record invoice payments.',
    Icon: Store,
    count: (s) => ({ text: s.pendingApplications ? `${plural(s.pendingApplications, 'application', 'applications')} waiting` : 'No applications waiting', attention: s.pendingApplications > 0 }),
  },
  {
    to: '/office/payment-alerts',
    title: 'Payment alerts',
    what: 'Card payments that arrived for orders no longer awaiting one, and their refunds.',
    Icon: CreditCard,
    count: (s) => ({ text: s.openPaymentAlerts ? `${plural(s.openPaymentAlerts, 'refund', 'refunds')} not done` : 'Nothing open', attention: s.openPaymentAlerts > 0 }),
  },
  {
    to: '/office/mail',
    title: 'Mail',
    what: 'Every e-mail the shop sent or tried to send; send a failed one again.',
    Icon: Mail,
    count: (s) => ({ text: s.failedMail ? `${plural(s.failedMail, 'message', 'messages')} failed` : 'None failed', attention: s.failedMail > 0 }),
  },
  {
    to: '/office/parts',
    title: 'Catalogue',
    what: 'Find, edit and add parts: prices, specs, photos and what goes with what.',
    Icon: Boxes,
    count: (s) => ({ text: `${plural(s.activeParts, 'part', 'parts')} on sale`, attention: false }),
  },
  {
    to: '/office/price-imports',
    title: 'Price list import',
    what: 'Upload a price list, check every change, then apply it.',
    Icon: FileSpreadsheet,
    count: (s) => ({ text: s.priceImportPreviews ? `${plural(s.priceImportPreviews, 'upload', 'uploads')} not applied` : 'No upload waiting', attention: false }),
  },
  {
    to: '/office/service-intervals',
    title: 'Service intervals',
    what: 'How often units should come in, by bearing and use; reminders follow them.',
    Icon: CalendarClock,
  },
  {
    to: '/office/audit',
    title: 'Audit log',
    what: 'Who changed which part, when, and what it was before: by hand or by a price import.',
    Icon: History,
  },
];

function Card({ card, summary }: { card: OfficeCard; summary: OfficeSummary | undefined }) {
  const count = summary && card.count?.(summary);
  return (
    <li>
      <Link
        to={card.to}
        className="flex h-full gap-4 rounded-lg border-2 border-cast-line bg-white p-4 hover:border-temper focus-visible:border-temper"
      >
        <card.Icon aria-hidden className="mt-1 size-7 shrink-0 text-temper" />
        <span className="grid content-start gap-1">
          <span className="text-xl font-bold text-temper-deep underline-offset-2">{card.title}</span>
          <span className="text-cast">{card.what}</span>
          {count && (
            <span className={`mt-1 inline-flex items-center gap-1 font-semibold ${count.attention ? 'text-amber' : 'text-ink'}`}>
              {count.attention && <AlertTriangle aria-hidden className="size-4" />}
              {count.text}
            </span>
          )}
        </span>
      </Link>
    </li>
  );
}

export function OfficeIndexRoute() {
  const me = useMe();
  const access = officeAccess(me);
  const summary = useOfficeSummary(access.state === 'allowed');
  return (
    <OfficeGate access={access}>
      <div className="grid gap-6">
        <OfficePageHeader title="Overview">Catalogue, prices and dealer accounts: pick up where something waits.</OfficePageHeader>
        <OfficeNav />
        {summary.isError && <p className="text-cast">The counts did not load ({summary.error.message}); every screen below still opens.</p>}
        <ul aria-label="Office screens" className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          {OFFICE_CARDS.map((card) => (
            <Card key={card.to} card={card} summary={summary.data} />
          ))}
        </ul>
      </div>
    </OfficeGate>
  );
}
