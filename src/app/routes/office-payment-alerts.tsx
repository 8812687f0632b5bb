import { formatPrice } from '../../../shared/catalog';
import { REFUND_STATE_LABELS } from '../../../shared/schemas/payment-alerts';
import { Button } from '../../components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '../../components/ui/states';
import { useMe } from '../../features/auth/api/get-me';
import { usePaymentAlerts, useRetryAlertRefund } from '../../features/office/api/payment-alerts';
import { OfficeGate, OfficeNav, OfficePageHeader } from '../../features/office/components/office-shell';
import { officeAccess } from '../../features/office/lib/office-access';

/** Payments that arrived for orders no longer awaiting one: each is refunded automatically; a refused refund can be retried. */
function PaymentAlerts() {
  const alerts = usePaymentAlerts(true);
  const retry = useRetryAlertRefund();
  if (alerts.isPending) return <LoadingState label="Loading payment alerts…" />;
  if (alerts.isError) return <ErrorState title="Payment alerts did not load" message={alerts.error.message} onRetry={() => alerts.refetch()} />;
  if (alerts.data.items.length === 0) {
    return (
      <EmptyState title="No payment alerts">
        <p>No card payment has arrived for an order that was no longer awaiting one.</p>
      </EmptyState>
    );
  }
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Payment alerts, newest first</caption>
        <thead>
          <tr className="border-b border-cast-line">
            <th scope="col" className="p-2">Order</th>
            <th scope="col" className="p-2 text-right">Amount</th>
            <th scope="col" className="p-2">What happened</th>
            <th scope="col" className="p-2">Refund</th>
            <th scope="col" className="p-2">When</th>
          </tr>
        </thead>
        <tbody>
          {alerts.data.items.map((a) => (
            <tr key={a.id} className="border-b border-cast-line align-top">
              <td className="p-2 part-no">{a.orderNumber}</td>
              <td className="p-2 text-right tabular">{formatPrice(a.amountCents)}</td>
              <td className="p-2">{a.what}</td>
              <td className="p-2">
                <p className={a.refundState === 'failed' ? 'font-semibold text-oxide' : a.refundState === 'refunded' ? 'font-semibold text-machined' : 'font-semibold text-amber'}>
                  {REFUND_STATE_LABELS[a.refundState]}
                </p>
                {a.refundId && <p className="text-cast">{a.refundId}</p>}
                {a.refundState === 'failed' && a.lastError && <p className="text-cast">{a.lastError}</p>}
                {a.refundState !== 'refunded' && (
                  <Button variant="secondary" disabled={retry.isPending} onClick={() => retry.mutate(a.id)}>
                    Retry the refund
                  </Button>
                )}
              </td>
              <td className="p-2 tabular">{a.createdAt.slice(0, 16).replace('T', ' ')}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {retry.isError && (
        <p role="alert" className="mt-2 font-semibold text-oxide">
          {retry.error.message}
        </p>
      )}
    </div>
  );
}

export function OfficePaymentAlertsRoute() {
  const me = useMe();
  return (
    <OfficeGate access={officeAccess(me)}>
      <div className="grid grid-cols-[minmax(0,1fr)] gap-5">
        <OfficeNav />
        <OfficePageHeader title="Payment alerts">
          Card payments that arrived after their order was cancelled or expired. Each is refunded in full
          automatically; the order's timeline says so too.
        </OfficePageHeader>
        <PaymentAlerts />
      </div>
    </OfficeGate>
  );
}
