import { z } from 'zod';
import { CATEGORY_SLUGS } from '../catalog';
import { ORDER_STATUS_KEYS, OrientationSchema } from './orders';
import { IllustrationSpecsSchema, PhotoNameSchema } from './parts';
import { pageFields, pageQuerySchema } from './paging';

export const CARRIERS = ['Cobbleline Freight', 'Tern Parcel', 'Nightjar Overnight', 'Customer collect'] as const;

const partNumber = z.string().trim().min(2, 'scan or type a part number').max(40, 'part number is too long');
const binCode = z.string().trim().regex(/^[A-Z]-\d{2}-\d$/, 'bin code looks like A-01-2');

export const PickSchema = z.object({
  lineId: z.number({ error: 'choose a line' }).int().positive(),
  scannedPartNumber: partNumber,
  quantity: z.number({ error: 'quantity must be a number' }).int('quantity must be a whole number').min(0).max(999),
  /** The bin is short: what is not picked now becomes a back-order. */
  short: z.boolean().optional(),
});
export type Pick = z.infer<typeof PickSchema>;

export const PackSchema = z.object({
  cartons: z.number({ error: 'enter the number of cartons' }).int('cartons must be a whole number').min(1, 'at least one carton').max(50, 'at most 50 cartons'),
  weightKg: z.number({ error: 'enter the packed weight' }).positive('weight must be above 0').max(2000, 'weight must be at most 2000 kg'),
});

/** The carrier and tracking number a parcel leaves with: an order's dispatch, a serviced unit going back. */
export const ShipmentFieldsSchema = z.object({
  carrier: z.enum(CARRIERS, { error: 'choose a carrier' }),
  trackingNumber: z
    .string()
    .trim()
    .min(4, 'enter the tracking number')
    .max(40, 'tracking number is too long')
    .regex(/^[A-Za-z0-9-]+$/, 'tracking number may use letters, digits and dashes'),
});

export const DispatchSchema = PackSchema.partial().extend(ShipmentFieldsSchema.shape);
export type Dispatch = z.infer<typeof DispatchSchema>;

export const GoodsInSchema = z.object({
  partNumber,
  binCode,
  quantity: z.number().int('quantity must be a whole number').min(1, 'at least 1').max(10_000),
  note: z.string().trim().max(120).optional(),
});

export const AdjustmentSchema = z.object({
  partNumber,
  binCode,
  delta: z.number().int('change must be a whole number').min(-10_000).max(10_000).refine((d) => d !== 0, 'the change cannot be 0'),
  reason: z.string().trim().min(3, 'give a reason').max(120),
});

export const PickLineSchema = z.object({
  lineId: z.number().int(),
  orderNumber: z.string(),
  partNumber: z.string(),
  title: z.string(),
  category: z.enum(CATEGORY_SLUGS),
  specs: IllustrationSpecsSchema,
  photo: PhotoNameSchema,
  binCode: z.string().nullable(),
  walkOrder: z.number().int().nullable(),
  quantity: z.number().int(),
  toPick: z.number().int(),
  picked: z.number().int(),
  backordered: z.number().int(),
  fitmentSummary: z.string().nullable(),
  /** A complete unit's clocked housings, to check or set before it is packed. */
  orientation: OrientationSchema.nullable(),
});
export type PickLine = z.infer<typeof PickLineSchema>;

export const PickQueueItemSchema = z.object({
  number: z.string(),
  status: z.enum(ORDER_STATUS_KEYS),
  paymentMethod: z.enum(['card', 'account']),
  customer: z.string(),
  createdAt: z.string(),
  lines: z.number().int(),
  unitsToPick: z.number().int(),
  ready: z.enum(['pick', 'pack', 'dispatch']),
  releasedBackorder: z.boolean(),
  weightGrams: z.number().int(),
});
export const PICK_QUEUE_PAGE_SIZE = 50;
/** The pick queue's filters: order number or customer, state (released = a back-order whose stock came), payment. */
export const PickQueueQuerySchema = pageQuerySchema(PICK_QUEUE_PAGE_SIZE).extend({
  q: z.string().trim().max(60, 'search must be at most 60 characters').optional(),
  state: z.enum(['pick', 'released', 'pack', 'dispatch'], { error: 'state must be pick, released, pack or dispatch' }).optional(),
  payment: z.enum(['card', 'account'], { error: 'payment must be card or account' }).optional(),
});
export type PickQueueQuery = z.infer<typeof PickQueueQuerySchema>;
/** One page of the queue, oldest first; `total` counts every order that matches the filters. */
export const PickQueueSchema = z.object({ items: z.array(PickQueueItemSchema), ...pageFields });

export const PickListSchema = z.object({
  orders: z.array(z.object({ number: z.string(), status: z.enum(ORDER_STATUS_KEYS), customer: z.string(), deliveryZone: z.string() })),
  lines: z.array(PickLineSchema),
});
export type PickList = z.infer<typeof PickListSchema>;

export const PickResultSchema = z.object({ line: PickLineSchema, orderStatus: z.enum(ORDER_STATUS_KEYS), message: z.string() });

export const LowStockSchema = z.object({
  items: z.array(z.object({ partNumber: z.string(), title: z.string(), available: z.number().int(), onHand: z.number().int(), minStock: z.number().int(), waitingBackorders: z.number().int() })),
});

export const StockDetailSchema = z.object({
  partNumber: z.string(),
  title: z.string(),
  bins: z.array(z.object({ binCode: z.string(), onHand: z.number().int(), reserved: z.number().int(), ledgerOnHand: z.number().int(), ledgerReserved: z.number().int() })),
  movements: z.array(z.object({ id: z.number().int(), binCode: z.string(), kind: z.string(), onHandDelta: z.number().int(), reservedDelta: z.number().int(), orderNumber: z.string().nullable(), note: z.string().nullable(), createdAt: z.string() })),
});

