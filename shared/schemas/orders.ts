import { z } from 'zod';
import { ORDER_STATUSES, PART_CONDITIONS, type OrderStatus } from '../allowed-values';
import { DEALER_TIER_KEYS, DELIVERY_ZONE_KEYS } from '../pricing';
import { IllustrationSpecsSchema, PhotoNameSchema } from './parts';
import { CLOCK_POSITIONS } from '../exploded-view';
import { QUANTITY_MAX } from '../order-limits';

export { QUANTITY_MAX } from '../order-limits';
export const CART_LINES_MAX = 200;
export const PURCHASE_ORDER_MAX = 40;
export const CSV_MAX_BYTES = 200_000;
export const CSV_MAX_ROWS = 500;

const quantity = z
  .number({ error: 'quantity must be a number' })
  .int('quantity must be a whole number')
  .min(1, 'quantity must be at least 1')
  .max(QUANTITY_MAX, `quantity must be at most ${QUANTITY_MAX}`);

const partNumber = z.string({ error: 'part number is required' }).trim().min(2, 'part number is required').max(40, 'part number is too long');

/** A complete unit's clocked housings, as clock positions viewed from the compressor inlet (shared/exploded-view.ts). */
export const OrientationSchema = z.object({
  compressorOutlet: z.enum(CLOCK_POSITIONS, { error: 'choose a clock position for the compressor outlet' }),
  turbineInlet: z.enum(CLOCK_POSITIONS, { error: 'choose a clock position for the turbine inlet' }),
});

export const AddCartLineSchema = z.object({
  partNumber,
  quantity,
  fitmentId: z.number().int().positive().optional(),
  allowBackorder: z.boolean().optional(),
  /** Complete units only; left out, a complete unit is built in its frame's standard position. */
  orientation: OrientationSchema.optional(),
});
export type AddCartLine = z.infer<typeof AddCartLineSchema>;

export const UpdateCartLineSchema = z
  .object({ quantity: quantity.optional(), allowBackorder: z.boolean().optional(), fitmentId: z.number().int().positive().nullable().optional() })
  .refine((v) => v.quantity !== undefined || v.allowBackorder !== undefined || v.fitmentId !== undefined, { message: 'nothing to change' });

export const BulkCartLinesSchema = z.object({
  lines: z.array(z.object({ partNumber, quantity })).min(1, 'add at least one line').max(CART_LINES_MAX, `at most ${CART_LINES_MAX} lines at once`),
});
export type BulkCartLines = z.infer<typeof BulkCartLinesSchema>;

export const DeliverySchema = z.object({
  name: z.string().trim().min(2, 'name is required').max(80, 'name is too long'),
  line1: z.string().trim().min(3, 'street address is required').max(120, 'street address is too long'),
  city: z.string().trim().min(2, 'town or city is required').max(60, 'town or city is too long'),
  postcode: z.string().trim().min(3, 'postcode is required').max(12, 'postcode is too long'),
  // No zone: the server prices freight to the postcode's zone (shared/pricing.ts zoneForPostcode).
}, { error: 'enter a delivery address' });
export type Delivery = z.infer<typeof DeliverySchema>;

