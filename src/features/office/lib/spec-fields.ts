import type { CategorySlug } from '../../../../shared/catalog';
import type { PartForm } from '../../../../shared/schemas/admin-catalog';

export type SpecKey = keyof PartForm['specs'];

export interface SpecField {
  key: SpecKey;
  label: string;
  kind: 'number' | 'text' | 'bearing';
  unit?: string;
  hint?: string;
  placeholder?: string;
}

export const SPEC_FIELDS: Record<SpecKey, SpecField> = {
  compressorAr: { key: 'compressorAr', label: 'Compressor A/R', kind: 'number', hint: 'Area over radius of the compressor housing, e.g. 0.60.' },
  turbineAr: { key: 'turbineAr', label: 'Turbine A/R', kind: 'number', hint: 'Area over radius of the turbine housing, e.g. 0.82.' },
  trimPct: { key: 'trimPct', label: 'Trim', kind: 'number', hint: 'Compressor wheel trim, 100 × (inducer ÷ exducer)².' },
  inducerMm: { key: 'inducerMm', label: 'Inducer', kind: 'number', unit: 'mm', hint: 'Compressor wheel inlet diameter.' },
  exducerMm: { key: 'exducerMm', label: 'Exducer', kind: 'number', unit: 'mm', hint: 'Compressor wheel outer diameter.' },
  flangePattern: { key: 'flangePattern', label: 'Flange pattern', kind: 'text', placeholder: 'e.g. 4-bolt square 42' },
  inletMm: { key: 'inletMm', label: 'Inlet', kind: 'number', unit: 'mm' },
  outletMm: { key: 'outletMm', label: 'Outlet', kind: 'number', unit: 'mm' },
  material: { key: 'material', label: 'Material', kind: 'text', placeholder: 'e.g. cast aluminium' },
  bearing: { key: 'bearing', label: 'Bearing', kind: 'bearing' },
  wastegate: { key: 'wastegate', label: 'Wastegate', kind: 'text', placeholder: 'e.g. internal, 1 bar actuator' },
  cooling: { key: 'cooling', label: 'Cooling', kind: 'text', placeholder: 'e.g. oil and water' },
  gaugeType: { key: 'gaugeType', label: 'Gauge type', kind: 'text', placeholder: 'e.g. boost, electronic' },
  rangeText: { key: 'rangeText', label: 'Range', kind: 'text', placeholder: 'e.g. −1 to 3 bar' },
  mounting: { key: 'mounting', label: 'Mounting', kind: 'text', placeholder: 'e.g. 52 mm pod' },
  connection: { key: 'connection', label: 'Connection', kind: 'text', placeholder: 'e.g. M10 × 1.0 banjo' },
};

/** Which specs apply to each category; the others are cleared when the part is saved. */
const BY_CATEGORY: Record<CategorySlug, SpecKey[]> = {
  turbochargers: ['compressorAr', 'turbineAr', 'trimPct', 'inducerMm', 'exducerMm', 'flangePattern', 'bearing', 'wastegate', 'cooling'],
  cartridges: ['trimPct', 'inducerMm', 'exducerMm', 'bearing', 'cooling'],
  'compressor-housings': ['compressorAr', 'inletMm', 'outletMm', 'material'],
  'turbine-housings': ['turbineAr', 'flangePattern', 'material', 'wastegate'],
  'gaskets-fittings': ['flangePattern', 'material', 'connection'],
  'gauges-sensors': ['gaugeType', 'rangeText', 'mounting', 'connection'],
  'rebuild-kits': ['bearing', 'material'],
};

export const ALL_SPEC_KEYS = Object.keys(SPEC_FIELDS) as SpecKey[];

export function specFieldsFor(category: string | undefined): SpecField[] {
  const keys = category && category in BY_CATEGORY ? BY_CATEGORY[category as CategorySlug] : [];
  return keys.map((k) => SPEC_FIELDS[k]);
}

export const specFieldId = (key: SpecKey) => `part-spec-${key}`;
