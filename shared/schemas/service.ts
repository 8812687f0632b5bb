import { z } from 'zod';
import { SERVICE_PAYMENT_STATES, SERVICE_STATUSES } from '../allowed-values';
import { BEARINGS } from '../catalog';
import { normalizeSerial } from '../unit-serial';
import { BENCH_QUEUE_KEYS, SERVICE_SYMPTOM_KEYS, WHEEL_DAMAGE_KEYS } from '../service';
import { APPLICATIONS } from './fitment';
import { pageFields } from './paging';
import { ShipmentFieldsSchema } from './warehouse';

export const SERVICE_PAGE_SIZE = 20;
export const SERVICE_PHOTOS_MAX = 4;
export const SERVICE_PHOTO_MAX_BYTES = 2_000_000;

/** A form sends one checkbox as a string and several as an array; both arrive here as a list. */
const listOf = <T extends z.ZodType>(item: T) => z.preprocess((v) => (v === undefined || v === '' ? [] : Array.isArray(v) ? v : [v]), z.array(item));
const yes = z.preprocess((v) => v === true || v === 'true' || v === 'on' || v === '1', z.boolean());

/**
 * Booking a unit in (multipart form: the same fields validate the form in the browser). A unit with our serial gives
 * it (the check digit is verified); one without ("no serial / not bought here") gets a serial of ours.
 */
export const ServiceBookingSchema = z
  .object({
    noSerial: yes.default(false),
    serial: z.string().trim().max(20, 'a serial is at most 20 characters').default(''),
    frameCode: z.string().trim().regex(/^[A-Z]{3}$/, 'choose the frame'),
    bearing: z.enum(BEARINGS, { error: 'choose the bearing type' }),
    symptoms: listOf(z.enum(SERVICE_SYMPTOM_KEYS)),
    symptomNotes: z.string().trim().max(1000, 'at most 1000 characters').default(''),
    application: z.enum(APPLICATIONS, { error: 'choose how the unit is used' }),
    returnName: z.string().trim().min(2, 'enter who it goes back to').max(80),
    returnLine1: z.string().trim().min(3, 'enter the street address').max(120),
    returnCity: z.string().trim().min(2, 'enter the town or city').max(60),
    returnPostcode: z.string().trim().min(3, 'enter the postcode').max(12),
  })
  .superRefine((v, ctx) => {
    if (!v.noSerial && !normalizeSerial(v.serial)) {
      ctx.addIssue({
        code: 'custom',
        path: ['serial'],
        message: v.serial ? 'that is not one of our serials (check each digit): they read like VC26-004217-5' : 'enter the serial on the unit, or tick “no serial”',
      });
    }
    if (v.symptoms.length === 0 && v.symptomNotes.length < 3) {
      ctx.addIssue({ code: 'custom', path: ['symptoms'], message: 'tick what you noticed or describe it' });
    }
  });
export type ServiceBooking = z.infer<typeof ServiceBookingSchema>;

const mm = (what: string) => z.coerce.number({ error: `enter the ${what} in mm` }).min(0, `${what} cannot be negative`).max(5, `${what} above 5 mm is not a reading`);

/** What the Bench finds on inspection (multipart: photos beside these fields). */
export const InspectionSchema = z.object({
  axialPlayMm: mm('axial play'),
  radialPlayMm: mm('radial play'),
  compressorWheel: z.enum(WHEEL_DAMAGE_KEYS, { error: 'grade the compressor wheel' }),
  turbineWheel: z.enum(WHEEL_DAMAGE_KEYS, { error: 'grade the turbine wheel' }),
  oilCompressorSide: yes.default(false),
  oilTurbineSide: yes.default(false),
  carbonTurbineSide: yes.default(false),
  housingCracks: yes.default(false),
  notes: z.string().trim().max(1000, 'at most 1000 characters').default(''),
});
export type Inspection = z.infer<typeof InspectionSchema>;

