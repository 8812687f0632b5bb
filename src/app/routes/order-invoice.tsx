export function OrderInvoiceRoute() {
  return <h1 className="text-2xl font-bold">Invoice</h1>;
}
