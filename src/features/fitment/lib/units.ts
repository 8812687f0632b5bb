import { FITMENT_LIMITS, type Application, type DisplacementUnit, type Fuel } from '../../../../shared/fitment/limits';
import type { FitmentRequest } from '../../../../shared/schemas/fitment';
import {
  celsiusToFahrenheit,
  cubicInchesToLitres,
  fahrenheitToCelsius,
  hpToKw,
  KG_PER_LB,
  kpaToBar,
  kpaToPsi,
  kwToHp,
  lbPerMinToKgPerS,
  litresToCubicInches,
  psiToBar,
  psiToKpa,
} from '../../../../shared/units';

export type UnitSystem = 'metric' | 'imperial';

// The international foot is 0.3048 m exactly (NIST SP 811, appendix B).
const M_PER_FT = 0.3048;
/** 1 lb/(hp·h) in g/(kW·h): 453.59237 g over 0.7457 kW·h. */
const G_PER_KWH_PER_LB_PER_HPH = (KG_PER_LB * 1000) / hpToKw(1);

/** What the form holds: text as typed, in the units shown. Blank optional fields mean "use the default". */
export interface FitmentFormValues {
  displacement: string;
  /** The unit the displacement is typed in, chosen by the buyer apart from the unit system (a slip here is costly). */
  displacementUnit: DisplacementUnit;
  power: string;
  rpm: string;
  fuel: Fuel;
  application: Application;
  altitude: string;
  inletTemp: string;
  intercooled: boolean;
  bsfc: string;
  afr: string;
  volumetricEfficiency: string;
  manifoldTemp: string;
  chargeLoss: string;
  inletLoss: string;
  compressorEfficiency: string;
  fullBoostRpm: string;
  intercoolerEffectiveness: string;
  cylinders: string;
}

export type NumericField = Exclude<keyof FitmentFormValues, 'fuel' | 'application' | 'intercooled' | 'displacementUnit'>;
export type FormField = keyof FitmentFormValues;

interface NumericFieldSpec {
  label: string;
  limit: keyof typeof FITMENT_LIMITS;
  /** Unit shown beside the field. */
  unit: (s: UnitSystem) => string;
  /** From the unit shown to the API's unit, and back. */
  toApi: (value: number, s: UnitSystem) => number;
  fromApi: (value: number, s: UnitSystem) => number;
  /** Decimal places shown. */
  digits: (s: UnitSystem) => number;
}

const same = (v: number) => v;

