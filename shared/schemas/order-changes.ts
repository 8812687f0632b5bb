import { z } from 'zod';
import { ORDER_CHANGE_KINDS, ORDER_CHANGE_REFUND_STATES, ORDER_CHANGE_SETTLEMENTS } from '../allowed-values';
import { QUANTITY_MAX } from './orders';

/** The new quantity of each line the buyer changes; 0 takes the line off. Only lowering is possible. */
export const ChangeOrderSchema = z.object({
  lines: z
    .array(
      z.object({
        lineId: z.number().int().positive(),
        quantity: z.number({ error: 'quantity must be a number' }).int('quantity must be a whole number').min(0, 'quantity cannot be below 0').max(QUANTITY_MAX),
      }),
    )
    .min(1, 'change at least one line')
    .max(200),
});
export type ChangeOrder = z.infer<typeof ChangeOrderSchema>;

/** One line as a change left it: 0 after means the line went. */
export const OrderChangeLineSchema = z.object({ partNumber: z.string(), title: z.string(), before: z.number().int(), after: z.number().int() });
export type OrderChangeLine = z.infer<typeof OrderChangeLineSchema>;

export const OrderChangeViewSchema = z.object({
  id: z.number().int(),
  kind: z.enum(ORDER_CHANGE_KINDS),
  lines: z.array(OrderChangeLineSchema),
  beforeTotalCents: z.number().int(),
  afterTotalCents: z.number().int(),
  adjustmentCents: z.number().int(),
  settlement: z.enum(ORDER_CHANGE_SETTLEMENTS),
  refundState: z.enum(ORDER_CHANGE_REFUND_STATES).nullable(),
  createdAt: z.string(),
});
export type OrderChangeView = z.infer<typeof OrderChangeViewSchema>;

/** What the order page may offer: change quantities, cancel, or neither (with the reason). */
export const OrderChangeabilitySchema = z.object({
  canChange: z.boolean(),
  canCancel: z.boolean(),
  reason: z.string().nullable(),
});
export type OrderChangeability = z.infer<typeof OrderChangeabilitySchema>;

export const OrderChangeResultSchema = z.object({ change: OrderChangeViewSchema, message: z.string() });
export type OrderChangeResult = z.infer<typeof OrderChangeResultSchema>;

/** The order page's second read: what may be done now and what was done before. */
export const OrderChangesSchema = z.object({ changeability: OrderChangeabilitySchema, changes: z.array(OrderChangeViewSchema) });
export type OrderChanges = z.infer<typeof OrderChangesSchema>;
