import { isValidGtin13 } from '../../shared/gtin';

/**
 * Barcodes for printed labels, drawn by bwip-js as SVG (loaded on first use, so starting the server does not pay for
 * it). Code 128 (ISO/IEC 15417) carries the letters, digits and dashes of our references; EAN-13 carries a part's
 * GTIN-13. Every keyboard-wedge scanner on the Floor reads both and types the code followed by Enter.
 */
export async function code128Svg(text: string, options: { heightMm?: number } = {}): Promise<string> {
  const { toSVG } = await import('bwip-js/node');
  // height in millimetres; scale 2 makes each narrow bar two SVG units wide. The label adds its own quiet zone.
  return toSVG({ bcid: 'code128', text, scale: 2, height: options.heightMm ?? 14, includetext: false, backgroundcolor: 'FFFFFF', paddingwidth: 10, paddingheight: 2 });
}

const ean13Cache = new Map<string, string>();

/**
 * EAN-13 of a GTIN-13 with its human-readable digits under the bars (the first digit outside on the left, as the
 * symbology prints it) and the light-margin mark on the right, so nothing may be printed into the quiet zone.
 * Drawings are kept (a few thousand at most), since label sheets repeat the same parts.
 */
export async function ean13Svg(gtin: string): Promise<string> {
  if (!isValidGtin13(gtin)) throw new Error(`${gtin} is not a valid GTIN-13`);
  const kept = ean13Cache.get(gtin);
  if (kept) return kept;
  const { toSVG } = await import('bwip-js/node');
  const svg = toSVG({ bcid: 'ean13', text: gtin, scale: 2, height: 16, includetext: true, guardwhitespace: true, backgroundcolor: 'FFFFFF', paddingwidth: 2, paddingheight: 1 });
  if (ean13Cache.size > 5000) ean13Cache.clear();
  ean13Cache.set(gtin, svg);
  return svg;
}