export const NUMERIC_FIELDS: Record<NumericField, NumericFieldSpec> = {
  displacement: {
    label: 'Engine displacement',
    limit: 'displacementL',
    unit: (s) => (s === 'metric' ? 'L' : 'cu in'),
    toApi: (v, s) => (s === 'metric' ? v : cubicInchesToLitres(v)),
    fromApi: (v, s) => (s === 'metric' ? v : litresToCubicInches(v)),
    digits: (s) => (s === 'metric' ? 1 : 0),
  },
  power: {
    label: 'Power wanted',
    limit: 'powerHp',
    unit: (s) => (s === 'metric' ? 'kW' : 'hp'),
    // Power goes to the API as powerKw or powerHp, whichever is shown; both take it in that unit.
    toApi: same,
    fromApi: same,
    digits: () => 0,
  },
  rpm: { label: 'Peak-power rpm', limit: 'rpm', unit: () => 'rpm', toApi: same, fromApi: same, digits: () => 0 },
  altitude: {
    label: 'Altitude',
    limit: 'altitudeM',
    unit: (s) => (s === 'metric' ? 'm' : 'ft'),
    toApi: (v, s) => (s === 'metric' ? v : v * M_PER_FT),
    fromApi: (v, s) => (s === 'metric' ? v : v / M_PER_FT),
    digits: () => 0,
  },
  inletTemp: {
    label: 'Inlet air temperature',
    limit: 'ambientC',
    unit: (s) => (s === 'metric' ? '°C' : '°F'),
    toApi: (v, s) => (s === 'metric' ? v : fahrenheitToCelsius(v)),
    fromApi: (v, s) => (s === 'metric' ? v : celsiusToFahrenheit(v)),
    digits: () => 0,
  },
  bsfc: {
    label: 'BSFC',
    limit: 'bsfc',
    unit: (s) => (s === 'metric' ? 'g/(kW·h)' : 'lb/(hp·h)'),
    toApi: (v, s) => (s === 'metric' ? v / G_PER_KWH_PER_LB_PER_HPH : v),
    fromApi: (v, s) => (s === 'metric' ? v * G_PER_KWH_PER_LB_PER_HPH : v),
    digits: (s) => (s === 'metric' ? 0 : 2),
  },
  afr: { label: 'Air-fuel ratio', limit: 'afr', unit: () => ':1', toApi: same, fromApi: same, digits: () => 1 },
  volumetricEfficiency: {
    label: 'Volumetric efficiency',
    limit: 'volumetricEfficiency',
    unit: () => '%',
    toApi: (v) => v / 100,
    fromApi: (v) => v * 100,
    digits: () => 0,
  },
  manifoldTemp: {
    label: 'Manifold air temperature',
    limit: 'manifoldTempC',
    unit: (s) => (s === 'metric' ? '°C' : '°F'),
    toApi: (v, s) => (s === 'metric' ? v : fahrenheitToCelsius(v)),
    fromApi: (v, s) => (s === 'metric' ? v : celsiusToFahrenheit(v)),
    digits: () => 0,
  },
  chargeLoss: {
    label: 'Charge-side pressure loss',
    limit: 'chargeLossPsi',
    unit: (s) => (s === 'metric' ? 'kPa' : 'psi'),
    toApi: (v, s) => (s === 'metric' ? kpaToPsi(v) : v),
    fromApi: (v, s) => (s === 'metric' ? psiToKpa(v) : v),
    digits: () => 1,
  },
  inletLoss: {
    label: 'Inlet pressure loss',
    limit: 'inletLossPsi',
    unit: (s) => (s === 'metric' ? 'kPa' : 'psi'),
    toApi: (v, s) => (s === 'metric' ? kpaToPsi(v) : v),
    fromApi: (v, s) => (s === 'metric' ? psiToKpa(v) : v),
    digits: () => 1,
  },
  compressorEfficiency: {
    label: 'Compressor efficiency',
    limit: 'compressorEfficiency',
    unit: () => '%',
    toApi: (v) => v / 100,
    fromApi: (v) => v * 100,
    digits: () => 0,
  },
  fullBoostRpm: { label: 'Full boost from', limit: 'fullBoostRpm', unit: () => 'rpm', toApi: same, fromApi: same, digits: () => 0 },
  intercoolerEffectiveness: {
    label: 'Intercooler effectiveness',
    limit: 'intercoolerEffectiveness',
    unit: () => '%',
    toApi: (v) => v / 100,
    fromApi: (v) => v * 100,
    digits: () => 0,
  },
  cylinders: { label: 'Number of cylinders', limit: 'cylinders', unit: () => '', toApi: same, fromApi: same, digits: () => 0 },
};

/**
 * The displacement field follows its own unit control, not the metric/imperial switch: its specs above read
 * "metric" as litres and "imperial" as cubic inches.
 */
export const displacementSystem = (unit: DisplacementUnit): UnitSystem => (unit === 'L' ? 'metric' : 'imperial');

/** The unit system a field is shown in: the displacement's own unit, or the switch's. */
export const systemFor = (field: NumericField, system: UnitSystem, displacementUnit: DisplacementUnit): UnitSystem =>
  field === 'displacement' ? displacementSystem(displacementUnit) : system;

export const ADVANCED_FIELDS: readonly FormField[] = [
  'altitude',
  'inletTemp',
  'intercooled',
  'bsfc',
  'afr',
  'volumetricEfficiency',
  'manifoldTemp',
  'chargeLoss',
  'inletLoss',
  'compressorEfficiency',
  'fullBoostRpm',
  'intercoolerEffectiveness',
  'cylinders',
];

const roundTo = (value: number, digits: number) => {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
};

/** A value in the API's unit, as the field shows it. */
export function displayValue(field: NumericField, apiValue: number, system: UnitSystem): string {
  const spec = NUMERIC_FIELDS[field];
  return roundTo(spec.fromApi(apiValue, system), spec.digits(system)).toFixed(spec.digits(system));
}

/** The range a field accepts in the unit shown, rounded inwards so every value shown as allowed converts inside the API's limits. */
export function displayRange(field: NumericField, system: UnitSystem): { min: number; max: number } {
  const spec = NUMERIC_FIELDS[field];
  const limits = field === 'power' && system === 'metric' ? FITMENT_LIMITS.powerKw : FITMENT_LIMITS[spec.limit];
  const a = spec.fromApi(limits.min, system);
  const b = spec.fromApi(limits.max, system);
  const f = 10 ** spec.digits(system);
  return { min: Math.ceil(Math.min(a, b) * f - 1e-9) / f, max: Math.floor(Math.max(a, b) * f + 1e-9) / f };
}

