import { Banknote, Circle, CircleCheck, CircleX, ClipboardList, Clock, FileText, Hourglass, Package, PackageCheck, Truck, Undo2, type LucideIcon } from 'lucide-react';
import { ORDER_STATUS_LABELS } from '../../../../shared/schemas/orders';

type Tone = 'temper' | 'amber' | 'machined' | 'oxide' | 'cast';

/** Each order state has a word and a shape, never colour alone. 'placed' is a timeline event, not a status. */
export const STATUS_META: Record<string, { label: string; Icon: LucideIcon; tone: Tone }> = {
  placed: { label: 'Placed', Icon: Circle, tone: 'temper' },
  pending_payment: { label: ORDER_STATUS_LABELS.pending_payment, Icon: Hourglass, tone: 'amber' },
  paid: { label: ORDER_STATUS_LABELS.paid, Icon: CircleCheck, tone: 'machined' },
  on_account: { label: ORDER_STATUS_LABELS.on_account, Icon: FileText, tone: 'temper' },
  picking: { label: ORDER_STATUS_LABELS.picking, Icon: ClipboardList, tone: 'temper' },
  packed: { label: ORDER_STATUS_LABELS.packed, Icon: Package, tone: 'temper' },
  dispatched: { label: ORDER_STATUS_LABELS.dispatched, Icon: Truck, tone: 'machined' },
  back_ordered: { label: ORDER_STATUS_LABELS.back_ordered, Icon: Clock, tone: 'amber' },
  cancelled: { label: ORDER_STATUS_LABELS.cancelled, Icon: CircleX, tone: 'oxide' },
  returned: { label: ORDER_STATUS_LABELS.returned, Icon: Undo2, tone: 'cast' },
  // Timeline events that are not order states.
  stock_arrived: { label: 'Stock arrived', Icon: PackageCheck, tone: 'machined' },
  return_requested: { label: 'Return requested', Icon: Undo2, tone: 'temper' },
  return_rejected: { label: 'Return not accepted', Icon: CircleX, tone: 'oxide' },
  invoice_paid: { label: 'Invoice paid', Icon: Banknote, tone: 'machined' },
};

export function statusMeta(status: string) {
  return STATUS_META[status] ?? { label: status.replace(/_/g, ' '), Icon: Circle, tone: 'cast' as Tone };
}

const TONE_CLASS: Record<Tone, string> = {
  temper: 'bg-temper-tint text-temper-deep border-temper/40',
  amber: 'bg-amber-tint text-amber border-amber-line/50',
  machined: 'bg-machined-tint text-machined border-machined/40',
  oxide: 'bg-oxide-tint text-oxide border-oxide/40',
  cast: 'bg-panel text-ink border-cast-line',
};

export function toneClass(tone: Tone) {
  return TONE_CLASS[tone];
}

export function OrderStatusBadge({ status }: { status: string }) {
  const { label, Icon, tone } = statusMeta(status);
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap rounded-full border px-2.5 py-0.5 text-sm font-semibold ${TONE_CLASS[tone]}`}>
      <Icon aria-hidden className="size-4" />
      {label}
    </span>
  );
}


