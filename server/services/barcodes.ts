/**
 * Barcodes for printed labels. Code 128 (ISO/IEC 15417) carries the letters, digits and dashes of our references and
 * is read by every keyboard-wedge scanner on the Floor, which types it followed by Enter. bwip-js is loaded on first
 * use, so starting the server does not pay for it.
 */
export async function code128Svg(text: string): Promise<string> {
  const { toSVG } = await import('bwip-js/node');
  // height in millimetres; scale 2 makes each narrow bar two SVG units wide. The label adds its own quiet zone.
  return toSVG({ bcid: 'code128', text, scale: 2, height: 14, includetext: false, backgroundcolor: 'FFFFFF', paddingwidth: 10, paddingheight: 2 });
}
