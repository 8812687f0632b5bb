import { frameRatings, maxShaftRpmFor as familyMaxShaftRpm, type FrameRatings, type WheelMaterial } from '../shared/fitment/frame-family';

/**
 * The demo frames of the house brand: wheel sizes and materials, housings and build. Flow, pressure ratio, shaft
 * speed and power band follow from one physical model (shared/fitment/frame-family.ts).
 * All names and numbers are invented.
 */
export interface FrameShape {
  code: string;
  name: string;
  inducerMm: number;
  exducerMm: number;
  /** Compressor-wheel material: cast aluminium on the smaller frames, forged and machined on the larger. */
  wheel: WheelMaterial;
  turbineWheelMm: number;
  weightKg: number;
  bearingOptions: Array<'journal' | 'ball'>;
  /** The turbine inlet flange; its name ends in the inlet bore in millimetres. */
  flangePattern: string;
  turbineArOptions: number[];
  compressorArOptions: number[];
  compressorInletMm: number;
  compressorOutletMm: number;
}

export type FrameSeed = FrameShape & FrameRatings;

export const HOUSE_BRAND = 'Vanecraft';
export const DISTRIBUTOR = 'Spoolyard Turbo Supply';

/** The turbine inlet bore named in a flange pattern ("4-bolt square 52" → 52). */
export function flangeInletMm(pattern: string): number {
  const m = /(\d+)(?: divided)?$/.exec(pattern);
  if (!m) throw new Error(`Flange pattern without a bore: ${pattern}`);
  return Number(m[1]);
}

export const isVBand = (pattern: string) => pattern.startsWith('V-band');

/** Turbine housings sold for a frame: the A/Rs its units ship with, and one larger for high-rpm use. */
export const turbineHousingArs = (f: Pick<FrameShape, 'turbineArOptions'>) => [
  ...f.turbineArOptions,
  Math.round((f.turbineArOptions.at(-1) ?? 1) * 1.15 * 100) / 100,
];

export const maxShaftRpmFor = (f: Pick<FrameShape, 'exducerMm' | 'wheel'>) => familyMaxShaftRpm(f);

const SHAPES: FrameShape[] = [
  { code: 'AWL', wheel: 'milled', name: 'Awl', inducerMm: 30, exducerMm: 41, turbineWheelMm: 37, weightKg: 4.5, bearingOptions: ['journal', 'ball'], flangePattern: '2-bolt oval 38', turbineArOptions: [0.35, 0.43, 0.51], compressorArOptions: [0.33, 0.42, 0.5], compressorInletMm: 38, compressorOutletMm: 32 },
  { code: 'BUR', wheel: 'milled', name: 'Burr', inducerMm: 36, exducerMm: 49, turbineWheelMm: 44, weightKg: 6.5, bearingOptions: ['journal', 'ball'], flangePattern: '2-bolt oval 38', turbineArOptions: [0.42, 0.5, 0.6], compressorArOptions: [0.4, 0.5, 0.6], compressorInletMm: 45, compressorOutletMm: 38 },
  { code: 'CHS', wheel: 'milled', name: 'Chisel', inducerMm: 42, exducerMm: 56, turbineWheelMm: 50, weightKg: 8, bearingOptions: ['journal', 'ball'], flangePattern: '4-bolt square 52', turbineArOptions: [0.48, 0.57, 0.68], compressorArOptions: [0.42, 0.5, 0.6], compressorInletMm: 51, compressorOutletMm: 45 },
  { code: 'DRF', wheel: 'milled', name: 'Drift', inducerMm: 48, exducerMm: 64, turbineWheelMm: 56, weightKg: 10, bearingOptions: ['journal', 'ball'], flangePattern: '4-bolt square 52', turbineArOptions: [0.57, 0.63, 0.82], compressorArOptions: [0.5, 0.6, 0.7], compressorInletMm: 63, compressorOutletMm: 51 },
  { code: 'EDG', wheel: 'milled', name: 'Edger', inducerMm: 54, exducerMm: 72, turbineWheelMm: 62, weightKg: 13, bearingOptions: ['journal', 'ball'], flangePattern: '4-bolt square 64 divided', turbineArOptions: [0.63, 0.82, 0.96], compressorArOptions: [0.5, 0.6, 0.7], compressorInletMm: 76, compressorOutletMm: 51 },
  { code: 'FUL', wheel: 'milled', name: 'Fuller', inducerMm: 60, exducerMm: 80, turbineWheelMm: 68, weightKg: 16, bearingOptions: ['journal', 'ball'], flangePattern: '4-bolt square 64 divided', turbineArOptions: [0.82, 0.96, 1.06], compressorArOptions: [0.6, 0.7, 0.8], compressorInletMm: 76, compressorOutletMm: 63 },
  { code: 'GIM', wheel: 'milled', name: 'Gimlet', inducerMm: 67, exducerMm: 88, turbineWheelMm: 76, weightKg: 20, bearingOptions: ['journal', 'ball'], flangePattern: 'V-band 76', turbineArOptions: [0.82, 0.96, 1.1], compressorArOptions: [0.6, 0.7, 0.8], compressorInletMm: 89, compressorOutletMm: 63 },
  { code: 'HSP', wheel: 'milled', name: 'Hasp', inducerMm: 76, exducerMm: 100, turbineWheelMm: 86, weightKg: 26, bearingOptions: ['journal', 'ball'], flangePattern: 'V-band 96', turbineArOptions: [0.96, 1.1, 1.25], compressorArOptions: [0.7, 0.8, 0.9], compressorInletMm: 102, compressorOutletMm: 76 },
  { code: 'JIG', wheel: 'milled', name: 'Jig', inducerMm: 88, exducerMm: 114, turbineWheelMm: 98, weightKg: 33, bearingOptions: ['journal', 'ball'], flangePattern: 'V-band 96', turbineArOptions: [1.1, 1.25, 1.4], compressorArOptions: [0.8, 0.9, 1.0], compressorInletMm: 114, compressorOutletMm: 89 },
  { code: 'KRF', wheel: 'milled', name: 'Kerf', inducerMm: 114, exducerMm: 150, turbineWheelMm: 118, weightKg: 40, bearingOptions: ['journal', 'ball'], flangePattern: 'V-band 128', turbineArOptions: [1.25, 1.4, 1.6], compressorArOptions: [0.9, 1.0, 1.15], compressorInletMm: 152, compressorOutletMm: 102 },
];

export const FRAMES: FrameSeed[] = SHAPES.map((shape) => ({ ...shape, ...frameRatings(shape) }));
