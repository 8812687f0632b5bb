import { CircleCheckBig, CircleDot, Clock, Hammer, PackageCheck, Search, Truck, Undo2, type LucideIcon } from 'lucide-react';
import type { ServiceStatus } from '../../../../shared/allowed-values';
import { SERVICE_STATUS_WORDS } from '../../../../shared/service';

const LOOKS: Record<ServiceStatus, { icon: LucideIcon; tone: string }> = {
  booked: { icon: Clock, tone: 'border-cast-line bg-panel text-ink' },
  received: { icon: PackageCheck, tone: 'border-temper bg-temper-tint text-temper-deep' },
  inspected: { icon: Search, tone: 'border-temper bg-temper-tint text-temper-deep' },
  quoted: { icon: CircleDot, tone: 'border-amber-line bg-amber-tint text-ink' },
  approved: { icon: Hammer, tone: 'border-temper bg-temper-tint text-temper-deep' },
  declined: { icon: Undo2, tone: 'border-oxide bg-oxide-tint text-oxide' },
  rebuilt: { icon: CircleCheckBig, tone: 'border-machined bg-machined-tint text-machined' },
  shipped: { icon: Truck, tone: 'border-machined bg-machined-tint text-machined' },
};

/** Where a service request stands, as a word and a shape (never colour alone). */
export function ServiceStatusBadge({ status }: { status: ServiceStatus }) {
  const look = LOOKS[status];
  const Icon = look.icon;
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-2xl border px-2.5 py-0.5 sm:whitespace-nowrap text-sm font-semibold ${look.tone}`}>
      <Icon aria-hidden className="size-4 shrink-0" />
      {SERVICE_STATUS_WORDS[status]}
    </span>
  );
}
