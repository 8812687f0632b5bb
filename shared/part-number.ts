/** What a buyer types is compared in one canonical form: upper-case letters and digits only. */
export function normalizePartNumber(input: string): string {
  return input
    .normalize('NFKD')
    .toUpperCase()
    .replace(/[^A-Z0-9]/g, '');
}

/** True when the text looks like a part number rather than words: it has digits and no spaces between words. */
export function looksLikePartNumber(input: string): boolean {
  const trimmed = input.trim();
  return /\d/.test(trimmed) && /[A-Za-z]/.test(trimmed) && !/\s\S+\s/.test(trimmed) && trimmed.length >= 4;
}
