import { Printer } from 'lucide-react';
import { Link } from 'react-router-dom';
import { formatPrice } from '../../../../shared/catalog';
import { formatDate } from '../../../../shared/format';
import { Button } from '../../../components/ui/button';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { useServiceInvoice } from '../api/get-invoice';

/** A printable service invoice: a repair, or the inspection fee of a declined quote. */
export function ServiceInvoicePage({ reference }: { reference: string }) {
  const q = useServiceInvoice(reference);
  if (q.isPending) return <LoadingState label={`Loading the invoice for ${reference}…`} />;
  if (q.isError) return <ErrorState title="The invoice did not load" message={q.error.message} />;
  const inv = q.data;
  return (
    <div className="grid gap-5">
      <div className="no-print flex flex-wrap items-end justify-between gap-3">
        <nav aria-label="Breadcrumb" className="text-sm text-cast">
          <Link to={`/service/${inv.reference}`} className="hover:underline">
            Service request {inv.reference}
          </Link>{' '}
          / Invoice
        </nav>
        <Button onClick={() => window.print()}>
          <Printer aria-hidden className="size-4" /> Print
        </Button>
      </div>
      <article aria-labelledby="inv-heading" className="grid gap-4 rounded-md border border-cast-line bg-white p-6 print:border-0">
        <header className="flex flex-wrap justify-between gap-4">
          <div>
            <h1 id="inv-heading" className="text-2xl font-bold">
              Service invoice <span className="part-no">{inv.invoiceNumber}</span>
            </h1>
            <p>Spoolyard Turbo Supply · Unit 7, Foundry Row, Quenchfold</p>
          </div>
          <dl className="grid grid-cols-[auto_auto] gap-x-3 text-sm">
            <dt className="font-semibold">Date</dt>
            <dd>{formatDate(inv.date)}</dd>
            <dt className="font-semibold">Request</dt>
            <dd className="part-no">{inv.reference}</dd>
            <dt className="font-semibold">Unit</dt>
            <dd className="part-no">{inv.serial}</dd>
            {inv.purchaseOrder && (
              <>
                <dt className="font-semibold">Your PO</dt>
                <dd>{inv.purchaseOrder}</dd>
              </>
            )}
          </dl>
        </header>
        <section aria-label="Invoice to">
          <p className="font-semibold">{inv.companyName ?? inv.customer}</p>
          <p>
            {inv.address.name}, {inv.address.line1}, {inv.address.city} {inv.address.postcode}
          </p>
        </section>
        <table className="w-full border-collapse text-left">
          <caption className="sr-only">Invoice lines</caption>
          <thead>
            <tr className="border-b-2 border-ink">
              <th scope="col" className="py-1 pr-2">
                Description
              </th>
              <th scope="col" className="py-1 pr-2 text-right">
                Qty
              </th>
              <th scope="col" className="py-1 pr-2 text-right">
                Unit
              </th>
              <th scope="col" className="py-1 text-right">
                Amount
              </th>
            </tr>
          </thead>
          <tbody className="tabular">
            {inv.lines.map((l, i) => (
              <tr key={i} className="border-b border-cast-line">
                <td className="py-1 pr-2">{l.description}</td>
                <td className="py-1 pr-2 text-right">{l.quantity}</td>
                <td className="py-1 pr-2 text-right">{formatPrice(l.unitCents)}</td>
                <td className="py-1 text-right">{formatPrice(l.amountCents)}</td>
              </tr>
            ))}
          </tbody>
          <tfoot className="tabular">
            <tr>
              <th scope="row" colSpan={3} className="py-1 pr-2 text-right font-normal">
                Tax
              </th>
              <td className="py-1 text-right">{formatPrice(inv.taxCents)}</td>
            </tr>
            <tr>
              <th scope="row" colSpan={3} className="py-1 pr-2 text-right">
                Total
              </th>
              <td className="py-1 text-right text-lg font-bold">{formatPrice(inv.totalCents)}</td>
            </tr>
          </tfoot>
        </table>
        {inv.discountCents > 0 && <p className="text-sm">Trade discount of {formatPrice(inv.discountCents)} on parts included.</p>}
        <p className="font-semibold">
          {inv.paymentState === 'paid' ? (inv.paymentMethod === 'card' ? 'Paid by card.' : 'Paid, thank you.') : `On account: due ${inv.dueDate ? formatDate(inv.dueDate) : ''}. It is on your account statement.`}
        </p>
      </article>
    </div>
  );
}
