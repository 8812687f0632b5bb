import { AlertTriangle, CheckCircle2, Info, OctagonAlert } from 'lucide-react';
import type { ReactNode } from 'react';

export type NoticeTone = 'done' | 'warning' | 'problem' | 'info';

const TONES: Record<NoticeTone, { box: string; icon: string; Icon: typeof Info }> = {
  done: { box: 'border-machined bg-machined-tint', icon: 'text-machined', Icon: CheckCircle2 },
  warning: { box: 'border-amber-line bg-amber-tint', icon: 'text-amber', Icon: AlertTriangle },
  problem: { box: 'border-oxide bg-oxide-tint', icon: 'text-oxide', Icon: OctagonAlert },
  info: { box: 'border-cast-line bg-white', icon: 'text-cast', Icon: Info },
};

/**
 * The one box that tells a user what just happened or what is true now: a saved change, a sent mail, a problem to fix.
 * `size="floor"` is the large version read at arm's length on the warehouse floor.
 * `live` picks the announcement: `status` (polite, the default) or `alert` (interrupts; for problems).
 */
export function Notice({
  tone = 'done',
  title,
  children,
  size = 'normal',
  live = 'status',
  className = '',
}: {
  tone?: NoticeTone;
  title?: ReactNode;
  children?: ReactNode;
  size?: 'normal' | 'floor';
  live?: 'status' | 'alert' | 'off';
  className?: string;
}) {
  const look = TONES[tone];
  const floor = size === 'floor';
  const role = live === 'off' ? undefined : live;
  return (
    <div
      role={role}
      className={`flex items-start gap-3 rounded-md ${floor ? 'border-4 p-5 text-lg' : 'border p-4'} ${look.box} ${className}`}
    >
      <look.Icon aria-hidden className={`mt-0.5 shrink-0 ${floor ? 'size-7' : 'size-5'} ${look.icon}`} />
      <div className="min-w-0">
        {title && <p className={floor ? 'text-xl font-bold' : 'font-semibold'}>{title}</p>}
        {children && <div className={title ? 'text-cast' : ''}>{children}</div>}
      </div>
    </div>
  );
}