export const QuoteSchema = z.object({
  lines: z
    .array(z.object({ partNumber: z.string().trim().min(2, 'enter a part number').max(40), quantity: z.number().int('whole units').min(1, 'at least 1').max(50, 'at most 50') }))
    .min(1, 'a quote needs at least one part line')
    .max(30, 'at most 30 lines'),
  labourHours: z.number({ error: 'enter the labour hours' }).min(0.1, 'at least 0.1 hour').max(40, 'at most 40 hours').multipleOf(0.1, 'in tenths of an hour'),
  balancing: z.boolean().default(true),
  notes: z.string().trim().max(1000).default(''),
});
export type Quote = z.infer<typeof QuoteSchema>;

export const ServiceDecisionSchema = z.discriminatedUnion('method', [
  z.object({ decision: z.enum(['approve', 'decline']), method: z.literal('card'), paymentMethod: z.string().trim().min(3, 'choose a card').max(100) }),
  z.object({ decision: z.enum(['approve', 'decline']), method: z.literal('account'), purchaseOrder: z.string().trim().min(1, 'enter your purchase order').max(40) }),
]);
export type ServiceDecision = z.infer<typeof ServiceDecisionSchema>;

const gmm = (plane: string) => z.number({ error: `enter the ${plane} reading in g·mm` }).min(0).max(10_000);
const planes = z.object({ compressorGmm: gmm('compressor-plane'), turbineGmm: gmm('turbine-plane') });

export const RebuildSchema = z.object({
  balance: z.object({
    checkSpeedRpm: z.number({ error: 'enter the check speed' }).int().min(300, 'at least 300 rpm').max(300_000),
    before: planes,
    after: planes,
  }),
  test: z.object({
    oilPressureKpa: z.number({ error: 'enter the oil pressure at test' }).min(0).max(1000),
    leakCheck: z.enum(['pass', 'fail'], { error: 'record the leak check' }),
    endFloatMm: mm('end float'),
    result: z.enum(['pass', 'fail'], { error: 'record the test result' }),
    notes: z.string().trim().max(500).default(''),
  }),
});
export type Rebuild = z.infer<typeof RebuildSchema>;

export const ServiceShipSchema = ShipmentFieldsSchema;
export type ServiceShip = z.infer<typeof ServiceShipSchema>;

export const BenchScanSchema = z.object({ code: z.string().trim().min(1, 'scan a request label or a unit serial').max(60) });

const InspectionViewSchema = InspectionSchema.extend({
  limits: z.object({ axial: z.number(), radial: z.number() }),
  axialOver: z.boolean(),
  radialOver: z.boolean(),
  inspectedAt: z.string(),
  inspectedBy: z.string(),
});

export const ServiceLineSchema = z.object({
  partNumber: z.string(),
  title: z.string(),
  quantity: z.number().int(),
  retailUnitCents: z.number().int(),
  unitCents: z.number().int(),
  lineCents: z.number().int(),
});

export const ServiceEventSchema = z.object({ status: z.string(), note: z.string().nullable(), by: z.string().nullable(), at: z.string() });

