import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { formatPrice } from '../../../shared/catalog';
import { ErrorState, LoadingState } from '../../components/ui/states';
import { ApiError } from '../../lib/api-client';
import { useMe } from '../../features/auth/api/get-me';
import { useOrder } from '../../lib/orders';
import { LinePicker } from '../../features/returns/components/line-picker';
import { ReturnForm } from '../../features/returns/components/return-form';
import { ORDER_NUMBER_PATTERN } from '../../../shared/part-number';

function ReturnLine({ orderNumber, lineId }: { orderNumber: string; lineId: number }) {
  const navigate = useNavigate();
  const order = useOrder(orderNumber);
  if (order.isPending) return <LoadingState label={`Loading ${orderNumber}…`} />;
  if (order.isError) {
    return order.error instanceof ApiError && order.error.isNotFound ? (
      <ErrorState title={`No order ${orderNumber}`} message="Check the link, or choose the order from your returns page." />
    ) : (
      <ErrorState title="The order did not load" message={order.error.message} onRetry={() => order.refetch()} />
    );
  }
  const line = order.data.lines.find((l) => l.id === lineId);
  if (!line) return <ErrorState title="That line is not on this order" message={`Order ${orderNumber} has no line ${lineId}. Choose the part from your returns page.`} />;
  const left = line.quantityReturnable;

  return (
    <div className="grid gap-6 lg:grid-cols-[2fr_3fr]">
      <section aria-labelledby="return-line-heading" className="grid content-start gap-2 self-start rounded-lg bg-white p-5 ring-1 ring-cast-line">
        <h2 id="return-line-heading" className="text-lg font-bold">
          The part
        </h2>
        <p className="part-no text-lg">{line.partNumber}</p>
        <p>{line.title}</p>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="font-semibold">Order</dt>
          <dd>
            <Link to={`/orders/${encodeURIComponent(orderNumber)}`} className="part-no text-temper underline underline-offset-2">
              {orderNumber}
            </Link>
          </dd>
          <dt className="font-semibold">Dispatched</dt>
          <dd className="tabular">
            {line.quantityDispatched} of {line.quantity}
            {line.quantityDispatched < line.quantity && <span className="text-cast"> (the rest is still to come)</span>}
          </dd>
          <dt className="font-semibold">Price paid</dt>
          <dd className="tabular">{formatPrice(line.unitPriceCents)} each</dd>
          {line.coreDepositCents > 0 && (
            <>
              <dt className="font-semibold">Core deposit</dt>
              <dd className="tabular">{formatPrice(line.coreDepositCents)} each</dd>
            </>
          )}
          {line.fitmentSummary && (
            <>
              <dt className="font-semibold">Chosen for</dt>
              <dd>{line.fitmentSummary}</dd>
            </>
          )}
        </dl>
      </section>
      {left > 0 ? (
        <ReturnForm order={order.data} line={line} returnable={left} onCreated={(r) => navigate(`/returns?ref=${encodeURIComponent(r.reference)}`, { state: { created: r.reference } })} />
      ) : (
        <ErrorState
          title="Nothing left to return on this line"
          message={line.quantityDispatched === 0 ? 'This line has not been dispatched yet.' : 'Everything dispatched on this line is already on a return.'}
        />
      )}
    </div>
  );
}

export function ReturnNewRoute() {
  const me = useMe();
  const [params] = useSearchParams();
  const orderNumber = params.get('order')?.trim().toUpperCase() ?? '';
  const lineId = Number(params.get('line'));
  const hasLine = ORDER_NUMBER_PATTERN.test(orderNumber) && Number.isInteger(lineId) && lineId > 0;

  if (me.isPending) return <LoadingState label="Checking your account…" />;
  if (!me.data?.user) {
    const next = `/returns/new${params.toString() ? `?${params.toString()}` : ''}`;
    return (
      <div className="grid gap-2 py-6">
        <h1 className="text-2xl font-bold">Return a part</h1>
        <p>
          <Link to={`/sign-in?next=${encodeURIComponent(next)}`} className="font-semibold text-temper underline underline-offset-2">
            Sign in
          </Link>{' '}
          to send a part back.
        </p>
      </div>
    );
  }
  return (
    <div className="grid gap-5">
      <nav aria-label="Breadcrumb" className="text-sm text-cast">
        <Link to="/returns" className="hover:underline">
          Your returns
        </Link>{' '}
        / Return a part
      </nav>
      <h1 className="text-2xl font-bold">Return a part</h1>
      {hasLine ? <ReturnLine orderNumber={orderNumber} lineId={lineId} /> : <LinePicker />}
    </div>
  );
}
