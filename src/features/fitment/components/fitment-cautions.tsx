import { FITMENT_CAUTIONS } from '../../../../shared/fitment/check';
import type { FitmentCaution } from '../../../../shared/schemas/fitment';
import { Caution } from '../../../components/ui/caution';

const GENERAL_CAUTIONS = new Set(FITMENT_CAUTIONS.map((c) => c.code));

/** A short title for each caution the numbers can raise; the message itself carries the number. */
const CAUTION_TITLES: Record<string, string> = {
  'charge-temperature': 'Hot charge air',
  'no-intercooler': 'No charge cooler',
  'hot-outlet': 'Hot compressor outlet',
  'fuel-flow': 'Fuel system',
  'back-pressure': 'Exhaust back pressure',
  'overspeed-margin': 'Little shaft-speed margin',
  'specific-output': 'Power per litre',
};

/** Cautions: each one the numbers raised in its own amber block, then the ones shown beside every result. */
export function FitmentCautions({ cautions }: { cautions: readonly FitmentCaution[] }) {
  const reacting = cautions.filter((c) => !GENERAL_CAUTIONS.has(c.code));
  const general = cautions.filter((c) => GENERAL_CAUTIONS.has(c.code));
  return (
    <div className="grid gap-3">
      {reacting.map((c) => (
        <div key={c.code} data-caution={c.code}>
          <Caution title={CAUTION_TITLES[c.code] ?? 'Caution'}>
            <p>{c.message}</p>
          </Caution>
        </div>
      ))}
      {general.length > 0 && (
        <Caution title="Before you buy or fit">
          <ul className="mt-1 list-disc space-y-1 pl-5">
            {general.map((c) => (
              <li key={c.code}>{c.message}</li>
            ))}
          </ul>
        </Caution>
      )}
    </div>
  );
}
