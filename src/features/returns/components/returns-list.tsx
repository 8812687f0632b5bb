import { Printer } from 'lucide-react';
import { Link } from 'react-router-dom';
import { buttonClass } from '../../../components/ui/button';
import { PageNav } from '../../../components/ui/page-nav';
import { formatPrice } from '../../../../shared/catalog';
import { CONDITION_GRADES, RETURN_KINDS, type ReturnView } from '../../../../shared/schemas/warehouse';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { useReturns } from '../api/get-returns';
import { StatusBadge } from '../../../components/ui/status-badge';

const DECISIONS: Record<string, string> = {
  'core-refund': 'Core deposit refunded',
  'full-refund': 'Full refund',
  'partial-refund': 'Partial refund',
  reject: 'Rejected',
};

const day = (iso: string) => new Date(iso).toLocaleDateString('en-US', { dateStyle: 'medium' });

function Outcome({ r }: { r: ReturnView }) {
  if (r.status === 'requested') {
    return (
      <div className="grid gap-2 md:justify-items-end">
      <p className="text-cast">
        Authorised: print the label and send it back. We inspect it when it arrives.
        {r.kind === 'core' && r.coreDepositCents > 0 && (
          <>
            {' '}
            The core deposit of <span className="tabular font-semibold text-ink">{formatPrice(r.coreDepositCents)}</span> is refunded once the core is graded.
          </>
        )}
      </p>
        <Link to={`/returns/${encodeURIComponent(r.reference)}/label`} className={buttonClass('secondary')}>
          <Printer aria-hidden className="size-4" /> Print return label<span className="sr-only"> for {r.reference}</span>
        </Link>
      </div>
    );
  }
  if (r.status === 'rejected') {
    return (
      <p>
        <span className="font-semibold">Not accepted:</span> {r.rejectReason ?? 'no reason given'}
        {r.conditionGrade && <span className="text-cast"> · graded {CONDITION_GRADES[r.conditionGrade].toLowerCase()}</span>}
      </p>
    );
  }
  return (
    <div>
      <p>
        <span className="font-semibold">{r.kind === 'core' && r.decision === 'partial-refund' ? 'Part of the core deposit refunded' : ((r.decision && DECISIONS[r.decision]) ?? 'Settled')}:</span>{' '}
        <span className="tabular font-semibold">{formatPrice(r.refundCents)}</span>{' '}
        {r.status === 'credited' ? 'credited to your trade account' : 'refunded to your card'}
        {r.decidedAt ? ` on ${day(r.decidedAt)}` : ''}.
      </p>
      {r.decisionReason && <p className="text-sm">Why less: {r.decisionReason}</p>}
      {r.creditNoteNumber && (
        <p>
          Credit note <span className="part-no">{r.creditNoteNumber}</span>
        </p>
      )}
      {r.conditionGrade && <p className="text-sm text-cast">Graded: {CONDITION_GRADES[r.conditionGrade]}</p>}
    </div>
  );
}

export function ReturnsList({ highlight, page, onPage }: { highlight?: string | null; page: number; onPage: (page: number) => void }) {
  const returns = useReturns(page);
  if (returns.isPending) return <LoadingState label="Loading your returns…" />;
  if (returns.isError) return <ErrorState title="Your returns did not load" message={returns.error.message} onRetry={() => returns.refetch()} />;
  if (returns.data.items.length === 0) {
    return (
      <EmptyState title="No returns yet">
        <p>When a part is wrong, faulty, or you are sending back an exchange core, open the order: each dispatched line has a Return button.</p>
        <p className="mt-2">
          <Link to="/orders" className="font-semibold text-temper underline underline-offset-2">
            Your orders
          </Link>
        </p>
      </EmptyState>
    );
  }
  return (
    <div className="grid gap-4">
    <ul aria-label="Your returns" className="grid gap-3">
      {returns.data.items.map((r) => (
        <li
          key={r.id}
          aria-label={`Return ${r.reference}`}
          className={`grid gap-3 rounded-lg bg-white p-4 ring-1 md:grid-cols-[12rem_1fr_14rem] ${highlight === r.reference ? 'ring-2 ring-temper' : 'ring-cast-line'}`}
        >
          <div className="grid content-start gap-1">
            <p className="part-no text-lg">{r.reference}</p>
            <StatusBadge kind="return" status={r.status} look="plain" />
            <p className="text-sm text-cast">Asked {day(r.createdAt)}</p>
          </div>
          <div className="grid content-start gap-1">
            <p>
              <span className="part-no">{r.partNumber}</span> {r.title}
            </p>
            <p className="text-sm text-cast">
              <span className="tabular">{r.quantity}</span> × · {RETURN_KINDS[r.kind]} · from order{' '}
              <Link to={`/orders/${encodeURIComponent(r.orderNumber)}`} className="part-no text-temper underline underline-offset-2">
                {r.orderNumber}
              </Link>
            </p>
            <p className="text-sm">“{r.reason}”</p>
          </div>
          <div className="md:text-right">
            <Outcome r={r} />
          </div>
        </li>
      ))}
    </ul>
      <PageNav label="Pages of returns" page={returns.data.page} pageSize={returns.data.pageSize} total={returns.data.total} onPage={onPage} />
    </div>
  );
}
