import { CircleCheck } from 'lucide-react';
import type { FitmentCandidate, TurbineHousing } from '../../../../shared/schemas/fitment';
import { show } from '../lib/units';

const sentence = (s: string) => `${s.charAt(0).toUpperCase()}${s.slice(1)}.`;
const fullBoost = (h: TurbineHousing) => (h.fullBoostRpm !== null ? show.rpm(h.fullBoostRpm) : 'not before peak power');

/** Marked with a shape and a word, never colour alone. */
function Recommended() {
  return (
    <span className="inline-flex items-center gap-1 font-semibold text-machined">
      <CircleCheck aria-hidden className="size-4 shrink-0" />
      Recommended
    </span>
  );
}

/**
 * Every turbine housing the catalogue sells for the frame: a smaller A/R spools sooner and chokes the exhaust at
 * peak power, a larger one breathes freely and spools later. The note says why each is or is not the one.
 */
export function TurbineHousings({ candidate }: { candidate: FitmentCandidate }) {
  const housings = candidate.housings;
  if (housings.length === 0) return <p className="text-cast">We have no turbine housing data for this frame.</p>;
  return (
    <div className="min-w-0">
      <table className="hidden w-full border-collapse text-left sm:table">
        <caption className="sr-only">{`Turbine housings for frame ${candidate.frameCode}`}</caption>
        <thead>
          <tr className="border-b-2 border-cast-line text-sm">
            <th scope="col" className="py-2 pr-3">A/R</th>
            <th scope="col" className="py-2 pr-3 text-right">Full boost from</th>
            <th scope="col" className="py-2 pr-3 text-right">Back pressure</th>
            <th scope="col" className="py-2 pr-3 text-right">Wastegate</th>
            <th scope="col" className="py-2">Why</th>
          </tr>
        </thead>
        <tbody>
          {housings.map((h) => (
            <tr key={h.housingAr} className={`border-b border-cast-line/70 align-top ${h.recommended ? 'bg-machined-tint/60' : ''}`} data-recommended={h.recommended || undefined}>
              <th scope="row" className="tabular py-2 pr-3 whitespace-nowrap">
                {h.housingAr.toFixed(2)}
                {h.recommended && (
                  <span className="block text-sm">
                    <Recommended />
                  </span>
                )}
              </th>
              <td className="tabular py-2 pr-3 text-right whitespace-nowrap">{fullBoost(h)}</td>
              <td className="tabular py-2 pr-3 text-right whitespace-nowrap">{h.backPressureRatio.toFixed(2)} × boost</td>
              <td className="tabular py-2 pr-3 text-right whitespace-nowrap">{show.pct(h.wastegateShare)}</td>
              <td className="py-2 text-sm">{sentence(h.note)}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <ul className="grid gap-2 sm:hidden" aria-label={`Turbine housings for frame ${candidate.frameCode}`}>
        {housings.map((h) => (
          <li key={h.housingAr} className={`rounded-md p-3 ring-1 ${h.recommended ? 'bg-machined-tint/60 ring-machined/50' : 'bg-white ring-cast-line'}`}>
            <p className="tabular flex flex-wrap items-baseline gap-x-3">
              <span className="font-bold">{h.housingAr.toFixed(2)} A/R</span>
              {h.recommended && <Recommended />}
            </p>
            <p className="text-sm">{sentence(h.note)}</p>
            {!h.recommended && <p className="tabular text-sm text-cast">Wastegate {show.pct(h.wastegateShare)} at peak power.</p>}
          </li>
        ))}
      </ul>
    </div>
  );
}
