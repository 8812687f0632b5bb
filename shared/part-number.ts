/** What a buyer types is compared in one canonical form: upper-case letters and digits only. */
export function normalizePartNumber(input: string): string {
  return input
    .normalize('NFKD')
    .toUpperCase()
    .replace(/[^A-Z0-9]/g, '');
}
