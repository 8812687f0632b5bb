import { formatMoney } from './format';
/** Catalogue vocabulary shared by client and server. */
export const CATEGORIES = [
  { slug: 'turbochargers', label: 'Turbochargers', blurb: 'Complete units, new or remanufactured on exchange.' },
  { slug: 'cartridges', label: 'Cartridges', blurb: 'Centre housing and rotating assembly: shaft, wheels, bearings, seals.' },
  { slug: 'compressor-housings', label: 'Compressor housings', blurb: 'Cast aluminium intake side, by A/R and inlet size.' },
  { slug: 'turbine-housings', label: 'Turbine housings', blurb: 'Cast iron or steel exhaust side, by A/R and flange.' },
  { slug: 'gaskets-fittings', label: 'Gaskets & fittings', blurb: 'Flange gaskets, oil and water lines.' },
  { slug: 'gauges-sensors', label: 'Gauges & sensors', blurb: 'Boost, exhaust temperature, oil pressure and shaft speed.' },
  { slug: 'rebuild-kits', label: 'Rebuild kits', blurb: 'Bearings, seals and thrust parts to rebuild one cartridge.' },
] as const;

export type CategorySlug = (typeof CATEGORIES)[number]['slug'];
export const CATEGORY_SLUGS = CATEGORIES.map((c) => c.slug) as [CategorySlug, ...CategorySlug[]];

export function categoryLabel(slug: string): string {
  return CATEGORIES.find((c) => c.slug === slug)?.label ?? slug;
}

export const BEARINGS = ['journal', 'ball'] as const;
export type Bearing = (typeof BEARINGS)[number];

import type { PartStatus } from './allowed-values';
export { PART_STATUSES, type PartStatus } from './allowed-values';

/** Stock shown to buyers: a count, "low" under the part's minimum, or none. */
export type StockState = 'in-stock' | 'low' | 'out-of-stock' | 'discontinued';

export function stockState(available: number, minStock: number, status: PartStatus): StockState {
  if (status === 'discontinued' && available <= 0) return 'discontinued';
  if (available <= 0) return 'out-of-stock';
  if (available <= Math.max(minStock, 2)) return 'low';
  return 'in-stock';
}

/** Prices as everywhere else (shared/format.ts). */
export const formatPrice = (cents: number): string => formatMoney(cents);

/** Compressor trim from the wheel diameters: 100·(inducer/exducer)², to one decimal (the trade's definition). */
export function trimPct(inducerMm: number, exducerMm: number): number {
  return Math.round(100 * (inducerMm / exducerMm) ** 2 * 10) / 10;
}
