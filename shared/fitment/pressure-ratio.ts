import { absoluteKpa, psiToKpa, type AbsoluteKpa } from '../units';

/** Compressor inlet pressure: ambient less the filter and intake loss. */
export function compressorInletKpa(ambient: AbsoluteKpa, inletLossPsi: number): AbsoluteKpa {
  return absoluteKpa(ambient - psiToKpa(inletLossPsi));
}

/** Compressor discharge pressure: manifold plus the charge-side (intercooler and piping) loss. */
export function compressorOutletKpa(manifold: AbsoluteKpa, chargeLossPsi: number): AbsoluteKpa {
  return absoluteKpa(manifold + psiToKpa(chargeLossPsi));
}

/** PR = (MAP + Δp_charge) / (p_ambient − Δp_inlet). */
export function pressureRatio(
  manifold: AbsoluteKpa,
  ambient: AbsoluteKpa,
  chargeLossPsi: number,
  inletLossPsi: number,
): number {
  return compressorOutletKpa(manifold, chargeLossPsi) / compressorInletKpa(ambient, inletLossPsi);
}
