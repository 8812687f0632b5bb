/**
 * GTIN-13 numbers for our parts (drawn as EAN-13 on labels).
 *
 * Every number starts with a prefix in the range 200–299, which the GS1 General Specifications set aside for
 * restricted distribution inside a company: such a number is never allocated to any brand owner, so none of ours can
 * be mistaken for a real maker's product, and it means nothing outside this business. After the prefix comes an item
 * reference (the part's id, so a number is fixed for the life of the part and never reused) and the GS1 check digit.
 */

/** Our invented company prefix inside the restricted-circulation range (GS1 prefixes 200–299). */
export const GTIN_COMPANY_PREFIX = '24731';
/** Digits left for the item reference: 13 − prefix − check digit. */
export const GTIN_ITEM_REFERENCE_DIGITS = 13 - GTIN_COMPANY_PREFIX.length - 1;
/** The largest item reference: room for 9,999,999 parts. */
export const GTIN_MAX_ITEM_REFERENCE = 10 ** GTIN_ITEM_REFERENCE_DIGITS - 1;

/**
 * The GS1 standard check digit of the digits before it (any GS1 key: GTIN-8/12/13/14, GLN, SSCC): weights 3 and 1
 * alternate from the rightmost digit (which gets 3), and the check digit takes the weighted sum up to the next
 * multiple of ten.
 */
export function gs1CheckDigit(digits: string): number {
  if (!/^\d+$/.test(digits)) throw new Error('a GS1 check digit is computed over digits only');
  let sum = 0;
  for (let i = digits.length - 1, weight = 3; i >= 0; i--, weight = 4 - weight) sum += Number(digits[i]) * weight;
  return (10 - (sum % 10)) % 10;
}

/** Whether a string is 13 digits whose last is the GS1 check digit of the first 12. */
export function isValidGtin13(value: string): boolean {
  return /^\d{13}$/.test(value) && gs1CheckDigit(value.slice(0, 12)) === Number(value[12]);
}

/** A GTIN-13 from a company prefix and an item reference (zero-padded to fill 12 digits), with its check digit. */
export function buildGtin13(companyPrefix: string, itemReference: number): string {
  const width = 12 - companyPrefix.length;
  if (!/^\d+$/.test(companyPrefix) || width < 1) throw new Error(`company prefix ${companyPrefix} does not leave room for an item reference`);
  if (!Number.isInteger(itemReference) || itemReference < 0 || itemReference >= 10 ** width) throw new Error(`item reference ${itemReference} does not fit in ${width} digits`);
  const body = `${companyPrefix}${String(itemReference).padStart(width, '0')}`;
  return `${body}${gs1CheckDigit(body)}`;
}

/** The GTIN of the part with this id (its item reference). */
export function gtinForPart(partId: number): string {
  if (partId < 1 || partId > GTIN_MAX_ITEM_REFERENCE) throw new Error(`part id ${partId} is outside the GTIN item references (1–${GTIN_MAX_ITEM_REFERENCE})`);
  return buildGtin13(GTIN_COMPANY_PREFIX, partId);
}

/** The item reference of one of our GTINs (the part id), or null when the number is not ours or not valid. */
export function itemReferenceOf(gtin: string): number | null {
  if (!isValidGtin13(gtin) || !gtin.startsWith(GTIN_COMPANY_PREFIX)) return null;
  return Number(gtin.slice(GTIN_COMPANY_PREFIX.length, 12));
}

/**
 * What a scanner or a person typed, read as a GTIN: spaces, dashes and dots dropped (people copy "2 473100 000015").
 * A GTIN-13 written in the 14-digit field (a leading 0) is brought back to 13. Returns the 13 digits, or null when
 * it is not a run of 13 digits at all; the check digit is not judged here (see isValidGtin13).
 */
export function normalizeGtinInput(raw: string): string | null {
  const digits = raw.trim().replace(/[\s.-]+/g, '');
  if (/^0\d{13}$/.test(digits)) return digits.slice(1);
  return /^\d{13}$/.test(digits) ? digits : null;
}

/** Why a 13-digit number is not a valid GTIN, in words for the person holding the scanner (null when it is valid). */
export function gtinProblem(gtin: string): string | null {
  if (isValidGtin13(gtin)) return null;
  const expected = gs1CheckDigit(gtin.slice(0, 12));
  return `${gtin} is not a valid GTIN: its check digit is ${gtin[12]}, it should be ${expected}. Scan it again, or type the part number`;
}