export const CheckoutSchema = z.discriminatedUnion(
  'method',
  [
    z.object({
      method: z.literal('card'),
      paymentMethod: z.string().trim().min(3, 'choose a card').max(60),
      delivery: DeliverySchema,
    }),
    z.object({
      method: z.literal('account'),
      purchaseOrder: z
        .string({ error: 'purchase-order number is required' })
        .trim()
        .min(1, 'purchase-order number is required')
        .max(PURCHASE_ORDER_MAX, `purchase-order number must be at most ${PURCHASE_ORDER_MAX} characters`)
        .regex(/^[\w\- /.#]+$/, 'purchase-order number may use letters, digits, spaces and - / . #'),
      delivery: DeliverySchema.optional(),
    }),
  ],
  { error: 'choose how to pay: card or account' },
);
export type Checkout = z.infer<typeof CheckoutSchema>;

export const CartWarningSchema = z.object({ lineId: z.number().int().nullable(), message: z.string() });

export const CartLineViewSchema = z.object({
  id: z.number().int(),
  partNumber: z.string(),
  title: z.string(),
  category: z.string(),
  frameCode: z.string().nullable(),
  condition: z.enum(PART_CONDITIONS),
  quantity: z.number().int(),
  available: z.number().int(),
  allowBackorder: z.boolean(),
  backorderQuantity: z.number().int(),
  unitCents: z.number().int(),
  retailUnitCents: z.number().int(),
  lineCents: z.number().int(),
  coreDepositCents: z.number().int(),
  weightGrams: z.number().int(),
  fitment: z.object({ id: z.number().int(), name: z.string(), summary: z.string() }).nullable(),
  orientation: OrientationSchema.nullable(),
  specs: IllustrationSpecsSchema,
  photo: PhotoNameSchema,
});
export type CartLineView = z.infer<typeof CartLineViewSchema>;

export const TotalsSchema = z.object({
  retailGoodsCents: z.number().int(),
  goodsCents: z.number().int(),
  discountCents: z.number().int(),
  coreDepositCents: z.number().int(),
  freightCents: z.number().int(),
  taxCents: z.number().int(),
  totalCents: z.number().int(),
  weightGrams: z.number().int(),
});

export const CartViewSchema = z.object({
  lines: z.array(CartLineViewSchema),
  warnings: z.array(CartWarningSchema),
  notices: z.array(z.string()),
  deliveryZone: z.enum(DELIVERY_ZONE_KEYS),
  totals: TotalsSchema,
  taxRatePct: z.number(),
  buyer: z.object({ kind: z.enum(['retail', 'dealer']), tier: z.enum(DEALER_TIER_KEYS).nullable(), discountPct: z.number() }),
});
export type CartView = z.infer<typeof CartViewSchema>;

export { ORDER_STATUS_LABELS } from '../allowed-values';
export type { OrderStatus };
export const ORDER_STATUS_KEYS = ORDER_STATUSES;

export const OrderSummarySchema = z.object({
  number: z.string(),
  status: z.enum(ORDER_STATUS_KEYS),
  paymentMethod: z.enum(['card', 'account']),
  paymentState: z.string(),
  purchaseOrder: z.string().nullable(),
  totalCents: z.number().int(),
  createdAt: z.string(),
  lineCount: z.number().int(),
  hasBackorder: z.boolean(),
  /** Units that have left the warehouse: an order with any may have lines to return, whatever its status. */
  unitsDispatched: z.number().int(),
});
export type OrderSummary = z.infer<typeof OrderSummarySchema>;

export const OrderLineViewSchema = z.object({
  id: z.number().int(),
  partNumber: z.string(),
  title: z.string(),
  quantity: z.number().int(),
  quantityBackordered: z.number().int(),
  quantityPicked: z.number().int(),
  quantityDispatched: z.number().int(),
  /** Dispatched units not already on a return that is open or settled: what the buyer may still send back. */
  quantityReturnable: z.number().int(),
  unitPriceCents: z.number().int(),
  coreDepositCents: z.number().int(),
  lineCents: z.number().int(),
  fitmentSummary: z.string().nullable(),
  orientation: OrientationSchema.nullable(),
  category: z.string(),
  condition: z.enum(PART_CONDITIONS),
  /** Serials given to this line's units when they were packed (complete turbochargers and cartridges). */
  serials: z.array(z.string()),
});

export const OrderDetailSchema = OrderSummarySchema.extend({
  email: z.string(),
  paymentTermsDays: z.number().int().nullable(),
  lines: z.array(OrderLineViewSchema),
  totals: TotalsSchema.omit({ retailGoodsCents: true }).extend({ refundedCents: z.number().int() }),
  delivery: z.object({ name: z.string(), line1: z.string(), city: z.string(), postcode: z.string(), zone: z.string() }),
  dispatch: z.object({ carrier: z.string().nullable(), trackingNumber: z.string().nullable(), cartons: z.number().int().nullable() }),
  timeline: z.array(z.object({ status: z.string(), note: z.string().nullable(), at: z.string() })),
  dealer: z.object({ companyName: z.string() }).nullable(),
  /** Each dispatch (a back-order that arrives later leaves in a shipment of its own), with the carrier's tracking page. */
  shipments: z.array(
    z.object({ carrier: z.string(), trackingNumber: z.string(), trackingUrl: z.string().nullable(), cartons: z.number().int(), units: z.number().int(), at: z.string() }),
  ),
  /** Returns asked for on this order's lines. */
  returns: z.array(z.object({ reference: z.string(), lineId: z.number().int(), quantity: z.number().int(), status: z.string(), kind: z.string() })),
});
export type OrderDetail = z.infer<typeof OrderDetailSchema>;

/**
 * What the card provider said of the payment: confirmed (taken), processing (the webhook settles it), authenticate
 * (the buyer's bank asks for a check), confirming (no answer yet: the buyer must not pay again; we e-mail them).
 */
export const CHECKOUT_OUTCOMES = ['confirmed', 'processing', 'authenticate', 'confirming'] as const;
export const CheckoutResponseSchema = z.object({
  order: z.object({ number: z.string(), status: z.enum(ORDER_STATUS_KEYS), totalCents: z.number().int() }),
  nextAction: z.object({ type: z.literal('authenticate'), paymentIntentId: z.string(), clientSecret: z.string().nullable().optional() }).nullable().optional(),
  outcome: z.enum(CHECKOUT_OUTCOMES).optional(),
  message: z.string().optional(),
});
export type CheckoutResponse = z.infer<typeof CheckoutResponseSchema>;

/** One row of a quick order or an uploaded stock list, after validation. */
export const OrderRowResultSchema = z.object({
  row: z.number().int(),
  input: z.object({ partNumber: z.string(), quantity: z.string() }),
  status: z.enum(['ok', 'replaced', 'error']),
  partNumber: z.string().nullable(),
  title: z.string().nullable(),
  quantity: z.number().int().nullable(),
  available: z.number().int().nullable(),
  message: z.string().nullable(),
  suggestions: z.array(z.object({ partNumber: z.string(), title: z.string() })),
});
export type OrderRowResult = z.infer<typeof OrderRowResultSchema>;
export const ImportPreviewSchema = z.object({ rows: z.array(OrderRowResultSchema), validCount: z.number().int(), errorCount: z.number().int() });
export type ImportPreview = z.infer<typeof ImportPreviewSchema>;

export const ReorderResponseSchema = z.object({ added: z.number().int(), notices: z.array(z.string()) });
