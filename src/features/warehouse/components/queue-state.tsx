import type { z } from 'zod';
import type { PickQueueItemSchema } from '../../../../shared/schemas/warehouse';
import { QUEUE_STATE_LOOKS, type QueueState } from '../../../components/ui/status-looks';

type QueueItem = z.infer<typeof PickQueueItemSchema>;
export type { QueueState };

export const QUEUE_STATE_LABELS = Object.fromEntries(Object.entries(QUEUE_STATE_LOOKS).map(([k, v]) => [k, v.label])) as Record<QueueState, string>;

/** A back-order whose stock arrived is picked like any other order, but the picker should see it came back. */
export const queueState = (item: QueueItem): QueueState => (item.ready === 'pick' && item.releasedBackorder ? 'released' : item.ready);
