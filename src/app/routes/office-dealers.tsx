import { useState } from 'react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../shared/catalog';
import { DEALER_TIERS } from '../../../shared/pricing';
import { buttonClass } from '../../components/ui/button';
import { Notice } from '../../components/ui/notice';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { ApiError } from '../../lib/api-client';
import { useDealers } from '../../features/admin/api/get-dealers';
import type { DecisionDone } from '../../features/admin/components/decision-forms';
import { DealersTable } from '../../features/admin/components/dealers-table';
import { OpenInvoices } from '../../features/admin/components/open-invoices';
import { OfficeNav, OfficePageHeader } from '../../features/office/components/office-shell';
import { useMe } from '../../features/auth/api/get-me';
import { signInHref } from '../../features/auth/next-path';

function NotAllowed({ signedIn }: { signedIn: boolean }) {
  return (
    <div className="mx-auto mt-6 grid max-w-2xl gap-3">
      <h1 className="text-2xl font-bold">Not allowed</h1>
      <Notice tone="problem" live="off">
        Dealer accounts are managed in the Office, which only administrators can open.
        {signedIn ? ' Your account is not an administrator account.' : ' Sign in with an administrator account.'}
      </Notice>
      <div className="flex flex-wrap gap-3">
        {!signedIn && (
          <Link to={signInHref('/office/dealers')} className={buttonClass('primary')}>
            Sign in
          </Link>
        )}
        <Link to="/" className={buttonClass('secondary')}>
          Back to the counter
        </Link>
      </div>
    </div>
  );
}

function describe(done: DecisionDone): string {
  const d = done.decision;
  if (d.decision === 'decline') return `${done.companyName} declined. The applicant gets an e-mail with your reason.`;
  const tier = DEALER_TIERS[d.tier];
  return `${done.companyName} approved: ${tier.label} (${tier.discountPct} % off), credit limit ${formatPrice(d.creditLimitCents)}, net ${d.paymentTermsDays} days. The dealer gets an e-mail with these terms.`;
}

export function OfficeDealersRoute() {
  const me = useMe();
  const isAdmin = me.data?.user?.role === 'admin';
  const [page, setPage] = useState(1);
  const dealers = useDealers(isAdmin, page);
  const [done, setDone] = useState<DecisionDone | null>(null);

  if (me.isPending) return <LoadingState />;
  if (me.isError) return <ErrorState message={me.error.message} onRetry={() => me.refetch()} />;
  if (!isAdmin || (dealers.error instanceof ApiError && (dealers.error.status === 403 || dealers.error.status === 401))) {
    return <NotAllowed signedIn={Boolean(me.data.user)} />;
  }

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
      <OfficeNav />
      <OfficePageHeader title="Dealer accounts">
        Trade applications wait here, pending first. Approving sets the tier, credit limit and payment terms,
        and e-mails the dealer.
      </OfficePageHeader>
      <div role="status">
        {done && (
          <Notice tone="done" live="off">
            <span className="font-semibold">Done. </span>
            {describe(done)}
          </Notice>
        )}
      </div>
      {dealers.isPending ? (
        <LoadingState label="Loading dealer accounts…" />
      ) : dealers.isError ? (
        <ErrorState title="The dealer accounts did not load" message={dealers.error.message} onRetry={() => dealers.refetch()} />
      ) : dealers.data.total === 0 ? (
        <EmptyState title="No dealer accounts yet">Applications made from the account page show up here.</EmptyState>
      ) : dealers.data.items.length === 0 ? (
        <EmptyState title="No accounts on this page">
          The list has fewer pages now.{' '}
          <button type="button" onClick={() => setPage(1)} className="font-semibold text-temper underline">
            Back to the first page
          </button>
        </EmptyState>
      ) : (
        <>
          <DealersTable data={dealers.data} onPage={setPage} updating={dealers.isPlaceholderData} onDecided={setDone} />
          <InvoicesForDealer dealers={dealers.data.items.filter((d) => d.status === 'approved')} />
        </>
      )}
    </div>
  );
}

/** Pick an approved dealer of the page shown to see and settle its open on-account invoices. */
function InvoicesForDealer({ dealers }: { dealers: Array<{ id: number; companyName: string; openBalanceCents: number }> }) {
  const [chosen, setChosen] = useState<number | null>(null);
  if (dealers.length === 0) return null;
  // The approved accounts on the page shown: a choice from another page falls back to this page's first with a balance.
  const id = chosen !== null && dealers.some((d) => d.id === chosen) ? chosen : (dealers.find((d) => d.openBalanceCents > 0) ?? dealers[0]!).id;
  const dealer = dealers.find((d) => d.id === id)!;
  return (
    <div className="grid gap-3">
      <label className="grid max-w-md gap-1">
        <span className="font-semibold">Dealer for open invoices</span>
        <span className="text-sm text-cast">Approved accounts on this page of the list</span>
        <select value={id} onChange={(e) => setChosen(Number(e.target.value))} className="min-h-10 rounded border border-cast-line bg-white px-2">
          {dealers.map((d) => (
            <option key={d.id} value={d.id}>
              {d.companyName} — open {formatPrice(d.openBalanceCents)}
            </option>
          ))}
        </select>
      </label>
      <OpenInvoices dealerId={dealer.id} companyName={dealer.companyName} />
    </div>
  );
}
