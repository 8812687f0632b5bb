import { gtinProblem, normalizeGtinInput } from './gtin';
import { normalizePartNumber } from './part-number';
import { normalizeReturnReference } from './schemas/warehouse';
import { normalizeServiceReference } from './service';
import { normalizeSerial } from './unit-serial';

/**
 * What a keyboard-wedge scanner (or a person) types into a Floor scan field, read as one of the codes the shop
 * prints. Each kind has a reader here (pure: the code's canonical form, or null when it cannot be that kind) and a
 * look-up in server/services/scan.ts. To add a kind, add its name to SCAN_KINDS, its words to SCAN_KIND_WORDS, its
 * reader to SCAN_READERS, and its look-up to the registry in scan.ts. The Bench's field takes service request numbers
 * and unit serials; the Floor's fields take parts, bins and returns, and refuse the others saying what they are.
 */
export const SCAN_KINDS = ['part', 'bin', 'return', 'service', 'unit'] as const;
export type ScanKind = (typeof SCAN_KINDS)[number];

/** How a kind is named in a refusal ("that is a bin label") and what its codes look like. */
export const SCAN_KIND_WORDS: Record<ScanKind, { label: string; looksLike: string }> = {
  part: { label: 'a part label', looksLike: 'a part number such as FUL-20-0203 or a 13-digit GTIN' },
  bin: { label: 'a bin label', looksLike: 'a bin code such as A-01-2' },
  return: { label: 'a return label', looksLike: 'a return number such as RT-5001' },
  service: { label: 'a service request label', looksLike: 'a request number such as SR-7001' },
  unit: { label: "a unit's serial plate", looksLike: 'a serial such as VC26-004217-5' },
};

/** A bin code as typed or scanned: "A-01-2", "a0102" and "A 01 2" are the same bin. */
export function normalizeBinCode(raw: string): string | null {
  const m = /^\s*([A-Za-z])[\s-]*(\d{1,2})[\s-]*(\d)\s*$/.exec(raw);
  return m ? `${m[1]!.toUpperCase()}-${m[2]!.padStart(2, '0')}-${m[3]}` : null;
}

/** A part's code: a GTIN (13 digits, check digit right) or a part number / alias in its flat form. */
export type PartKey = { by: 'gtin'; gtin: string } | { by: 'number'; normalized: string };

export function readPartCode(raw: string): PartKey | null {
  const gtin = normalizeGtinInput(raw);
  if (gtin) return gtinProblem(gtin) ? null : { by: 'gtin', gtin };
  const normalized = normalizePartNumber(raw);
  return normalized.length >= 2 && normalized.length <= 40 && /[A-Z]/.test(normalized) ? { by: 'number', normalized } : null;
}

export interface ScanKeys {
  part: PartKey;
  bin: string;
  return: string;
  service: string;
  unit: string;
}

export const SCAN_READERS: { [K in ScanKind]: (raw: string) => ScanKeys[K] | null } = {
  part: readPartCode,
  bin: normalizeBinCode,
  return: normalizeReturnReference,
  service: normalizeServiceReference,
  unit: normalizeSerial,
};

/**
 * Why a code cannot be read at all, before any look-up: nothing typed, far too long, or 13 digits whose check digit
 * is wrong (a misread or mistyped GTIN). Null when it may be read.
 */
export function scanProblem(raw: string): string | null {
  const code = raw.trim();
  if (code.length === 0) return 'Nothing was scanned';
  if (code.length > 60) return 'That is too long for any of our labels';
  const gtin = normalizeGtinInput(code);
  return gtin ? gtinProblem(gtin) : null;
}

/** "a part label or a bin label" */
export function acceptedWords(kinds: readonly ScanKind[]): string {
  const words = kinds.map((k) => SCAN_KIND_WORDS[k].looksLike);
  return words.length <= 1 ? (words[0] ?? '') : `${words.slice(0, -1).join(', ')} or ${words.at(-1)}`;
}
