import type { DisplacementUnit } from '../../../../shared/schemas/fitment';

const STORAGE_KEY = 'spoolyard.fitment.displacement-unit';

/** The displacement unit this device last used; litres when none was chosen, as most engines are quoted in them. */
export function storedDisplacementUnit(): DisplacementUnit {
  try {
    return window.localStorage.getItem(STORAGE_KEY) === 'in3' ? 'in3' : 'L';
  } catch {
    return 'L';
  }
}

export function rememberDisplacementUnit(unit: DisplacementUnit): void {
  try {
    window.localStorage.setItem(STORAGE_KEY, unit);
  } catch {
    // Private windows may refuse storage; the choice then lasts for this page only.
  }
}

export const DISPLACEMENT_UNIT_LABELS: Record<DisplacementUnit, { short: string; long: string }> = {
  L: { short: 'L', long: 'litres' },
  in3: { short: 'cu in', long: 'cubic inches' },
};
