import { RotateCw } from 'lucide-react';
import { orientationText, type Orientation } from '../../../shared/exploded-view';

/** A complete unit's housing positions on a cart, order, pick or packing line; nothing for other parts. */
export function OrientationNote({ orientation, className = 'text-sm' }: { orientation: Orientation | null | undefined; className?: string }) {
  if (!orientation) return null;
  return (
    <span className={`flex items-start gap-1 ${className}`} data-orientation={`${orientation.compressorOutlet} ${orientation.turbineInlet}`}>
      <RotateCw aria-hidden className="mt-0.5 size-4 shrink-0 text-temper print:hidden" />
      <span>{orientationText(orientation)}</span>
    </span>
  );
}
