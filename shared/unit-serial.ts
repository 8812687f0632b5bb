/**
 * Serial numbers of the units we sell and service: `VC` (Vanecraft), the two-digit year the serial was given, a
 * six-digit sequence within that year and one check digit, written `VC26-004217-5`. The check digit is the Luhn
 * (mod 10) digit of the eight digits before it (ISO/IEC 7812-1 Annex B), so one mistyped digit or two swapped
 * neighbours are caught at the counter and on the Bench before a unit is looked up.
 */
export const SERIAL_PATTERN_HINT = 'VC26-004217-5';

/** The Luhn check digit for a string of digits (the digit that makes the whole number pass the Luhn check). */
export function luhnCheckDigit(digits: string): number {
  if (!/^\d+$/.test(digits)) throw new Error('Luhn: digits only');
  let sum = 0;
  // From the right, the digit next to the check digit is doubled, then every second one.
  for (let i = digits.length - 1, double = true; i >= 0; i -= 1, double = !double) {
    let d = Number(digits[i]);
    if (double) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return (10 - (sum % 10)) % 10;
}

export function formatSerial(year: number, sequence: number): string {
  const yy = String(year % 100).padStart(2, '0');
  if (!Number.isInteger(sequence) || sequence < 1 || sequence > 999_999) throw new Error('serial sequence must be 1 to 999999');
  const seq = String(sequence).padStart(6, '0');
  return `VC${yy}-${seq}-${luhnCheckDigit(yy + seq)}`;
}

/**
 * What was typed or scanned (any case, with or without dashes and spaces) as a serial in its written form, or null
 * when it is not one of ours or its check digit is wrong.
 */
export function normalizeSerial(typed: string): string | null {
  const m = /^VC(\d{2})(\d{6})(\d)$/.exec(typed.toUpperCase().replace(/[\s-]/g, ''));
  if (!m) return null;
  const [, yy, seq, check] = m as unknown as [string, string, string, string];
  if (Number(seq) === 0 || luhnCheckDigit(yy + seq) !== Number(check)) return null;
  return `VC${yy}-${seq}-${check}`;
}

/** The year and sequence of a serial in its written form. */
export function serialParts(serial: string): { year: number; sequence: number } | null {
  const s = normalizeSerial(serial);
  if (!s) return null;
  return { year: 2000 + Number(s.slice(2, 4)), sequence: Number(s.slice(5, 11)) };
}
