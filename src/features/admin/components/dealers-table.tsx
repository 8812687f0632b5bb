import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { ChevronDown, ChevronRight } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import { z } from 'zod';
import { formatPrice } from '../../../../shared/catalog';
import { formatDate } from '../../../../shared/format';
import type { DealerAccountRowSchema, DealerAccounts } from '../../../../shared/schemas/accounts';
import { DEALER_TIERS } from '../../../../shared/pricing';
import { StatusBadge } from '../../../components/ui/status-badge';
import { ApproveDealerForm, DeclineDealerForm, type DecisionDone } from './decision-forms';
import { DataTable } from '../../../components/ui/table';
import { Pager, pageSpan } from '../../../components/ui/pager';

type DealerRow = z.infer<typeof DealerAccountRowSchema>;

/** Breaks a long address after the @ rather than anywhere. */
function EmailCell({ email }: { email: string }) {
  const at = email.indexOf('@');
  if (at < 0) return <span className="break-all">{email}</span>;
  return (
    <span>
      {email.slice(0, at)}
      <wbr />
      {email.slice(at)}
    </span>
  );
}

const col = createColumnHelper<DealerRow>();
const columns = [
  col.accessor('companyName', { header: 'Company', cell: (c) => <span className="block min-w-32 font-semibold">{c.getValue()}</span> }),
  col.accessor('status', { header: 'Status', cell: (c) => <StatusBadge kind="dealer" status={c.getValue()} /> }),
  col.accessor('contactName', {
    header: 'Contact',
    cell: (c) => (
      <span>
        {c.getValue()}
        <span className="block text-sm whitespace-nowrap text-cast">{c.row.original.phone}</span>
      </span>
    ),
  }),
  col.accessor('email', { header: 'E-mail', cell: (c) => <EmailCell email={c.getValue()} /> }),
  col.accessor('city', { header: 'City' }),
  col.accessor((r) => (r.tier ? DEALER_TIERS[r.tier].discountPct : -1), {
    id: 'tier',
    header: 'Tier',
    cell: (c) => {
      const tier = c.row.original.tier;
      return tier ? (
        <span>
          <span className="whitespace-nowrap">{DEALER_TIERS[tier].label}</span>
          <span className="tabular block text-sm text-cast">{DEALER_TIERS[tier].discountPct} % off</span>
        </span>
      ) : (
        <span className="text-cast">—</span>
      );
    },
  }),
  col.accessor('creditLimitCents', {
    header: 'Credit limit',
    meta: { numeric: true },
    cell: (c) =>
      c.row.original.status === 'approved' ? (
        <span>
          {formatPrice(c.getValue())}
          <span className="block text-sm text-cast">net {c.row.original.paymentTermsDays} days</span>
        </span>
      ) : (
        '—'
      ),
  }),
  col.accessor('openBalanceCents', { header: 'Open balance', meta: { numeric: true }, cell: (c) => formatPrice(c.getValue()) }),
];

const REVIEW_PANEL_ID = 'dealer-review';

/** The open application under the table, outside its horizontal scroll so the forms fit a phone. */
function ReviewPanel({ dealer, onDone, onClose }: { dealer: DealerRow; onDone: (d: DecisionDone) => void; onClose: () => void }) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    heading.current?.scrollIntoView({ block: 'start', behavior: 'smooth' });
    heading.current?.focus({ preventScroll: true });
  }, []);
  return (
    <section id={REVIEW_PANEL_ID} aria-labelledby="dealer-review-heading" className="grid gap-3 rounded-md border-2 border-amber-line bg-panel/60 p-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id="dealer-review-heading" ref={heading} tabIndex={-1} className="text-xl font-bold outline-none">
            Review: {dealer.companyName}
          </h2>
          <p className="text-sm text-cast">
            Applied {formatDate(dealer.createdAt)} · {dealer.contactName}, {dealer.phone}, {dealer.city} ·{' '}
            <span className="break-all">{dealer.email}</span>
          </p>
        </div>
        <button type="button" onClick={onClose} className="rounded-md border border-cast-line bg-white px-3 py-1 font-semibold hover:border-temper">
          Close
        </button>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <ApproveDealerForm dealerId={dealer.id} companyName={dealer.companyName} onDone={onDone} />
        <DeclineDealerForm dealerId={dealer.id} companyName={dealer.companyName} onDone={onDone} />
      </div>
    </section>
  );
}

/**
 * One page of dealer accounts as the server sends it: pending first, then newest first. The order is the server's
 * across every page, so the headings do not re-sort a single page.
 */
export function DealersTable({ data, onPage, updating, onDecided }: { data: DealerAccounts; onPage: (page: number) => void; updating: boolean; onDecided: (d: DecisionDone) => void }) {
  const { items } = data;
  const [open, setOpen] = useState<number | null>(null);
  const table = useReactTable({
    data: items,
    columns,
    enableSorting: false,
    getCoreRowModel: getCoreRowModel(),
    getRowId: (r) => String(r.id),
  });
  const reviewing = items.find((i) => i.id === open && i.status === 'pending') ?? null;

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-3">
      <p className="text-cast" aria-live="polite">
        <span className="tabular font-semibold text-ink">{pageSpan(data.page, data.pageSize, data.total)}</span> dealer accounts ·{' '}
        <span className="tabular font-semibold text-ink">{data.pending}</span> pending
        {updating ? ' · updating…' : ''}
      </p>
      <DataTable
        table={table}
        caption="Dealer accounts and applications, pending first, then newest first."
        maxHeight="max-h-[75vh]"
        rowClassName={(row) => (row.original.status === 'pending' ? 'bg-amber-tint/40' : '')}
        actions={{
          label: 'Actions',
          cell: (row) => {
            const d = row.original;
            const isOpen = open === d.id;
            return (
              d.status === 'pending' && (
                <button
                  type="button"
                  aria-expanded={isOpen}
                  aria-controls={isOpen ? REVIEW_PANEL_ID : undefined}
                  onClick={() => setOpen(isOpen ? null : d.id)}
                  className="inline-flex min-h-10 items-center gap-1 rounded-md border border-cast-line bg-white px-3 font-semibold whitespace-nowrap text-temper hover:border-temper"
                >
                  {isOpen ? <ChevronDown aria-hidden className="size-4" /> : <ChevronRight aria-hidden className="size-4" />}
                  Review<span className="sr-only"> {d.companyName}</span>
                </button>
              )
            );
          },
        }}
      />
      {reviewing && (
        <ReviewPanel
          key={reviewing.id}
          dealer={reviewing}
          onClose={() => setOpen(null)}
          onDone={(done) => {
            setOpen(null);
            onDecided(done);
          }}
        />
      )}
      <Pager page={data.page} pageSize={data.pageSize} total={data.total} onPage={onPage} label="Dealer account pages" />
    </div>
  );
}
