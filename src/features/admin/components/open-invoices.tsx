import { CircleCheck, Clock, TriangleAlert } from 'lucide-react';
import { useState } from 'react';
import { formatPrice } from '../../../../shared/catalog';
import { formatDate } from '../../../../shared/format';
import { InvoicePaymentSchema, type OpenInvoice } from '../../../../shared/schemas/accounts';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/states';
import { TableFrame, Td, Th } from '../../../components/ui/table';
import { useDealerInvoices } from '../api/get-dealer-invoices';
import { useRecordInvoicePaid } from '../api/record-invoice-paid';

function InvoiceRow({ dealerId, invoice, today }: { dealerId: number; invoice: OpenInvoice; today: string }) {
  const [reference, setReference] = useState('');
  const [error, setError] = useState<string | null>(null);
  const record = useRecordInvoicePaid();
  const overdue = invoice.dueDate < today;
  const inputId = `ref-${invoice.number}`;
  const submit = () => {
    const parsed = InvoicePaymentSchema.safeParse({ reference });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? 'enter the payment reference');
      return;
    }
    setError(null);
    record.mutate({ dealerId, number: invoice.number, reference: parsed.data.reference }, { onError: (e) => setError(e.message) });
  };
  return (
    <tr className="border-t border-cast-line align-top first:border-t-0">
      <Th scope="row" className="part-no border-b-0">
        {invoice.number}
        {invoice.purchaseOrder && <span className="block text-sm font-normal text-cast">PO {invoice.purchaseOrder}</span>}
      </Th>
      <Td className="tabular whitespace-nowrap">
        {overdue ? (
          <span className="inline-flex items-center gap-1 font-semibold text-oxide">
            <TriangleAlert aria-hidden className="size-4" /> Overdue since <time dateTime={invoice.dueDate}>{formatDate(invoice.dueDate)}</time>
          </span>
        ) : (
          <span className="inline-flex items-center gap-1">
            <Clock aria-hidden className="size-4 text-cast" /> Due <time dateTime={invoice.dueDate}>{formatDate(invoice.dueDate)}</time>
          </span>
        )}
      </Td>
      <Td numeric>
        {formatPrice(invoice.openCents)}
        {invoice.creditedCents > 0 && (
          <span className="block text-sm text-cast">
            after {formatPrice(invoice.creditedCents)} credited{invoice.creditNotes ? ` (${invoice.creditNotes})` : ''}
          </span>
        )}
      </Td>
      <Td>
        <div className="flex flex-wrap items-start gap-2">
          <div>
            <label htmlFor={inputId} className="sr-only">
              Payment reference for {invoice.number}
            </label>
            <input
              id={inputId}
              value={reference}
              onChange={(e) => setReference(e.target.value)}
              placeholder="payment reference"
              aria-invalid={error ? true : undefined}
              aria-describedby={error ? `${inputId}-error` : undefined}
              className="min-h-10 w-44 rounded border border-cast-line bg-white px-2"
            />
            {error && (
              <p id={`${inputId}-error`} className="mt-1 text-sm text-oxide">
                {error}
              </p>
            )}
          </div>
          <Button variant="secondary" onClick={submit} disabled={record.isPending}>
            Record payment
          </Button>
        </div>
      </Td>
    </tr>
  );
}

/** An approved dealer's open on-account invoices, with a way to record that one was paid. */
export function OpenInvoices({ dealerId, companyName }: { dealerId: number; companyName: string }) {
  const invoices = useDealerInvoices(dealerId);
  const today = new Date().toISOString().slice(0, 10);
  return (
    <section aria-labelledby="open-invoices-heading" className="grid gap-3 rounded-md border border-cast-line bg-white p-4">
      <h2 id="open-invoices-heading" className="text-xl font-bold">
        Open invoices: {companyName}
      </h2>
      {invoices.isPending ? (
        <LoadingState label="Loading invoices…" />
      ) : invoices.isError ? (
        <ErrorState title="The invoices did not load" message={invoices.error.message} onRetry={() => invoices.refetch()} />
      ) : invoices.data.items.length === 0 ? (
        <EmptyState title="Nothing open">
          <p className="inline-flex items-center gap-1">
            <CircleCheck aria-hidden className="size-4 text-machined" /> Every on-account order of this dealer is paid.
          </p>
        </EmptyState>
      ) : (
        <TableFrame>
          <table className="w-full border-collapse text-left">
            <caption className="sr-only">Open invoices of {companyName}</caption>
            <thead className="bg-panel text-sm">
              <tr>
                <Th>Invoice</Th>
                <Th>Due</Th>
                <Th numeric>Open</Th>
                <Th>
                  <span className="sr-only">Actions</span>
                </Th>
              </tr>
            </thead>
            <tbody>
              {invoices.data.items.map((inv) => (
                <InvoiceRow key={inv.number} dealerId={dealerId} invoice={inv} today={today} />
              ))}
            </tbody>
            <tfoot>
              <tr className="border-t-2 border-ink">
                <Th scope="row" colSpan={2} className="border-b-0 text-right">
                  Open balance
                </Th>
                <Td numeric className="font-bold">
                  {formatPrice(invoices.data.items.reduce((s, i) => s + i.openCents, 0))}
                </Td>
                <td />
              </tr>
            </tfoot>
          </table>
        </TableFrame>
      )}
    </section>
  );
}
