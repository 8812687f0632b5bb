import { z } from 'zod';
import { BEARINGS } from '../catalog';
import { UNIT_EVENT_KINDS, UNIT_ORIGINS } from '../allowed-values';
import { APPLICATIONS } from './fitment';

export const MY_UNITS_PAGE_SIZE = 20;

/** How a unit is used, in the shop's words (the fitment check's applications). */
export const APPLICATION_LABELS: Record<(typeof APPLICATIONS)[number], string> = {
  street: 'Street',
  circuit: 'Circuit',
  drag: 'Drag',
  offroad: 'Off-road',
  marine: 'Marine',
};
export const SERVICE_INTERVAL_MONTHS = { min: 1, max: 60 } as const;

/** The history lines that count as a service: after one of these, the unit's interval starts again. */
export const SERVICE_EVENT_KINDS = ['inspected', 'rebuilt', 'tested', 'shipped'] as const;

/** Each history line's kind in the shop's words. */
export const UNIT_EVENT_LABELS: Record<(typeof UNIT_EVENT_KINDS)[number], string> = {
  sold: 'Sold',
  registered: 'Registered',
  'booked-in': 'Booked in',
  received: 'Received at the Bench',
  inspected: 'Inspected',
  quoted: 'Quoted',
  approved: 'Quote approved',
  declined: 'Quote declined',
  rebuilt: 'Rebuilt',
  tested: 'Tested',
  shipped: 'Sent back',
  'log-uploaded': 'Shaft-speed log',
  'reminder-sent': 'Service reminder',
  note: 'Note',
};

export const UnitSummarySchema = z.object({
  serial: z.string(),
  partNumber: z.string().nullable(),
  title: z.string().nullable(),
  category: z.string().nullable(),
  frameCode: z.string().nullable(),
  bearing: z.enum(BEARINGS),
  application: z.enum(APPLICATIONS),
  origin: z.enum(UNIT_ORIGINS),
  since: z.string(),
  /** When it last came through the Bench, if it has. */
  lastServiceAt: z.string().nullable(),
  intervalMonths: z.number().int(),
  /** YYYY-MM-DD: the last service (or the sale) plus the interval for its bearing and use. */
  nextServiceDue: z.string(),
});
export type UnitSummary = z.infer<typeof UnitSummarySchema>;

export const MyUnitsPageSchema = z.object({
  items: z.array(UnitSummarySchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type MyUnitsPage = z.infer<typeof MyUnitsPageSchema>;

export const MyUnitsQuerySchema = z.object({ page: z.coerce.number().int().min(1).max(10_000).catch(1) });

export const UnitEventSchema = z.object({
  kind: z.enum(UNIT_EVENT_KINDS),
  summary: z.string(),
  ref: z.string().nullable(),
  at: z.string(),
});
export type UnitEvent = z.infer<typeof UnitEventSchema>;

export const UnitLogSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  frameCode: z.string(),
  rowCount: z.number().int(),
  durationS: z.number(),
  createdAt: z.string(),
  /** The log on its compressor map, for the one whose saved check it went with; null for anyone else. */
  mapLink: z.string().nullable(),
});
export type UnitLog = z.infer<typeof UnitLogSchema>;

export const UnitHistorySchema = z.object({
  unit: UnitSummarySchema,
  /** Who has it now, as staff see it (buyer and trade account); null for the owner's own view. */
  owner: z.object({ name: z.string(), company: z.string().nullable() }).nullable(),
  events: z.array(UnitEventSchema),
  logs: z.array(UnitLogSchema),
  /** The owner (or someone on their trade account) may set its use and upload logs for it. */
  isOwner: z.boolean(),
  /** The viewer's saved fitment checks: a log is laid on the map through the engine of one of them. */
  savedChecks: z.array(z.object({ id: z.number().int(), name: z.string() })),
});
export type UnitHistory = z.infer<typeof UnitHistorySchema>;

export const SetApplicationSchema = z.object({ application: z.enum(APPLICATIONS, { error: 'choose how the unit is used' }) });
export type SetApplication = z.infer<typeof SetApplicationSchema>;

/** The form fields beside a log uploaded from a unit's page. */
export const UnitLogUploadSchema = z.object({
  savedFitmentId: z.coerce.number({ error: 'choose the saved check of the engine this unit is on' }).int().positive('choose the saved check of the engine this unit is on'),
  name: z
    .string()
    .trim()
    .max(80, 'name must be at most 80 characters')
    .optional()
    .transform((v) => (v ? v : undefined)),
});
export type UnitLogUpload = z.infer<typeof UnitLogUploadSchema>;

export const ServiceIntervalSchema = z.object({
  bearing: z.enum(BEARINGS),
  application: z.enum(APPLICATIONS),
  months: z.number().int(),
  note: z.string(),
  updatedAt: z.string(),
  updatedBy: z.string().nullable(),
});
export type ServiceInterval = z.infer<typeof ServiceIntervalSchema>;
export const ServiceIntervalsSchema = z.object({ items: z.array(ServiceIntervalSchema) });

export const ServiceIntervalEditSchema = z.object({
  months: z.coerce
    .number({ error: 'enter a number of months' })
    .int('enter whole months')
    .min(SERVICE_INTERVAL_MONTHS.min, `at least ${SERVICE_INTERVAL_MONTHS.min} month`)
    .max(SERVICE_INTERVAL_MONTHS.max, `at most ${SERVICE_INTERVAL_MONTHS.max} months`),
});
export type ServiceIntervalEdit = z.infer<typeof ServiceIntervalEditSchema>;