export function rangeMessage(field: NumericField, system: UnitSystem): string {
  const { min, max } = displayRange(field, system);
  const unit = NUMERIC_FIELDS[field].unit(system);
  const fmt = (n: number) => n.toLocaleString('en-US', { maximumFractionDigits: 2 });
  const suffix = unit === ':1' ? ':1' : unit === '' ? '' : ` ${unit}`;
  return `${NUMERIC_FIELDS[field].label.toLowerCase()} must be between ${fmt(min)} and ${fmt(max)}${suffix}`;
}

/** Blank stays undefined (the default applies); anything else must read as a number, or becomes NaN for the schema to refuse. */
function parseNumber(text: string): number | undefined {
  const trimmed = text.trim().replace(/,/g, '');
  if (trimmed === '') return undefined;
  return /^[-+]?(\d+\.?\d*|\.\d+)$/.test(trimmed) ? Number(trimmed) : Number.NaN;
}

function apiNumber(values: FitmentFormValues, field: NumericField, system: UnitSystem): number | undefined {
  const n = parseNumber(values[field]);
  return n === undefined || Number.isNaN(n) ? n : NUMERIC_FIELDS[field].toApi(n, systemFor(field, system, values.displacementUnit));
}

/** The form as a request body in the API's units (not yet validated). */
export function formToRequest(values: FitmentFormValues, system: UnitSystem): Record<string, unknown> {
  const num = (field: NumericField) => apiNumber(values, field, system);
  const assumptions = {
    bsfc: num('bsfc'),
    afr: num('afr'),
    volumetricEfficiency: num('volumetricEfficiency'),
    manifoldTempC: num('manifoldTemp'),
    chargeLossPsi: num('chargeLoss'),
    inletLossPsi: num('inletLoss'),
    compressorEfficiency: num('compressorEfficiency'),
    fullBoostRpm: num('fullBoostRpm'),
    intercoolerEffectiveness: num('intercoolerEffectiveness'),
    cylinders: num('cylinders'),
  };
  const given = Object.fromEntries(Object.entries(assumptions).filter(([, v]) => v !== undefined));
  const body: Record<string, unknown> = {
    displacementL: num('displacement'),
    // Sent so that a refusal can name the unit the buyer typed in.
    displacementUnit: values.displacementUnit,
    [system === 'metric' ? 'powerKw' : 'powerHp']: num('power'),
    rpm: num('rpm'),
    fuel: values.fuel,
    application: values.application,
    altitudeM: num('altitude'),
    ambientC: num('inletTemp'),
    intercooled: values.intercooled,
    ...(Object.keys(given).length > 0 ? { assumptions: given } : {}),
  };
  return Object.fromEntries(Object.entries(body).filter(([, v]) => v !== undefined));
}

/** A request (a saved check, or the form in the other unit system) as form values in the units shown. */
export function requestToForm(request: Partial<FitmentRequest>, system: UnitSystem, base: FitmentFormValues): FitmentFormValues {
  const displacementUnit = request.displacementUnit ?? base.displacementUnit;
  const show = (field: NumericField, v: number | undefined) =>
    v === undefined || Number.isNaN(v) ? '' : displayValue(field, v, systemFor(field, system, displacementUnit));
  const powerInShownUnit =
    system === 'metric'
      ? (request.powerKw ?? (request.powerHp !== undefined ? hpToKw(request.powerHp) : undefined))
      : (request.powerHp ?? (request.powerKw !== undefined ? kwToHp(request.powerKw) : undefined));
  const a = request.assumptions ?? {};
  return {
    ...base,
    displacement: show('displacement', request.displacementL),
    displacementUnit,
    power: show('power', powerInShownUnit),
    rpm: show('rpm', request.rpm),
    fuel: request.fuel ?? base.fuel,
    application: request.application ?? base.application,
    altitude: show('altitude', request.altitudeM),
    inletTemp: show('inletTemp', request.ambientC),
    intercooled: request.intercooled ?? base.intercooled,
    bsfc: show('bsfc', a.bsfc),
    afr: show('afr', a.afr),
    volumetricEfficiency: show('volumetricEfficiency', a.volumetricEfficiency),
    manifoldTemp: show('manifoldTemp', a.manifoldTempC),
    chargeLoss: show('chargeLoss', a.chargeLossPsi),
    inletLoss: show('inletLoss', a.inletLossPsi),
    compressorEfficiency: show('compressorEfficiency', a.compressorEfficiency),
    fullBoostRpm: show('fullBoostRpm', a.fullBoostRpm),
    intercoolerEffectiveness: show('intercoolerEffectiveness', a.intercoolerEffectiveness),
    cylinders: show('cylinders', a.cylinders),
  };
}

