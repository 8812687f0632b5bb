import { Link } from 'react-router-dom';
import type { ReactNode } from 'react';
import { formatPrice } from '../../../../shared/catalog';
import { availableCreditCents } from '../../../../shared/credit';
import type { Me } from '../../../../shared/schemas/accounts';
import { DEALER_TIERS } from '../../../../shared/pricing';
import { ROLE_LABELS } from '../roles';
import { Notice } from '../../../components/ui/notice';

type User = NonNullable<Me['user']>;
type Dealer = NonNullable<User['dealer']>;

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="grid gap-1 border-t border-cast-line py-2 first:border-t-0 sm:grid-cols-[12rem_1fr]">
      <dt className="font-semibold text-cast">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

export function AccountDetails({ user }: { user: User }) {
  return (
    <section aria-labelledby="account-you" className="rounded-md border border-cast-line bg-white p-4">
      <h2 id="account-you" className="text-xl font-bold">
        You
      </h2>
      <dl className="mt-2">
        <Row label="Name">{user.name}</Row>
        <Row label="E-mail">
          <span className="break-all">{user.email}</span>
        </Row>
        <Row label="Role">{ROLE_LABELS[user.role]}</Row>
      </dl>
    </section>
  );
}

/** The terms an approved dealer buys on; money from the server in cents. */
export function DealerTerms({ dealer }: { dealer: Dealer }) {
  const tier = dealer.tier ? DEALER_TIERS[dealer.tier] : null;
  const balance = dealer.openBalanceCents ?? 0;
  const available = availableCreditCents({ openBalanceCents: balance, creditLimitCents: dealer.creditLimitCents });
  return (
    <section aria-labelledby="account-trade" className="rounded-md border border-cast-line bg-white p-4">
      <h2 id="account-trade" className="text-xl font-bold">
        Trade account
      </h2>
      <dl className="mt-2">
        <Row label="Company">{dealer.companyName}</Row>
        <Row label="Trade tier">{tier ? `${tier.label} — ${tier.discountPct} % off retail` : 'Not set'}</Row>
        <Row label="Credit limit">
          <span className="tabular">{formatPrice(dealer.creditLimitCents)}</span>
        </Row>
        <Row label="Open balance">
          <span className="tabular">{formatPrice(balance)}</span>
          <span className="text-cast"> on account, not yet paid</span>
        </Row>
        <Row label="Available credit">
          <span className="tabular font-semibold">{formatPrice(available)}</span>
        </Row>
        <Row label="Payment terms">Net {dealer.paymentTermsDays} days from invoice</Row>
      </dl>
      <p className="mt-3">
        <Link to="/account/statement" className="font-semibold text-temper underline underline-offset-2">
          Account statement
        </Link>{' '}
        <span className="text-cast">— open invoices, payments and credit notes; print it or download a CSV</span>
      </p>
    </section>
  );
}

/** A trade application's state, with a shape and a word. */
export function ApplicationState({ dealer }: { dealer: Dealer }) {
  if (dealer.status === 'pending') {
    return (
      <Notice
        tone="warning"
        title={
          <>
            Application received — <span className="uppercase tracking-wide">pending</span>
          </>
        }
      >
        <p className="text-ink">
          We have your trade application for <span className="font-semibold">{dealer.companyName}</span>. The office checks it and e-mails you the
          decision, usually within two working days. Until then you buy at retail prices.
        </p>
      </Notice>
    );
  }
  if (dealer.status === 'declined') {
    return (
      <Notice
        tone="problem"
        title={
          <>
            Application <span className="uppercase tracking-wide">declined</span>
          </>
        }
      >
        <p className="text-ink">
          The trade application for <span className="font-semibold">{dealer.companyName}</span> was declined; the e-mail we sent gives the reason.
          Call the trade counter if something has changed.
        </p>
      </Notice>
    );
  }
  return (
    <Notice tone="done">
      <span className="font-semibold">Approved.</span> {dealer.companyName} has a trade account.
    </Notice>
  );
}
