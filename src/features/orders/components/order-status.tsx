import { Banknote, Circle, CircleAlert, CircleX, PackageCheck, PencilLine, Undo2 } from 'lucide-react';
import { ORDER_STATUS_LOOKS, type StatusLook } from '../../../components/ui/status-looks';

/** The order's states plus the timeline's own events; 'placed' is a timeline event, not a status. */
const TIMELINE_LOOKS: Record<string, StatusLook> = {
  placed: { label: 'Placed', Icon: Circle, tone: 'temper' },
  ...ORDER_STATUS_LOOKS,
  stock_arrived: { label: 'Stock arrived', Icon: PackageCheck, tone: 'machined' },
  return_requested: { label: 'Return requested', Icon: Undo2, tone: 'temper' },
  return_rejected: { label: 'Return not accepted', Icon: CircleX, tone: 'oxide' },
  invoice_paid: { label: 'Invoice paid', Icon: Banknote, tone: 'machined' },
  changed: { label: 'Changed by you', Icon: PencilLine, tone: 'temper' },
  payment_refunded: { label: 'Refunded to card', Icon: Banknote, tone: 'machined' },
  payment_alert: { label: 'Payment notice', Icon: CircleAlert, tone: 'amber' },
};

export function statusMeta(status: string): StatusLook {
  return TIMELINE_LOOKS[status] ?? { label: status.replace(/_/g, ' '), Icon: Circle, tone: 'cast' };
}
