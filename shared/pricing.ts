/**
 * Prices, freight and tax, in integer cents. Pure: the server computes every total with these, and ignores any
 * price a client sends. The freight table and tiers are the demo distributor's own (invented).
 */

export const DEALER_TIERS = {
  standard: { label: 'Standard trade', discountPct: 10 },
  preferred: { label: 'Preferred trade', discountPct: 15 },
  partner: { label: 'Partner workshop', discountPct: 20 },
} as const;
export type DealerTier = keyof typeof DEALER_TIERS;
export const DEALER_TIER_KEYS = Object.keys(DEALER_TIERS) as [DealerTier, ...DealerTier[]];

export const DELIVERY_ZONES = {
  local: 'Local (same region)',
  national: 'National',
  remote: 'Remote and islands',
} as const;
export type DeliveryZone = keyof typeof DELIVERY_ZONES;
export const DELIVERY_ZONE_KEYS = Object.keys(DELIVERY_ZONES) as [DeliveryZone, ...DeliveryZone[]];

/**
 * The freight zone of a delivery address, from the letters that open its postcode (the postcode area). The server
 * prices freight with this, never with a zone the buyer picks; the checkout shows the same answer as the buyer types.
 * The areas are the demo distributor's own (invented), around its warehouse at Emberleigh.
 */
export const POSTCODE_AREA_ZONES: Readonly<Record<string, DeliveryZone>> = {
  EM: 'local', // Emberleigh, where the warehouse is
  QF: 'local', // Quenchfold
  KV: 'local', // Kettlevale
  PF: 'remote', // Port Fennick, across the firth
  GX: 'remote', // the Gannet Isles
  VQ: 'remote', // Vorrin Quay and the outer isles
};

/** "em4 2qt" → "EM": the leading letters of a postcode, or null when it does not start with a letter. */
export function postcodeArea(postcode: string): string | null {
  return /^\s*([A-Za-z]{1,2})/.exec(postcode)?.[1]?.toUpperCase() ?? null;
}

/** Every postcode outside the listed areas is national. */
export function zoneForPostcode(postcode: string): DeliveryZone {
  const area = postcodeArea(postcode);
  return (area && POSTCODE_AREA_ZONES[area]) || 'national';
}

/** Freight by the parcel's weight band; above the last band each further 10 kg costs the step. */
export const FREIGHT_TABLE: { bands: Array<{ upToGrams: number; cents: Record<DeliveryZone, number> }>; stepGrams: number; stepCents: Record<DeliveryZone, number> } = {
  bands: [
    { upToGrams: 1_000, cents: { local: 695, national: 995, remote: 1_895 } },
    { upToGrams: 5_000, cents: { local: 1_195, national: 1_695, remote: 3_295 } },
    { upToGrams: 15_000, cents: { local: 1_995, national: 2_895, remote: 5_495 } },
    { upToGrams: 30_000, cents: { local: 3_295, national: 4_695, remote: 8_995 } },
    { upToGrams: 50_000, cents: { local: 4_995, national: 6_995, remote: 13_495 } },
  ],
  stepGrams: 10_000,
  stepCents: { local: 900, national: 1_400, remote: 2_600 },
};

/** Integer rounding of a cents amount times a fraction, half away from zero. */
function roundCents(value: number): number {
  return Math.sign(value) * Math.round(Math.abs(value));
}

export function dealerUnitPriceCents(retailCents: number, tier: DealerTier): number {
  return roundCents((retailCents * (100 - DEALER_TIERS[tier].discountPct)) / 100);
}

export function freightCents(weightGrams: number, zone: DeliveryZone): number {
  if (weightGrams <= 0) return 0;
  for (const band of FREIGHT_TABLE.bands) if (weightGrams <= band.upToGrams) return band.cents[zone];
  const last = FREIGHT_TABLE.bands.at(-1)!;
  const extraSteps = Math.ceil((weightGrams - last.upToGrams) / FREIGHT_TABLE.stepGrams);
  return last.cents[zone] + extraSteps * FREIGHT_TABLE.stepCents[zone];
}

export interface PricedLineInput {
  partNumber: string;
  quantity: number;
  retailUnitCents: number;
  coreDepositCents: number;
  weightGrams: number;
}

export interface PricedLine extends PricedLineInput {
  unitCents: number;
  lineCents: number;
  lineCoreDepositCents: number;
  lineWeightGrams: number;
}

export interface Buyer {
  kind: 'retail' | 'dealer';
  tier?: DealerTier;
}

export interface Totals {
  lines: PricedLine[];
  /** Goods at retail price. */
  retailGoodsCents: number;
  /** Goods at the buyer's price. */
  goodsCents: number;
  discountCents: number;
  coreDepositCents: number;
  freightCents: number;
  taxCents: number;
  totalCents: number;
  weightGrams: number;
}

/**
 * Tax applies to goods and freight; a core deposit is a refundable deposit, not a sale, so it is not taxed
 * (the demo distributor's rule).
 */
export function priceOrder(lines: PricedLineInput[], buyer: Buyer, zone: DeliveryZone, taxRatePct: number): Totals {
  const priced = lines.map((l) => {
    const unitCents = buyer.kind === 'dealer' && buyer.tier ? dealerUnitPriceCents(l.retailUnitCents, buyer.tier) : l.retailUnitCents;
    return {
      ...l,
      unitCents,
      lineCents: unitCents * l.quantity,
      lineCoreDepositCents: l.coreDepositCents * l.quantity,
      lineWeightGrams: l.weightGrams * l.quantity,
    };
  });
  const retailGoodsCents = priced.reduce((s, l) => s + l.retailUnitCents * l.quantity, 0);
  const goodsCents = priced.reduce((s, l) => s + l.lineCents, 0);
  const coreDepositCents = priced.reduce((s, l) => s + l.lineCoreDepositCents, 0);
  const weightGrams = priced.reduce((s, l) => s + l.lineWeightGrams, 0);
  const freight = freightCents(weightGrams, zone);
  const taxCents = roundCents(((goodsCents + freight) * taxRatePct) / 100);
  return {
    lines: priced,
    retailGoodsCents,
    goodsCents,
    discountCents: retailGoodsCents - goodsCents,
    coreDepositCents,
    freightCents: freight,
    taxCents,
    totalCents: goodsCents + coreDepositCents + freight + taxCents,
    weightGrams,
  };
}
