/**
 * The Bench's own rules, pure so the server and the screens agree: service request numbers, the shaft-play limits an
 * inspection is held to, the balance limit a rebuilt rotor must meet, and what a quote or an inspection fee costs.
 * Decision record: docs/decisions/0013-bench-service-requests.md.
 */
import type { Bearing } from './catalog';
import { dealerUnitPriceCents, type DealerTier } from './pricing';

/** Service request numbers read `SR-7001`: 7000 plus the request's id, the way returns read RT-5001. */
export const SERVICE_REF_OFFSET = 7000;
export const serviceReference = (id: number) => `SR-${SERVICE_REF_OFFSET + id}`;
/** Service invoices read `SV-9001`: 9000 plus the request's id, apart from order numbers and credit notes. */
export const serviceInvoiceNumber = (id: number) => `SV-${9000 + id}`;

/** `SR-7001`, `sr7001`, `SR 7001`, ` SR-7001 ` → `SR-7001`; anything else → null. */
export function normalizeServiceReference(typed: string): string | null {
  const m = /^SR[\s-]*(\d{4,8})$/i.exec(typed.trim());
  if (!m) return null;
  const n = Number(m[1]);
  return n > SERVICE_REF_OFFSET ? `SR-${n}` : null;
}

export const serviceIdOf = (reference: string): number | null => {
  const r = normalizeServiceReference(reference);
  return r ? Number(r.slice(3)) - SERVICE_REF_OFFSET : null;
};

/** Symptoms customers most often describe (common practice in turbo workshops); they tick any that apply. */
export const SERVICE_SYMPTOMS = {
  'oil-smoke': 'Blue smoke or oil in the intake or exhaust',
  'shaft-play': 'Shaft moves or wobbles by hand',
  noise: 'Whistle, siren or grinding noise',
  'low-boost': 'Slow to spool or low boost',
  'wheel-contact': 'Wheel has rubbed or touched its housing',
  'oil-leak': 'Oil leaking from the centre housing',
  'season-check': 'End-of-season check, no fault noticed',
} as const;
export type ServiceSymptom = keyof typeof SERVICE_SYMPTOMS;
export const SERVICE_SYMPTOM_KEYS = Object.keys(SERVICE_SYMPTOMS) as [ServiceSymptom, ...ServiceSymptom[]];

export const WHEEL_DAMAGE = { none: 'None', light: 'Light (nicks, light rub)', heavy: 'Heavy (bent or missing blades, deep rub)' } as const;
export type WheelDamage = keyof typeof WHEEL_DAMAGE;
export const WHEEL_DAMAGE_KEYS = Object.keys(WHEEL_DAMAGE) as [WheelDamage, ...WheelDamage[]];

/** Size groups of our frames for the Bench's limits, by compressor inducer. */
export function frameSizeGroup(inducerMm: number): 'small' | 'medium' | 'large' {
  if (inducerMm < 50) return 'small';
  if (inducerMm < 75) return 'medium';
  return 'large';
}

/**
 * Largest shaft play a unit may show at inspection before its bearings are due, in mm, measured with a dial gauge at
 * the compressor nut. OUR OWN FIGURES, set from common practice (from memory): a journal-bearing shaft floats on oil,
 * so some radial play is normal and the wheels must still clear their housings; a ball-bearing cartridge has almost
 * none either way. Larger frames have larger clearances.
 */
export const SHAFT_PLAY_LIMITS_MM: Record<Bearing, Record<'small' | 'medium' | 'large', { axial: number; radial: number }>> = {
  journal: { small: { axial: 0.08, radial: 0.35 }, medium: { axial: 0.1, radial: 0.45 }, large: { axial: 0.13, radial: 0.55 } },
  ball: { small: { axial: 0.03, radial: 0.08 }, medium: { axial: 0.04, radial: 0.1 }, large: { axial: 0.05, radial: 0.12 } },
};

export function shaftPlayLimits(inducerMm: number, bearing: Bearing) {
  return SHAFT_PLAY_LIMITS_MM[bearing][frameSizeGroup(inducerMm)];
}

export function shaftPlayFlags(measured: { axialPlayMm: number; radialPlayMm: number }, limits: { axial: number; radial: number }) {
  return { axialOver: measured.axialPlayMm > limits.axial, radialOver: measured.radialPlayMm > limits.radial };
}

/**
 * The balance quality grade we hold rebuilt rotors to: G 2.5, the grade ISO 21940-11 (formerly ISO 1940-1) lists for
 * turbo-compressors and gas turbines (from memory). Its permissible residual unbalance is
 * U_per [g·mm] = 1000 · G [mm/s] · m [kg] / ω [rad/s], with ω at the maximum service speed, shared equally between the
 * two correction planes of a rotor whose planes sit symmetrically (the standard's simple allocation, from memory).
 */
export const BALANCE_GRADE_MM_S = 2.5;

