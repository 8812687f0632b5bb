/**
 * Every status the screens show, mapped once to its word, its shape (icon) and its colour. The values come from
 * the shared schemas, and each map is a full Record over them, so a status added in shared/ does not compile here
 * until it has a word and a look.
 */
import {
  Ban,
  BadgeCheck,
  Box,
  CircleCheck,
  CircleSlash,
  CircleX,
  ClipboardList,
  Clock,
  FileText,
  Hourglass,
  MailCheck,
  Send,
  Package,
  PackageCheck,
  ReceiptText,
  RotateCcw,
  Truck,
  Undo2,
} from 'lucide-react';
import type { z } from 'zod';
import type { DealerAccountRowSchema } from '../../../shared/schemas/accounts';
import type { MailState } from '../../../shared/allowed-values';
import { MAIL_STATE_LABELS, ORDER_STATUS_LABELS, type OrderStatus } from '../../../shared/allowed-values';
import type { PickQueueItemSchema, ReturnViewSchema } from '../../../shared/schemas/warehouse';
import { STOCK_STATE_LOOKS, type StatusLook } from './stock-looks';

export { STOCK_STATE_LOOKS, TONE_PILL, TONE_TEXT, type StatusLook, type StockState, type Tone } from './stock-looks';

export type ReturnStatus = z.infer<typeof ReturnViewSchema>['status'];
export type DealerStatus = z.infer<typeof DealerAccountRowSchema>['status'];
/** Where an order stands in the Floor's queue; a back-order whose stock arrived is picked like others but marked. */
export type QueueState = z.infer<typeof PickQueueItemSchema>['ready'] | 'released';

export const ORDER_STATUS_LOOKS: Record<OrderStatus, StatusLook> = {
  pending_payment: { label: ORDER_STATUS_LABELS.pending_payment, Icon: Hourglass, tone: 'amber' },
  paid: { label: ORDER_STATUS_LABELS.paid, Icon: CircleCheck, tone: 'machined' },
  on_account: { label: ORDER_STATUS_LABELS.on_account, Icon: FileText, tone: 'temper' },
  picking: { label: ORDER_STATUS_LABELS.picking, Icon: ClipboardList, tone: 'temper' },
  packed: { label: ORDER_STATUS_LABELS.packed, Icon: Package, tone: 'temper' },
  dispatched: { label: ORDER_STATUS_LABELS.dispatched, Icon: Truck, tone: 'machined' },
  back_ordered: { label: ORDER_STATUS_LABELS.back_ordered, Icon: Clock, tone: 'amber' },
  cancelled: { label: ORDER_STATUS_LABELS.cancelled, Icon: CircleX, tone: 'oxide' },
  returned: { label: ORDER_STATUS_LABELS.returned, Icon: Undo2, tone: 'cast' },
};

export const RETURN_STATUS_LOOKS: Record<ReturnStatus, StatusLook> = {
  requested: { label: 'Authorised', Icon: Clock, tone: 'amber' },
  refunded: { label: 'Refunded', Icon: CircleCheck, tone: 'machined' },
  credited: { label: 'Credited', Icon: ReceiptText, tone: 'machined' },
  rejected: { label: 'Rejected', Icon: Ban, tone: 'oxide' },
};

export const DEALER_STATUS_LOOKS: Record<DealerStatus, StatusLook> = {
  pending: { label: 'Pending', Icon: Clock, tone: 'amber' },
  approved: { label: 'Approved', Icon: BadgeCheck, tone: 'machined' },
  declined: { label: 'Declined', Icon: CircleSlash, tone: 'oxide' },
};

export const QUEUE_STATE_LOOKS: Record<QueueState, StatusLook> = {
  pick: { label: 'To pick', Icon: Box, tone: 'temper' },
  released: { label: 'Released back-order', Icon: RotateCcw, tone: 'amber' },
  pack: { label: 'To pack', Icon: PackageCheck, tone: 'cast' },
  dispatch: { label: 'To dispatch', Icon: Truck, tone: 'machined' },
};

export const MAIL_STATE_LOOKS: Record<MailState, StatusLook> = {
  queued: { label: MAIL_STATE_LABELS.queued, Icon: Hourglass, tone: 'amber' },
  sending: { label: MAIL_STATE_LABELS.sending, Icon: Send, tone: 'temper' },
  sent: { label: MAIL_STATE_LABELS.sent, Icon: MailCheck, tone: 'machined' },
  failed: { label: MAIL_STATE_LABELS.failed, Icon: CircleX, tone: 'oxide' },
};

export const STATUS_LOOKS = {
  order: ORDER_STATUS_LOOKS,
  return: RETURN_STATUS_LOOKS,
  dealer: DEALER_STATUS_LOOKS,
  stock: STOCK_STATE_LOOKS,
  queue: QUEUE_STATE_LOOKS,
  mail: MAIL_STATE_LOOKS,
} as const;

export type StatusKind = keyof typeof STATUS_LOOKS;
export type StatusOf<K extends StatusKind> = keyof (typeof STATUS_LOOKS)[K];

/** The look of a status; a value the client does not know yet (a newer server) reads as its own words, in neutral grey. */
export function statusLook<K extends StatusKind>(kind: K, status: StatusOf<K> | string): StatusLook {
  const looks = STATUS_LOOKS[kind] as Record<string, StatusLook | undefined>;
  return looks[status as string] ?? { label: String(status).replace(/[_-]/g, ' '), Icon: Clock, tone: 'cast' };
}