export const RETURN_KINDS = { 'wrong-part': 'Wrong part', faulty: 'Faulty', core: 'Exchange core' } as const;
export type ReturnKind = keyof typeof RETURN_KINDS;
export const RETURN_KIND_KEYS = Object.keys(RETURN_KINDS) as [ReturnKind, ...ReturnKind[]];
export const CONDITION_GRADES = { 'as-new': 'As new, resaleable', rebuildable: 'Rebuildable core', damaged: 'Damaged', scrap: 'Scrap / not rebuildable' } as const;
export type ConditionGrade = keyof typeof CONDITION_GRADES;
export const CONDITION_GRADE_KEYS = Object.keys(CONDITION_GRADES) as [ConditionGrade, ...ConditionGrade[]];
export const RETURN_PHOTO_MAX_BYTES = 2_000_000;
export const RETURN_PHOTOS_MAX = 4;

/** Fields of the multipart return request (photos come as files named "photos"). */
export const ReturnRequestSchema = z.object({
  orderNumber: z.string().trim().min(3).max(20),
  lineId: z.coerce.number().int().positive(),
  kind: z.enum(RETURN_KIND_KEYS, { error: 'choose why it comes back' }),
  quantity: z.coerce.number().int('quantity must be a whole number').min(1, 'at least 1').max(999),
  reason: z.string().trim().min(3, 'tell us what is wrong, or that it is a core').max(500, 'at most 500 characters'),
});
export type ReturnRequest = z.infer<typeof ReturnRequestSchema>;

const decisionReason = z.string().trim().min(3, 'give a reason').max(300, 'at most 300 characters');

export const ReturnDecisionSchema = z.discriminatedUnion('decision', [
  z.object({ decision: z.literal('core-refund'), conditionGrade: z.enum(CONDITION_GRADE_KEYS) }),
  z.object({ decision: z.literal('full-refund'), conditionGrade: z.enum(CONDITION_GRADE_KEYS), restock: z.boolean().optional() }),
  z.object({
    decision: z.literal('partial-refund'),
    conditionGrade: z.enum(CONDITION_GRADE_KEYS),
    amountCents: z.number().int('amount must be whole cents').min(1, 'amount must be above 0'),
    /** Why less than the most: the customer reads it in the decision. */
    reason: decisionReason,
    restock: z.boolean().optional(),
  }),
  z.object({ decision: z.literal('reject'), conditionGrade: z.enum(CONDITION_GRADE_KEYS), rejectReason: decisionReason }),
]);
export type ReturnDecision = z.infer<typeof ReturnDecisionSchema>;

export const ReturnViewSchema = z.object({
  id: z.number().int(),
  reference: z.string(),
  orderNumber: z.string(),
  partNumber: z.string(),
  title: z.string(),
  quantity: z.number().int(),
  kind: z.enum(RETURN_KIND_KEYS),
  reason: z.string(),
  status: z.enum(['requested', 'refunded', 'credited', 'rejected']),
  conditionGrade: z.enum(CONDITION_GRADE_KEYS).nullable(),
  decision: z.string().nullable(),
  refundCents: z.number().int(),
  rejectReason: z.string().nullable(),
  decisionReason: z.string().nullable(),
  creditNoteNumber: z.string().nullable(),
  paymentMethod: z.enum(['card', 'account']),
  /** What a refund may be at most: the line's value (a core's deposit), capped by what is left of the payment. */
  maxRefundCents: z.number().int(),
  coreDepositCents: z.number().int(),
  photos: z.array(z.string()),
  customer: z.string(),
  createdAt: z.string(),
  decidedAt: z.string().nullable(),
});
export type ReturnView = z.infer<typeof ReturnViewSchema>;

export type ReturnDecisionKey = ReturnDecision['decision'];

/**
 * The decisions that fit each kind of return. A core is the customer's old unit coming back for the deposit: it
 * settles only the deposit (all of it, part of it, or none), never the exchange unit the customer keeps. A wrong or
 * faulty part comes back in place of what was bought: its refund is the line's value. The server refuses the rest.
 */
export const DECISIONS_FOR_KIND: Record<ReturnKind, readonly ReturnDecisionKey[]> = {
  core: ['core-refund', 'partial-refund', 'reject'],
  'wrong-part': ['full-refund', 'partial-refund', 'reject'],
  faulty: ['full-refund', 'partial-refund', 'reject'],
};
/** Only a returned part may go back on the shelf; a core goes to the rebuild bench. */
export const kindRestocks = (kind: ReturnKind) => kind !== 'core';

export const RETURNS_PAGE_SIZE = 20;
export const ReturnsPageSchema = z.object({
  items: z.array(ReturnViewSchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type ReturnsPage = z.infer<typeof ReturnsPageSchema>;

/** A return reference as typed or scanned: "RT-5001", "rt5001" and "RT 5001" are the same return. */
export function normalizeReturnReference(input: string): string | null {
  const m = /^\s*RT[\s-]*(\d{1,9})\s*$/i.exec(input);
  return m ? `RT-${m[1]}` : null;
}

/** What a printed return label carries; the barcode is Code 128 of the reference, drawn by the server as SVG. */
export const ReturnLabelSchema = z.object({
  reference: z.string(),
  orderNumber: z.string(),
  partNumber: z.string(),
  title: z.string(),
  quantity: z.number().int(),
  kind: z.enum(RETURN_KIND_KEYS),
  createdAt: z.string(),
  from: z.object({ name: z.string(), line1: z.string(), city: z.string(), postcode: z.string() }),
  barcodeSvg: z.string(),
});
export type ReturnLabel = z.infer<typeof ReturnLabelSchema>;
