/**
 * The fitment check's choices and input limits, without the validation library: the fitment form's first paint reads
 * them, and the request schema (shared/schemas/fitment.ts) is built from them.
 */
export const FUELS = ['petrol', 'e85', 'methanol', 'diesel'] as const;
export const APPLICATIONS = ['street', 'circuit', 'drag', 'offroad', 'marine'] as const;
export const VERDICTS = ['fits', 'marginal', 'too-small', 'too-large'] as const;

export type Fuel = (typeof FUELS)[number];
export type Application = (typeof APPLICATIONS)[number];
export type Verdict = (typeof VERDICTS)[number];

/** Input limits: wide enough for any road, race or marine engine the catalogue serves, narrow enough to catch typos. */
export const FITMENT_LIMITS = {
  displacementL: { min: 0.1, max: 20 },
  powerHp: { min: 10, max: 3000 },
  powerKw: { min: 7.5, max: 2237 },
  rpm: { min: 1000, max: 20000 },
  altitudeM: { min: -500, max: 5000 },
  ambientC: { min: -40, max: 60 },
  bsfc: { min: 0.25, max: 1.6 },
  afr: { min: 4, max: 30 },
  volumetricEfficiency: { min: 0.5, max: 1.3 },
  manifoldTempC: { min: -20, max: 200 },
  chargeLossPsi: { min: 0, max: 10 },
  inletLossPsi: { min: 0, max: 5 },
  compressorEfficiency: { min: 0.5, max: 0.85 },
  fullBoostRpm: { min: 800, max: 20000 },
  intercoolerEffectiveness: { min: 0, max: 0.95 },
  cylinders: { min: 1, max: 16 },
} as const;

export const DISPLACEMENT_UNITS = ['L', 'in3'] as const;
export type DisplacementUnit = (typeof DISPLACEMENT_UNITS)[number];

/** More than this from a litre is beyond any engine: the input is refused as a likely unit or typing slip. */
export const ABSURD_HP_PER_LITRE = 1000;
