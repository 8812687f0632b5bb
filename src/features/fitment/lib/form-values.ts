import { DEFAULT_INTERCOOLED } from '../../../../shared/fitment/defaults';
import type { FitmentRequest } from '../../../../shared/schemas/fitment';
import { storedDisplacementUnit } from './displacement-unit';
import { requestToForm, type FitmentFormValues, type UnitSystem } from './units';

// The form's starting values, apart from the form itself: the fitment page works them out before the form's code
// (and its form library) has arrived.

/** A 2.0 L petrol street engine making 300 hp at 6500 rpm: a common first turbo project. */
const STARTING_ENGINE: Partial<FitmentRequest> = { displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street' };

const BLANK: FitmentFormValues = {
  displacement: '',
  displacementUnit: 'L',
  power: '',
  rpm: '',
  fuel: 'petrol',
  application: 'street',
  altitude: '',
  inletTemp: '',
  intercooled: DEFAULT_INTERCOOLED,
  bsfc: '',
  afr: '',
  volumetricEfficiency: '',
  manifoldTemp: '',
  chargeLoss: '',
  inletLoss: '',
  compressorEfficiency: '',
  fullBoostRpm: '',
  intercoolerEffectiveness: '',
  cylinders: '',
};

export function formValuesFor(request: Partial<FitmentRequest> | null, system: UnitSystem): FitmentFormValues {
  return requestToForm(request ?? STARTING_ENGINE, system, { ...BLANK, displacementUnit: storedDisplacementUnit() });
}