/** Where the API reports a field's error, as the form field that shows it. */
export function formFieldOf(path: string): FormField | null {
  const map: Record<string, FormField> = {
    displacementL: 'displacement',
    powerHp: 'power',
    powerKw: 'power',
    rpm: 'rpm',
    fuel: 'fuel',
    application: 'application',
    altitudeM: 'altitude',
    ambientC: 'inletTemp',
    intercooled: 'intercooled',
    'assumptions.bsfc': 'bsfc',
    'assumptions.afr': 'afr',
    'assumptions.volumetricEfficiency': 'volumetricEfficiency',
    'assumptions.manifoldTempC': 'manifoldTemp',
    'assumptions.chargeLossPsi': 'chargeLoss',
    'assumptions.inletLossPsi': 'inletLoss',
    'assumptions.compressorEfficiency': 'compressorEfficiency',
    'assumptions.fullBoostRpm': 'fullBoostRpm',
    'assumptions.intercoolerEffectiveness': 'intercoolerEffectiveness',
    'assumptions.cylinders': 'cylinders',
    displacementUnit: 'displacementUnit',
  };
  return map[path] ?? null;
}

/** Formatting of results in the units shown. */
export const show = {
  flow: (lbMin: number, s: UnitSystem) => (s === 'metric' ? `${lbPerMinToKgPerS(lbMin).toFixed(3)} kg/s` : `${lbMin.toFixed(1)} lb/min`),
  flowValue: (lbMin: number, s: UnitSystem) => (s === 'metric' ? lbPerMinToKgPerS(lbMin) : lbMin),
  flowUnit: (s: UnitSystem) => (s === 'metric' ? 'kg/s' : 'lb/min'),
  boost: (psi: number, s: UnitSystem) => (s === 'metric' ? `${psiToBar(psi).toFixed(2)} bar` : `${psi.toFixed(1)} psi`),
  pressureAbs: (kpa: number, s: UnitSystem) => (s === 'metric' ? `${kpa.toFixed(0)} kPa` : `${kpaToPsi(kpa).toFixed(1)} psia`),
  pressureAbsBar: (kpa: number) => `${kpaToBar(kpa).toFixed(2)} bar`,
  temp: (c: number, s: UnitSystem) => (s === 'metric' ? `${Math.round(c)} °C` : `${Math.round(celsiusToFahrenheit(c))} °F`),
  power: (hp: number, s: UnitSystem) => (s === 'metric' ? `${Math.round(hpToKw(hp))} kW` : `${Math.round(hp)} hp`),
  // Under a litre a second decimal keeps a small (or mistyped) engine from reading as "0.1 L".
  displacement: (l: number, s: UnitSystem) => (s === 'metric' ? `${l.toFixed(l < 1 ? 2 : 1)} L` : `${Math.round(litresToCubicInches(l))} cu in`),
  /** Displacement in the unit the buyer chose for it. */
  displacementIn: (l: number, unit: DisplacementUnit) => (unit === 'L' ? `${l.toFixed(l < 1 ? 2 : 1)} L` : `${Math.round(litresToCubicInches(l))} cu in`),
  /** Fuel mass flow: lb/h, or kg/h in metric. */
  fuelFlow: (lbH: number, s: UnitSystem) => (s === 'metric' ? `${Math.round(lbH * KG_PER_LB)} kg/h` : `${Math.round(lbH)} lb/h`),
  altitude: (m: number, s: UnitSystem) => (s === 'metric' ? `${Math.round(m)} m` : `${Math.round(m / M_PER_FT)} ft`),
  lossPsi: (psi: number, s: UnitSystem) => (s === 'metric' ? `${psiToKpa(psi).toFixed(1)} kPa` : `${psi.toFixed(1)} psi`),
  bsfc: (lb: number, s: UnitSystem) => (s === 'metric' ? `${Math.round(lb * G_PER_KWH_PER_LB_PER_HPH)} g/(kW·h)` : `${lb.toFixed(2)} lb/(hp·h)`),
  pct: (fraction: number) => `${Math.round(fraction * 100)} %`,
  rpm: (rpm: number) => `${Math.round(rpm).toLocaleString('en-US')} rpm`,
  /** Shaft speed to the nearest 500 rpm, as the verdict's reasons give it. */
  shaftRpm: (rpm: number) => `${(Math.round(rpm / 500) * 500).toLocaleString('en-US')} rpm`,
};
