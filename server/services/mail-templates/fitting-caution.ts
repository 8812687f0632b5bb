import type { CategorySlug } from '../../../shared/catalog';
import { caution, type SafeHtml } from './layout';

/** Complete units and cartridges are what get bolted straight onto an engine and started. */
const FITTED_AS_A_UNIT: ReadonlySet<CategorySlug> = new Set<CategorySlug>(['turbochargers', 'cartridges']);

export const FITTING_CAUTION_TITLE = 'Before you fit it';

// Oil priming and fitting by a qualified mechanic are common practice for turbocharger installation.
export const FITTING_CAUTION_TEXT =
  'Prime the oil supply before the first start so the bearings never run dry. ' +
  'Turbochargers and exhaust parts get hot enough to burn: let them cool before you touch them. ' +
  'Have the unit fitted by a licensed mechanic, following local regulations.';

export function needsFittingCaution(lines: ReadonlyArray<{ category: CategorySlug }>): boolean {
  return lines.some((line) => FITTED_AS_A_UNIT.has(line.category));
}

export function fittingCautionHtml(): SafeHtml {
  return caution(FITTING_CAUTION_TITLE, FITTING_CAUTION_TEXT);
}

export function fittingCautionText(): string[] {
  return ['', `CAUTION - ${FITTING_CAUTION_TITLE.toUpperCase()}`, FITTING_CAUTION_TEXT];
}