export const ServiceRequestViewSchema = z.object({
  id: z.number().int(),
  reference: z.string(),
  status: z.enum(SERVICE_STATUSES),
  serial: z.string(),
  unitOrigin: z.string(),
  frameCode: z.string(),
  frameName: z.string(),
  bearing: z.enum(BEARINGS),
  application: z.enum(APPLICATIONS),
  symptoms: z.array(z.enum(SERVICE_SYMPTOM_KEYS)),
  symptomNotes: z.string(),
  customer: z.string(),
  companyName: z.string().nullable(),
  isDealer: z.boolean(),
  returnAddress: z.object({ name: z.string(), line1: z.string(), city: z.string(), postcode: z.string() }),
  photos: z.array(z.object({ name: z.string(), stage: z.string() })),
  receivedAt: z.string().nullable(),
  receivedBy: z.string().nullable(),
  inspection: InspectionViewSchema.nullable(),
  quote: z
    .object({
      lines: z.array(ServiceLineSchema),
      labourHours: z.number(),
      labourRateCents: z.number().int(),
      labourCents: z.number().int(),
      balancingCents: z.number().int(),
      partsCents: z.number().int(),
      discountCents: z.number().int(),
      taxCents: z.number().int(),
      totalCents: z.number().int(),
      notes: z.string(),
      quotedAt: z.string(),
    })
    .nullable(),
  inspectionFee: z.object({ feeCents: z.number().int(), taxCents: z.number().int(), totalCents: z.number().int() }),
  decision: z.enum(['approve', 'decline']).nullable(),
  decidedAt: z.string().nullable(),
  paymentMethod: z.enum(['card', 'account']).nullable(),
  paymentState: z.enum(SERVICE_PAYMENT_STATES),
  purchaseOrder: z.string().nullable(),
  chargeCents: z.number().int(),
  rebuild: RebuildSchema.extend({ limitPerPlaneGmm: z.number(), balancePass: z.boolean(), rebuiltAt: z.string(), rebuiltBy: z.string() }).nullable(),
  shipment: z.object({ carrier: z.string(), trackingNumber: z.string(), trackingUrl: z.string().nullable(), shippedAt: z.string() }).nullable(),
  invoiceNumber: z.string().nullable(),
  timeline: z.array(ServiceEventSchema),
  createdAt: z.string(),
});
export type ServiceRequestView = z.infer<typeof ServiceRequestViewSchema>;

export const ServiceListItemSchema = z.object({
  reference: z.string(),
  status: z.enum(SERVICE_STATUSES),
  serial: z.string(),
  frameCode: z.string(),
  customer: z.string(),
  companyName: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export const ServicePageSchema = z.object({ items: z.array(ServiceListItemSchema), ...pageFields });
export type ServicePage = z.infer<typeof ServicePageSchema>;

export const BenchQueuePageSchema = ServicePageSchema.extend({ queue: z.enum(BENCH_QUEUE_KEYS), counts: z.record(z.string(), z.number().int()) });
export type BenchQueuePage = z.infer<typeof BenchQueuePageSchema>;

/** What the Bench needs beside the request: the frame's limits and the kits that go with the unit. */
export const BenchRequestSchema = z.object({
  request: ServiceRequestViewSchema,
  limits: z.object({ axial: z.number(), radial: z.number(), balancePerPlaneGmm: z.number(), maxShaftRpm: z.number().int(), rotorMassKg: z.number() }),
  suggestedKits: z.array(z.object({ partNumber: z.string(), title: z.string(), priceCents: z.number().int(), available: z.number().int() })),
  labourRateCents: z.number().int(),
  balancingCents: z.number().int(),
});
export type BenchRequest = z.infer<typeof BenchRequestSchema>;

export const BenchScanReplySchema = z.object({ action: z.enum(['received', 'opened']), reference: z.string(), status: z.enum(SERVICE_STATUSES), message: z.string() });

export const ServiceLabelSchema = z.object({
  reference: z.string(),
  serial: z.string(),
  frameName: z.string(),
  weightKg: z.number(),
  from: z.object({ name: z.string(), line1: z.string(), city: z.string(), postcode: z.string() }),
  barcodeSvg: z.string(),
  createdAt: z.string(),
});
export type ServiceLabel = z.infer<typeof ServiceLabelSchema>;

export const ServiceInvoiceSchema = z.object({
  invoiceNumber: z.string(),
  reference: z.string(),
  serial: z.string(),
  date: z.string(),
  dueDate: z.string().nullable(),
  customer: z.string(),
  companyName: z.string().nullable(),
  address: z.object({ name: z.string(), line1: z.string(), city: z.string(), postcode: z.string() }),
  kind: z.enum(['repair', 'inspection-fee']),
  lines: z.array(z.object({ description: z.string(), quantity: z.number(), unitCents: z.number().int(), amountCents: z.number().int() })),
  discountCents: z.number().int(),
  taxCents: z.number().int(),
  totalCents: z.number().int(),
  paymentMethod: z.enum(['card', 'account']),
  paymentState: z.enum(SERVICE_PAYMENT_STATES),
  purchaseOrder: z.string().nullable(),
});
export type ServiceInvoice = z.infer<typeof ServiceInvoiceSchema>;
