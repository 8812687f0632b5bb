import type { OrderDetail } from '../../../../shared/schemas/orders';
import { formatDateTime } from '../../../../shared/format';
import { TONE_PILL } from '../../../components/ui/status-looks';
import { statusMeta } from './order-status';

const FULFILMENT = ['picking', 'packed', 'dispatched'] as const;

/** What happened to the order, oldest first, then the steps still to come drawn as open, dashed markers. */
export function OrderTimeline({ order }: { order: OrderDetail }) {
  const reached = new Set(order.timeline.map((e) => e.status));
  const closed = order.status === 'cancelled' || order.status === 'returned';
  const upcoming: string[] = [];
  if (!closed) {
    if (order.paymentMethod === 'card' && !reached.has('paid')) upcoming.push('paid');
    for (const s of FULFILMENT) if (!reached.has(s)) upcoming.push(s);
  }
  return (
    <ol className="relative grid gap-0" aria-label="Order timeline">
      {order.timeline.map((e, i) => {
        const { label, Icon, tone } = statusMeta(e.status);
        const last = i === order.timeline.length - 1 && upcoming.length === 0;
        return (
          <li key={`${e.status}-${e.at}-${i}`} className="relative grid grid-cols-[2.25rem_1fr] gap-3 pb-4">
            {!last && <span aria-hidden className="absolute left-[1.05rem] top-9 bottom-0 w-0.5 bg-cast-line" />}
            <span className={`relative z-10 inline-flex size-9 items-center justify-center rounded-full border-2 ${TONE_PILL[tone]}`}>
              <Icon aria-hidden className="size-5" />
            </span>
            <div>
              <p className="font-semibold">{label}</p>
              <p className="text-sm text-cast">
                <time dateTime={e.at}>{formatDateTime(e.at)}</time>
                {e.note && <> · {e.note}</>}
              </p>
            </div>
          </li>
        );
      })}
      {upcoming.map((s, i) => {
        const { label, Icon } = statusMeta(s);
        const waiting = s === 'paid' && order.status === 'pending_payment';
        return (
          <li key={s} className="relative grid grid-cols-[2.25rem_1fr] gap-3 pb-4 text-cast">
            {i < upcoming.length - 1 && <span aria-hidden className="absolute left-[1.05rem] top-9 bottom-0 w-0.5 border-l-2 border-dashed border-cast-line" />}
            <span className="relative z-10 inline-flex size-9 items-center justify-center rounded-full border-2 border-dashed border-cast-line bg-white">
              <Icon aria-hidden className="size-5" />
            </span>
            <div>
              <p className="font-semibold">{label}</p>
              <p className="text-sm">{waiting ? 'Waiting for the payment service to confirm' : 'To come'}</p>
            </div>
          </li>
        );
      })}
    </ol>
  );
}
