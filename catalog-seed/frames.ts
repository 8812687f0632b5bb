/**
 * The demo frames of the house brand. Sizes follow the common-practice rules of the trade:
 * trim = 100·(inducer/exducer)², flow rating of about 1 lb/min per 10 hp on petrol, and a maximum
 * shaft speed from a compressor tip speed of about 540 m/s for a cast aluminium wheel (common practice).
 * All names and numbers are invented.
 */
export interface FrameSeed {
  code: string;
  name: string;
  inducerMm: number;
  exducerMm: number;
  turbineWheelMm: number;
  powerBandHp: [number, number];
  maxFlowLbMin: number;
  maxPressureRatio: number;
  weightKg: number;
  bearingOptions: Array<'journal' | 'ball'>;
  /** The turbine inlet flange; its name ends in the inlet bore in millimetres. */
  flangePattern: string;
  turbineArOptions: number[];
  compressorArOptions: number[];
  compressorInletMm: number;
  compressorOutletMm: number;
}

export const HOUSE_BRAND = 'Vanecraft';
export const DISTRIBUTOR = 'Spoolyard Turbo Supply';

/** Common-practice design tip speed for cast aluminium compressor wheels, m/s. */
export const DESIGN_TIP_SPEED_MS = 540;

/** The turbine inlet bore named in a flange pattern ("4-bolt square 52" → 52). */
export function flangeInletMm(pattern: string): number {
  const m = /(\d+)(?: divided)?$/.exec(pattern);
  if (!m) throw new Error(`Flange pattern without a bore: ${pattern}`);
  return Number(m[1]);
}

export const isVBand = (pattern: string) => pattern.startsWith('V-band');

export function maxShaftRpmFor(exducerMm: number): number {
  return Math.round((DESIGN_TIP_SPEED_MS * 60) / (Math.PI * (exducerMm / 1000)) / 500) * 500;
}

export const FRAMES: FrameSeed[] = [
  { code: 'AWL', name: 'Awl', inducerMm: 30, exducerMm: 41, turbineWheelMm: 37, powerBandHp: [60, 120], maxFlowLbMin: 12, maxPressureRatio: 2.8, weightKg: 4.5, bearingOptions: ['journal', 'ball'], flangePattern: '2-bolt oval 38', turbineArOptions: [0.35, 0.43, 0.51], compressorArOptions: [0.33, 0.42, 0.5], compressorInletMm: 38, compressorOutletMm: 32 },
  { code: 'BUR', name: 'Burr', inducerMm: 36, exducerMm: 49, turbineWheelMm: 44, powerBandHp: [110, 220], maxFlowLbMin: 22, maxPressureRatio: 3.0, weightKg: 6.5, bearingOptions: ['journal', 'ball'], flangePattern: '2-bolt oval 38', turbineArOptions: [0.42, 0.5, 0.6], compressorArOptions: [0.4, 0.5, 0.6], compressorInletMm: 45, compressorOutletMm: 38 },
  { code: 'CHS', name: 'Chisel', inducerMm: 42, exducerMm: 56, turbineWheelMm: 50, powerBandHp: [180, 320], maxFlowLbMin: 32, maxPressureRatio: 3.2, weightKg: 8, bearingOptions: ['journal', 'ball'], flangePattern: '4-bolt square 52', turbineArOptions: [0.48, 0.57, 0.68], compressorArOptions: [0.42, 0.5, 0.6], compressorInletMm: 51, compressorOutletMm: 45 },
  { code: 'DRF', name: 'Drift', inducerMm: 48, exducerMm: 64, turbineWheelMm: 56, powerBandHp: [260, 420], maxFlowLbMin: 42, maxPressureRatio: 3.4, weightKg: 10, bearingOptions: ['journal', 'ball'], flangePattern: '4-bolt square 52', turbineArOptions: [0.57, 0.63, 0.82], compressorArOptions: [0.5, 0.6, 0.7], compressorInletMm: 63, compressorOutletMm: 51 },
  { code: 'EDG', name: 'Edger', inducerMm: 54, exducerMm: 72, turbineWheelMm: 62, powerBandHp: [350, 550], maxFlowLbMin: 55, maxPressureRatio: 3.6, weightKg: 13, bearingOptions: ['journal', 'ball'], flangePattern: '4-bolt square 64 divided', turbineArOptions: [0.63, 0.82, 0.96], compressorArOptions: [0.5, 0.6, 0.7], compressorInletMm: 76, compressorOutletMm: 51 },
  { code: 'FUL', name: 'Fuller', inducerMm: 60, exducerMm: 80, turbineWheelMm: 68, powerBandHp: [450, 700], maxFlowLbMin: 70, maxPressureRatio: 3.8, weightKg: 16, bearingOptions: ['journal', 'ball'], flangePattern: '4-bolt square 64 divided', turbineArOptions: [0.82, 0.96, 1.06], compressorArOptions: [0.6, 0.7, 0.8], compressorInletMm: 76, compressorOutletMm: 63 },
  { code: 'GIM', name: 'Gimlet', inducerMm: 67, exducerMm: 88, turbineWheelMm: 76, powerBandHp: [580, 880], maxFlowLbMin: 88, maxPressureRatio: 4.0, weightKg: 20, bearingOptions: ['journal', 'ball'], flangePattern: 'V-band 76', turbineArOptions: [0.82, 0.96, 1.1], compressorArOptions: [0.6, 0.7, 0.8], compressorInletMm: 89, compressorOutletMm: 63 },
  { code: 'HSP', name: 'Hasp', inducerMm: 76, exducerMm: 100, turbineWheelMm: 86, powerBandHp: [750, 1150], maxFlowLbMin: 115, maxPressureRatio: 4.2, weightKg: 26, bearingOptions: ['journal', 'ball'], flangePattern: 'V-band 96', turbineArOptions: [0.96, 1.1, 1.25], compressorArOptions: [0.7, 0.8, 0.9], compressorInletMm: 102, compressorOutletMm: 76 },
  { code: 'JIG', name: 'Jig', inducerMm: 88, exducerMm: 114, turbineWheelMm: 98, powerBandHp: [1000, 1500], maxFlowLbMin: 150, maxPressureRatio: 4.4, weightKg: 33, bearingOptions: ['journal', 'ball'], flangePattern: 'V-band 96', turbineArOptions: [1.1, 1.25, 1.4], compressorArOptions: [0.8, 0.9, 1.0], compressorInletMm: 114, compressorOutletMm: 89 },
  { code: 'KRF', name: 'Kerf', inducerMm: 106, exducerMm: 140, turbineWheelMm: 118, powerBandHp: [1350, 2100], maxFlowLbMin: 205, maxPressureRatio: 4.6, weightKg: 40, bearingOptions: ['journal', 'ball'], flangePattern: 'V-band 128', turbineArOptions: [1.25, 1.4, 1.6], compressorArOptions: [0.9, 1.0, 1.15], compressorInletMm: 152, compressorOutletMm: 102 },
];
