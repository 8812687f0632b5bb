import { z } from 'zod';
import { ORDER_STATUS_KEYS } from '../../../../shared/schemas/orders';

// Answers the contract describes inline rather than in shared/schemas/warehouse.ts; they can move there if the server wants them.
export const PackReplySchema = z.object({ status: z.enum(ORDER_STATUS_KEYS) });

export const DispatchReplySchema = z.object({
  status: z.enum(ORDER_STATUS_KEYS),
  shipment: z.object({ carrier: z.string(), trackingNumber: z.string(), cartons: z.number().int().nullable(), units: z.number().int() }),
});
export type DispatchReply = z.infer<typeof DispatchReplySchema>;

export const GoodsInReplySchema = z.object({
  partNumber: z.string(),
  binCode: z.string(),
  onHand: z.number().int(),
  released: z.array(z.object({ orderNumber: z.string(), quantity: z.number().int() })),
  /** The goods-in receipt (GI-123): its labels print from /floor/labels?receipts=. */
  receipt: z.string(),
  quantity: z.number().int(),
});
export type GoodsInReply = z.infer<typeof GoodsInReplySchema>;

export const AdjustmentReplySchema = z.object({ onHand: z.number().int(), reserved: z.number().int() });

export const BinsSchema = z.object({ items: z.array(z.object({ code: z.string(), zone: z.string(), walkOrder: z.number().int() })) });
export type Bin = z.infer<typeof BinsSchema>['items'][number];
