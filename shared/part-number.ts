/** What a buyer types is compared in one canonical form: upper-case letters and digits only. */
export function normalizePartNumber(input: string): string {
  return input
    .normalize('NFKD')
    .toUpperCase()
    .replace(/[^A-Z0-9]/g, '');
}

/**
 * Our numbering keeps letters and digits in separate groups, so no letter is ever directly followed by a digit:
 *   frame code      three letters from the frame's name (Gimlet → GIM); size lives in the specs, never in the code
 *   part number     PREFIX-GL-SSSS[-XCH]
 *                   PREFIX  a frame code, or FLG (flange parts shared by frames) / INS (gauges and sensors)
 *                   G       the category group (1 turbochargers … 6 gauges and sensors, 7 rebuild kits)
 *                   L       the product line (0 the main range; 1–9 later lines)
 *                   SSSS    a serial; an earlier number of the same part has a lower serial than its replacement
 *                   XCH     a remanufactured unit sold on exchange
 */
export const FRAME_CODE_PATTERN = /^[A-Z]{3}$/;
export const FRAME_CODE_EXAMPLE = 'GIM';
export const PART_NUMBER_PATTERN = /^[A-Z]{3}-\d{2}-\d{4}(-XCH)?$/;
export const PART_NUMBER_EXAMPLE = 'GIM-10-0203';
export const EXCHANGE_SUFFIX = 'XCH';
export const SHARED_FLANGE_PREFIX = 'FLG';
export const INSTRUMENT_PREFIX = 'INS';

export const CATEGORY_GROUP = {
  turbochargers: 1,
  cartridges: 2,
  'compressor-housings': 3,
  'turbine-housings': 4,
  'gaskets-fittings': 5,
  'gauges-sensors': 6,
  'rebuild-kits': 7,
} as const;

export interface PartNumberParts {
  prefix: string;
  group: number;
  line: number;
  serial: number;
  exchange?: boolean;
}

export function formatPartNumber({ prefix, group, line, serial, exchange }: PartNumberParts): string {
  return `${prefix}-${group}${line}-${String(serial).padStart(4, '0')}${exchange ? `-${EXCHANGE_SUFFIX}` : ''}`;
}

export function parsePartNumber(number: string): PartNumberParts | null {
  const m = /^([A-Z]{3})-(\d)(\d)-(\d{4})(-XCH)?$/.exec(number);
  if (!m) return null;
  return { prefix: m[1]!, group: Number(m[2]), line: Number(m[3]), serial: Number(m[4]), exchange: Boolean(m[5]) };
}

/** Order numbers: SY- and the order's id past 100000 (six to eight digits). */
export const ORDER_NUMBER_PATTERN = /^SY-\d{6,8}$/;
export const formatOrderNumber = (orderId: number): string => `SY-${100000 + orderId}`;
