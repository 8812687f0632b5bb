import { Download, Printer } from 'lucide-react';
import { useId, useState, type FormEvent, type ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { AGEING_BUCKETS } from '../../../../shared/ageing';
import { formatDate, formatMoney } from '../../../../shared/format';
import type { AccountStatement, StatementLine } from '../../../../shared/schemas/statement';
import { Button, buttonClass } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { statementCsvHref, useStatement } from '../api/get-statement';
import { DISTRIBUTOR } from './invoice';

const KIND_LABELS: Record<StatementLine['kind'], string> = { 'brought-forward': 'Brought forward', invoice: 'Invoice', payment: 'Payment', 'credit-note': 'Credit note' };
const money = (cents: number) => formatMoney(cents);
const day = (d: string) => formatDate(`${d}T12:00:00Z`);

function dueWords(daysPastDue: number): string {
  if (daysPastDue > 0) return `${daysPastDue} ${daysPastDue === 1 ? 'day' : 'days'} overdue`;
  if (daysPastDue === 0) return 'due today';
  return `due in ${-daysPastDue} ${daysPastDue === -1 ? 'day' : 'days'}`;
}

/** A table in the statement: scrolls sideways on a phone, prints in full on paper. */
function Table({ caption, children, wide = false }: { caption: string; children: ReactNode; /** Many columns: scroll sideways on a phone rather than wrap every cell. */ wide?: boolean }) {
  return (
    // Focusable, so the keyboard can scroll it sideways on a narrow screen.
    <div role="region" aria-label={caption} tabIndex={0} className="min-w-0 overflow-x-auto print:overflow-visible">
      <table className={`w-full border-collapse text-left text-sm print:min-w-0 ${wide ? 'min-w-[46rem]' : 'min-w-[32rem]'}`}>
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}
const th = 'border-b-2 border-ink px-2 py-1.5 font-semibold whitespace-nowrap';
const td = 'border-b border-cast-line px-2 py-1.5 align-top';
const num = 'tabular text-right whitespace-nowrap';

function Summary({ s }: { s: AccountStatement }) {
  const t = s.totals;
  const items: Array<[string, number, string?]> = [
    ['Balance due', t.balanceCents, 'font-bold text-lg'],
    ['Open invoices', t.openInvoicesCents],
    ...(t.unappliedCreditCents > 0 ? ([['Credit notes on paid invoices', -t.unappliedCreditCents]] as Array<[string, number]>) : []),
    ['Overdue', t.overdueCents, t.overdueCents > 0 ? 'font-semibold text-oxide print:text-ink' : undefined],
    ['Credit limit', t.creditLimitCents],
    ['Available credit', t.availableCreditCents],
  ];
  return (
    <dl className="grid grid-cols-2 gap-3 sm:grid-cols-3 print:grid-cols-3" aria-label="Account summary">
      {items.map(([label, cents, cls]) => (
        <div key={label} className="rounded-md border border-cast-line p-3 print:border-ink">
          <dt className="text-sm">{label}</dt>
          <dd className={`tabular ${cls ?? 'font-semibold'}`}>{money(cents)}</dd>
        </div>
      ))}
    </dl>
  );
}

function Ageing({ s }: { s: AccountStatement }) {
  return (
    <section aria-labelledby="ageing-heading" className="grid gap-2">
      <h2 id="ageing-heading" className="text-lg font-bold">
        Open invoices by days past due
      </h2>
      <Table caption="Open balance by days past the due date">
        <thead>
          <tr>
            {AGEING_BUCKETS.map((b) => (
              <th key={b.key} scope="col" className={`${th} text-right`}>
                {b.label}
              </th>
            ))}
            <th scope="col" className={`${th} text-right`}>
              Total open
            </th>
          </tr>
        </thead>
        <tbody>
          <tr>
            {AGEING_BUCKETS.map((b) => (
              <td key={b.key} className={`${td} ${num} ${b.key !== 'current' && s.ageing[b.key] > 0 ? 'font-semibold text-oxide print:text-ink' : ''}`}>
                {money(s.ageing[b.key])}
              </td>
            ))}
            <td className={`${td} ${num} font-bold`}>{money(s.totals.openInvoicesCents)}</td>
          </tr>
        </tbody>
      </Table>
      <p className="text-sm text-cast print:text-ink">Aged by calendar days past each invoice’s due date, on {day(s.asOf)}.</p>
    </section>
  );
}

function OpenInvoices({ s }: { s: AccountStatement }) {
  return (
    <section aria-labelledby="open-heading" className="grid gap-2">
      <h2 id="open-heading" className="text-lg font-bold">
        Open invoices
      </h2>
      {s.openInvoices.length === 0 ? (
        <p>Nothing is open: every invoice is paid.</p>
      ) : (
        <Table caption="Open invoices, oldest first" wide>
          <thead>
            <tr>
              <th scope="col" className={th}>
                Invoice
              </th>
              <th scope="col" className={th}>
                Date
              </th>
              <th scope="col" className={th}>
                Your PO
              </th>
              <th scope="col" className={th}>
                Due
              </th>
              <th scope="col" className={`${th} text-right`}>
                Total
              </th>
              <th scope="col" className={`${th} text-right`}>
                Credited
              </th>
              <th scope="col" className={`${th} text-right`}>
                Open
              </th>
            </tr>
          </thead>
          <tbody>
            {s.openInvoices.map((i) => (
              <tr key={i.number}>
                <td className={td}>
                  <Link to={`/orders/${encodeURIComponent(i.number)}/invoice`} className="part-no text-temper underline underline-offset-2 print:text-ink print:no-underline">
                    {i.number}
                  </Link>
                </td>
                <td className={`${td} tabular whitespace-nowrap`}>{day(i.date)}</td>
                <td className={td}>{i.purchaseOrder ?? '—'}</td>
                <td className={`${td} whitespace-nowrap`}>
                  <span className="tabular">{day(i.dueDate)}</span>
                  <span className={`block ${i.daysPastDue > 0 ? 'font-semibold text-oxide print:text-ink' : 'text-cast print:text-ink'}`}>{dueWords(i.daysPastDue)}</span>
                </td>
                <td className={`${td} ${num}`}>{money(i.totalCents)}</td>
                <td className={`${td} ${num}`}>{i.creditedCents > 0 ? `−${money(i.creditedCents)}` : '—'}</td>
                <td className={`${td} ${num} font-semibold`}>{money(i.openCents)}</td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </section>
  );
}

function Activity({ s }: { s: AccountStatement }) {
  return (
    <section aria-labelledby="activity-heading" className="grid gap-2">
      <h2 id="activity-heading" className="text-lg font-bold">
        Account activity from {day(s.from)}
      </h2>
      <Table caption="Invoices, payments and credit notes with the running balance" wide>
        <thead>
          <tr>
            <th scope="col" className={th}>
              Date
            </th>
            <th scope="col" className={th}>
              Type
            </th>
            <th scope="col" className={th}>
              Reference
            </th>
            <th scope="col" className={th}>
              Detail
            </th>
            <th scope="col" className={`${th} text-right`}>
              Charged
            </th>
            <th scope="col" className={`${th} text-right`}>
              Paid or credited
            </th>
            <th scope="col" className={`${th} text-right`}>
              Balance
            </th>
          </tr>
        </thead>
        <tbody>
          {s.lines.map((l, i) => (
            <tr key={`${l.kind}-${l.reference}-${i}`}>
              <td className={`${td} tabular whitespace-nowrap`}>{day(l.date)}</td>
              <td className={td}>{KIND_LABELS[l.kind]}</td>
              <td className={`${td} part-no`}>{l.reference}</td>
              <td className={`${td} min-w-[16rem]`}>{l.detail}</td>
              <td className={`${td} ${num}`}>{l.debitCents ? money(l.debitCents) : ''}</td>
              <td className={`${td} ${num}`}>{l.creditCents ? money(l.creditCents) : ''}</td>
              <td className={`${td} ${num} font-semibold`}>{money(l.balanceCents)}</td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr>
            <th scope="row" colSpan={4} className="px-2 py-1.5 text-right">
              Closing balance
            </th>
            <td className={`px-2 py-1.5 ${num}`}>{money(s.totals.invoicedCents)}</td>
            <td className={`px-2 py-1.5 ${num}`}>{money(s.totals.paidCents + s.totals.creditedCents)}</td>
            <td className={`px-2 py-1.5 ${num} font-bold`}>{money(s.totals.balanceCents)}</td>
          </tr>
        </tfoot>
      </Table>
    </section>
  );
}

function CreditNotes({ s }: { s: AccountStatement }) {
  return (
    <section aria-labelledby="credit-notes-heading" className="grid gap-2">
      <h2 id="credit-notes-heading" className="text-lg font-bold">
        Your credit notes
      </h2>
      {s.creditNotes.length === 0 ? (
        <p>No credit notes on this account yet. Returns and exchange cores we credit appear here.</p>
      ) : (
        <Table caption="Credit notes on this account">
          <thead>
            <tr>
              <th scope="col" className={th}>
                Credit note
              </th>
              <th scope="col" className={th}>
                Date
              </th>
              <th scope="col" className={th}>
                Invoice
              </th>
              <th scope="col" className={th}>
                Return
              </th>
              <th scope="col" className={`${th} text-right`}>
                Amount
              </th>
            </tr>
          </thead>
          <tbody>
            {s.creditNotes.map((n) => (
              <tr key={n.number}>
                <td className={`${td} part-no`}>{n.number}</td>
                <td className={`${td} tabular whitespace-nowrap`}>{day(n.date)}</td>
                <td className={`${td} part-no`}>{n.orderNumber}</td>
                <td className={`${td} part-no`}>{n.returnReference}</td>
                <td className={`${td} ${num}`}>{money(n.amountCents)}</td>
              </tr>
            ))}
          </tbody>
        </Table>
      )}
    </section>
  );
}

function PeriodForm({ from, onFrom }: { from: string; onFrom: (from: string) => void }) {
  const id = useId();
  const [value, setValue] = useState(from);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (/^\d{4}-\d{2}-\d{2}$/.test(value)) onFrom(value);
  };
  return (
    <form onSubmit={submit} aria-label="Statement period" className="flex flex-wrap items-end gap-2">
      <div className="grid gap-1">
        <label htmlFor={id} className="font-semibold">
          Activity from
        </label>
        <input id={id} type="date" value={value} onChange={(e) => setValue(e.target.value)} className="min-h-11 rounded-md border border-cast-line bg-white px-3 focus:border-temper" />
      </div>
      <Button type="submit" variant="secondary">
        Show
      </Button>
    </form>
  );
}

/** The dealer's statement: on screen, printable (plain black on white) and as a CSV download. */
export function AccountStatementView({ from, onFrom }: { from: string | null; onFrom: (from: string) => void }) {
  const statement = useStatement(from);
  if (statement.isPending) return <LoadingState label="Loading your statement…" />;
  if (statement.isError) return <ErrorState title="Your statement did not load" message={statement.error.message} onRetry={() => statement.refetch()} />;
  const s = statement.data;
  const t = s.totals;
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-4">
      <style>{'@page { size: A4; margin: 14mm; } @media print { html, body { background: #fff; } }'}</style>
      <div className="no-print flex flex-wrap items-end justify-between gap-4">
        <PeriodForm key={s.from} from={s.from} onFrom={onFrom} />
        <div className="flex flex-wrap gap-3">
          <Button onClick={() => window.print()}>
            <Printer aria-hidden className="size-4" />
            Print
          </Button>
          <a href={statementCsvHref(from)} download className={buttonClass('secondary')}>
            <Download aria-hidden className="size-4" />
            Download CSV
          </a>
        </div>
      </div>
      {t.overdueCents > 0 && (
        <Notice tone="warning" title="Payment overdue" className="no-print">
          {money(t.overdueCents)} is past its due date. Please pay the overdue invoices; orders on account stay open up to your credit limit.
        </Notice>
      )}
      <article
        aria-labelledby="statement-heading"
        className="grid gap-6 rounded-md bg-white p-4 text-ink shadow-sm ring-1 ring-cast-line sm:p-8 print:rounded-none print:p-0 print:text-[10pt] print:shadow-none print:ring-0"
      >
        <header className="flex flex-wrap justify-between gap-6 border-b-2 border-ink pb-4">
          <div>
            <p className="text-xl font-bold">{DISTRIBUTOR.name}</p>
            <p>{DISTRIBUTOR.address}</p>
            <p>{DISTRIBUTOR.email}</p>
          </div>
          <div className="sm:text-right">
            <h1 id="statement-heading" className="text-3xl font-bold">
              Account statement
            </h1>
            <dl className="mt-1 grid grid-cols-[auto_auto] gap-x-3 text-sm sm:justify-end">
              <dt>Statement date</dt>
              <dd className="tabular">{day(s.asOf)}</dd>
              <dt>Activity from</dt>
              <dd className="tabular">{day(s.from)}</dd>
              <dt>Terms</dt>
              <dd>{s.dealer.paymentTermsDays} days net</dd>
            </dl>
          </div>
        </header>
        <section aria-label="Account holder">
          <p className="font-semibold">{s.dealer.companyName}</p>
          <p>Attn. {s.dealer.contactName}</p>
          <p>{s.dealer.addressLine1}</p>
          <p>
            {s.dealer.city} {s.dealer.postcode}
          </p>
        </section>
        <Summary s={s} />
        <Ageing s={s} />
        <OpenInvoices s={s} />
        <Activity s={s} />
        <CreditNotes s={s} />
        <p className="text-sm text-cast print:text-ink">
          Payments are recorded when they reach us; a payment sent in the last few days may not show yet. Questions about this statement: {DISTRIBUTOR.email}.
        </p>
      </article>
    </div>
  );
}

export function StatementUnavailable() {
  return (
    <EmptyState title="No statement for this account">
      <p>
        Statements are for approved trade accounts.{' '}
        <Link to="/account" className="font-semibold text-temper underline">
          Back to your account
        </Link>
      </p>
    </EmptyState>
  );
}
