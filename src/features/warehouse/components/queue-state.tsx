import { Box, PackageCheck, RotateCcw, Truck } from 'lucide-react';
import type { z } from 'zod';
import type { PickQueueItemSchema } from '../../../../shared/schemas/warehouse';

type QueueItem = z.infer<typeof PickQueueItemSchema>;
export type QueueState = 'pick' | 'pack' | 'dispatch' | 'released';

export const QUEUE_STATE_LABELS: Record<QueueState, string> = {
  pick: 'To pick',
  released: 'Released back-order',
  pack: 'To pack',
  dispatch: 'To dispatch',
};

/** A back-order whose stock arrived is picked like any other order, but the picker should see it came back. */
export const queueState = (item: QueueItem): QueueState => (item.ready === 'pick' && item.releasedBackorder ? 'released' : item.ready);

const shapes = {
  pick: { Icon: Box, cls: 'border-temper text-temper-deep bg-temper-tint' },
  released: { Icon: RotateCcw, cls: 'border-amber-line text-amber bg-amber-tint' },
  pack: { Icon: PackageCheck, cls: 'border-cast text-ink bg-panel' },
  dispatch: { Icon: Truck, cls: 'border-machined text-machined bg-machined-tint' },
} as const;

/** The state as a word and a shape, never colour alone. */
export function QueueStateBadge({ state }: { state: QueueState }) {
  const { Icon, cls } = shapes[state];
  return (
    <span className={`inline-flex items-center gap-1.5 whitespace-nowrap rounded-full border px-2.5 py-0.5 font-semibold ${cls}`}>
      <Icon aria-hidden className="size-4" />
      {QUEUE_STATE_LABELS[state]}
    </span>
  );
}
