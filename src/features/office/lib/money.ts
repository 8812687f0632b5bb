/**
 * A decimal typed by a person ("123.45", "$1,234.5", "9.2") times `scale` (100 for dollars → cents, 1000 for kg → g).
 * NaN when it is not a number, so the form can say so. One extra decimal is kept so the schema refuses
 * "12.345" dollars as "not whole cents" rather than rounding it silently.
 */
export function parseScaled(text: string, scale: number): number {
  const cleaned = text.trim().replace(/^\$/, '').replace(/,/g, '');
  if (!/^(\d+(\.\d*)?|\.\d+)$/.test(cleaned)) return Number.NaN;
  return Math.round(Number(cleaned) * scale * 10) / 10;
}

export const parseDollars = (text: string) => parseScaled(text, 100);

export function formatScaled(value: number | undefined | null, scale: number, decimals: number): string {
  if (value === undefined || value === null || !Number.isFinite(value)) return '';
  // Weights read better without trailing zeros ("8", "0.06"); money keeps its cents.
  const fixed = (value / scale).toFixed(decimals);
  return decimals > 2 ? String(Number(fixed)) : fixed;
}

export function formatBytes(bytes: number): string {
  if (bytes >= 1_000_000) return `${(bytes / 1_000_000).toFixed(1)} MB`;
  if (bytes >= 1000) return `${Math.round(bytes / 1000)} kB`;
  return `${bytes} bytes`;
}
