const GRAMS_PER_KG = 1000;

/**
 * Kilograms as typed ("9.2", "0.06") to whole grams, read from the digits so no floating-point rounding creeps in.
 * More than three decimals keeps a fraction of a gram, so the shared schema's "whole grams" rule names the
 * mistake; anything that is not a plain number is NaN.
 */
export function kilogramsFieldGrams(text: string): number {
  const m = /^\s*(\d{1,6})?(?:\.(\d+))?\s*$/.exec(text);
  if (!m || (m[1] === undefined && m[2] === undefined)) return Number.NaN;
  const whole = Number(m[1] ?? '0') * GRAMS_PER_KG;
  const decimals = m[2] ?? '';
  const grams = whole + Number(decimals.slice(0, 3).padEnd(3, '0'));
  return /[1-9]/.test(decimals.slice(3)) ? grams + 0.5 : grams;
}

/** Whole grams as kilograms for the weight box, without trailing zeros: 9200 → "9.2", 60 → "0.06". */
export function gramsToKilogramsText(grams: number | null | undefined): string {
  if (grams === null || grams === undefined || !Number.isFinite(grams)) return '';
  const whole = Math.floor(grams / GRAMS_PER_KG);
  const rest = String(grams % GRAMS_PER_KG).padStart(3, '0').replace(/0+$/, '');
  return rest ? `${whole}.${rest}` : String(whole);
}