/** Mass of a frame's rotating assembly (shaft and both wheels): OUR OWN FIGURE, 4 % of the complete unit's weight. */
export const rotorMassKg = (unitWeightKg: number) => Math.round(unitWeightKg * 0.04 * 1000) / 1000;

export function permissibleUnbalanceGmm(rotorKg: number, maxServiceRpm: number, grade = BALANCE_GRADE_MM_S): number {
  const omega = (2 * Math.PI * maxServiceRpm) / 60;
  return (1000 * grade * rotorKg) / omega;
}

/** Per correction plane (compressor side, turbine side), rounded down to 0.001 g·mm so a reading at the limit shown passes. */
export function balanceLimitPerPlaneGmm(unitWeightKg: number, maxServiceRpm: number): number {
  return Math.floor((permissibleUnbalanceGmm(rotorMassKg(unitWeightKg), maxServiceRpm) / 2) * 1000) / 1000;
}

export function balancePasses(after: { compressorGmm: number; turbineGmm: number }, limitPerPlane: number): boolean {
  return after.compressorGmm <= limitPerPlane && after.turbineGmm <= limitPerPlane;
}

/** The Bench's default rates (a deployment sets its own: SERVICE_LABOUR_RATE_CENTS, SERVICE_INSPECTION_FEE_CENTS). */
export const DEFAULT_LABOUR_RATE_CENTS = 9_500;
export const DEFAULT_INSPECTION_FEE_CENTS = 6_500;
export const DEFAULT_BALANCING_CENTS = 4_800;

export interface QuoteLineInput {
  partNumber: string;
  quantity: number;
  retailUnitCents: number;
}

export interface QuoteTotals {
  lines: Array<QuoteLineInput & { unitCents: number; lineCents: number }>;
  partsRetailCents: number;
  partsCents: number;
  discountCents: number;
  labourCents: number;
  balancingCents: number;
  taxCents: number;
  totalCents: number;
}

const roundCents = (v: number) => Math.sign(v) * Math.round(Math.abs(v));

/**
 * A quote's money, the way orders are priced (shared/pricing.ts): a dealer's trade discount applies to the parts (as
 * on an order), not to labour or balancing; tax applies to parts, labour and balancing together. Return carriage is
 * included in the labour (our rule).
 */
export function priceQuote(input: { lines: QuoteLineInput[]; labourHours: number; labourRateCents: number; balancingCents: number; tier: DealerTier | null; taxRatePct: number }): QuoteTotals {
  const lines = input.lines.map((l) => {
    const unitCents = input.tier ? dealerUnitPriceCents(l.retailUnitCents, input.tier) : l.retailUnitCents;
    return { ...l, unitCents, lineCents: unitCents * l.quantity };
  });
  const partsRetailCents = lines.reduce((s, l) => s + l.retailUnitCents * l.quantity, 0);
  const partsCents = lines.reduce((s, l) => s + l.lineCents, 0);
  const labourCents = roundCents(input.labourHours * input.labourRateCents);
  const taxCents = roundCents(((partsCents + labourCents + input.balancingCents) * input.taxRatePct) / 100);
  return {
    lines,
    partsRetailCents,
    partsCents,
    discountCents: partsRetailCents - partsCents,
    labourCents,
    balancingCents: input.balancingCents,
    taxCents,
    totalCents: partsCents + labourCents + input.balancingCents + taxCents,
  };
}

/** The inspection fee with its tax: what a customer who declines the quote pays. */
export function priceInspectionFee(feeCents: number, taxRatePct: number) {
  const taxCents = roundCents((feeCents * taxRatePct) / 100);
  return { feeCents, taxCents, totalCents: feeCents + taxCents };
}

/** Which Bench queue a status belongs to. */
export const BENCH_QUEUES = {
  booked: { label: 'Booked — awaiting arrival', statuses: ['booked'] },
  received: { label: 'Received — to inspect and quote', statuses: ['received', 'inspected'] },
  quoted: { label: 'Quoted — awaiting the customer', statuses: ['quoted'] },
  approved: { label: 'Approved — to rebuild', statuses: ['approved'] },
  'to-ship': { label: 'To ship back', statuses: ['rebuilt', 'declined'] },
  closed: { label: 'Closed', statuses: ['shipped'] },
} as const;
export type BenchQueue = keyof typeof BENCH_QUEUES;
export const BENCH_QUEUE_KEYS = Object.keys(BENCH_QUEUES) as [BenchQueue, ...BenchQueue[]];

/** Plain trade words for each status, for the customer and the Bench alike. */
export const SERVICE_STATUS_WORDS = {
  booked: 'Booked in — send the unit',
  received: 'Received at the Bench',
  inspected: 'Inspected',
  quoted: 'Quote ready — your decision',
  approved: 'Approved — being rebuilt',
  declined: 'Declined — returning unrepaired',
  rebuilt: 'Rebuilt and tested',
  shipped: 'Shipped back',
} as const;
