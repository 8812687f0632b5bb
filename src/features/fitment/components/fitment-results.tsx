import { useEffect, useRef } from 'react';
import { APPLICATION_DEFAULTS } from '../../../../shared/fitment/defaults';
import type { FitmentCaution, FitmentRequest, FitmentResponse } from '../../../../shared/schemas/fitment';
import type { SavedFitment } from '../../../../shared/schemas/saved-fitments';
import { Caution } from '../../../components/ui/caution';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { useFrameMaps } from '../api/get-frame-maps';
import { show, type UnitSystem } from '../lib/units';
import { CandidateList } from './candidate-list';
import { CompressorMapChart } from './compressor-map-chart';
import { FrameParts } from './frame-parts';
import { FUEL_LABELS } from './fitment-form';
import { SaveFitmentForm } from './save-fitment-form';
import { VerdictBadge } from './verdict-badge';

function Figure({ label, value, detail }: { label: string; value: string; detail?: string }) {
  // The number large, its unit smaller beside it, so "30.0 lb/min" never breaks across lines.
  const [number, ...unit] = value.split(' ');
  return (
    <div className="rounded-lg bg-white p-4 ring-1 ring-cast-line">
      <dt className="text-sm font-semibold text-cast">{label}</dt>
      <dd className="tabular whitespace-nowrap text-2xl font-bold">
        {number}
        {unit.length > 0 && <span className="ml-1 text-base font-semibold">{unit.join(' ')}</span>}
      </dd>
      {detail && <dd className="tabular text-sm text-cast">{detail}</dd>}
    </div>
  );
}

/** The cautions shown beside every result. */
export function FitmentCautions({ cautions }: { cautions: readonly FitmentCaution[] }) {
  return (
    <Caution title="Before you buy or fit">
      <ul className="mt-1 list-disc space-y-1 pl-5">
        {cautions.map((c) => (
          <li key={c.code}>{c.message}</li>
        ))}
      </ul>
    </Caution>
  );
}

function AssumptionsUsed({ result, system }: { result: FitmentResponse; system: UnitSystem }) {
  const a = result.assumptions;
  const defaulted = new Set(a.defaulted);
  const rows: Array<[string, string, string]> = [
    ['altitudeM', 'Altitude', `${show.altitude(a.altitudeM, system)} (air at ${result.required.ambientPressureKpa.toFixed(1)} kPa)`],
    ['ambientC', 'Inlet air temperature', show.temp(a.ambientC, system)],
    ['intercooled', 'Intercooled', a.intercooled ? `yes, effectiveness ${show.pct(a.intercoolerEffectiveness)}` : 'no'],
    ['bsfc', 'BSFC', show.bsfc(a.bsfc, system)],
    ['afr', 'Air-fuel ratio', `${a.afr.toFixed(1)}:1`],
    ['volumetricEfficiency', 'Volumetric efficiency', show.pct(a.volumetricEfficiency)],
    ['manifoldTempC', 'Manifold air temperature', `${show.temp(a.manifoldTempC, system)}${a.manifoldTempGiven ? '' : ' (worked out)'}`],
    ['chargeLossPsi', 'Charge-side pressure loss', show.lossPsi(a.chargeLossPsi, system)],
    ['inletLossPsi', 'Inlet pressure loss', show.lossPsi(a.inletLossPsi, system)],
    ['compressorEfficiency', 'Compressor efficiency', show.pct(a.compressorEfficiency)],
    ['fullBoostRpm', 'Full boost from', show.rpm(a.fullBoostRpm)],
  ];
  return (
    <details className="rounded-md border border-cast-line bg-white">
      <summary className="min-h-11 cursor-pointer px-4 py-2 font-semibold text-temper">Assumptions used in this check</summary>
      <table className="w-full border-collapse border-t border-cast-line text-left text-sm">
        <tbody>
          {rows.map(([key, label, value]) => (
            <tr key={key} className="border-b border-cast-line/60">
              <th scope="row" className="px-4 py-1.5 font-semibold">
                {label}
              </th>
              <td className="tabular px-4 py-1.5">{value}</td>
              <td className="px-4 py-1.5 text-cast">{defaulted.has(key) ? 'our default' : 'yours'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}

export interface FitmentResultsProps {
  request: FitmentRequest;
  result: FitmentResponse;
  system: UnitSystem;
  selected: string | null;
  onSelect: (frameCode: string) => void;
  cameFrom: string | null;
  signedIn: boolean;
  saved: Pick<SavedFitment, 'id' | 'name'> | null;
  onSaved: (saved: SavedFitment) => void;
  onAddedToCart?: () => unknown;
}

export function FitmentResults({ request, result, system, selected, onSelect, cameFrom, signedIn, saved, onSaved, onAddedToCart }: FitmentResultsProps) {
  const maps = useFrameMaps();
  const headingRef = useRef<HTMLHeadingElement>(null);
  const mapRef = useRef<HTMLElement>(null);
  const r = result.required;
  const a = result.assumptions;
  const best = result.candidates[0];
  const chosen = result.candidates.find((c) => c.frameCode === selected) ?? best;
  const frame = maps.data?.items.find((f) => f.code === chosen?.frameCode);

  useEffect(() => {
    headingRef.current?.focus();
  }, [result]);

  const select = (code: string) => {
    onSelect(code);
    mapRef.current?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  };

  return (
    <section aria-labelledby="fitment-results-heading" className="grid gap-6">
      <div>
        <h2 id="fitment-results-heading" ref={headingRef} tabIndex={-1} className="text-2xl font-bold outline-none">
          What your engine needs
        </h2>
        <p className="mt-1 text-cast">
          {show.displacement(a.displacementL, system)}, {FUEL_LABELS[a.fuel].toLowerCase()}, {show.power(a.powerHp, system)} at {show.rpm(a.rpm)},{' '}
          {APPLICATION_DEFAULTS[a.application].label}. At peak power:
        </p>
      </div>
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-4">
        <Figure label="Airflow" value={show.flow(r.airflowLbMin, system)} detail={`corrected ${show.flow(r.correctedFlowLbMin, system)}`} />
        <Figure label="Boost" value={show.boost(r.boostPsi, system)} detail={`manifold ${show.pressureAbs(r.manifoldPressureKpa, system)} absolute`} />
        <Figure label="Pressure ratio" value={r.pressureRatio.toFixed(2)} detail="compressor outlet ÷ inlet" />
        <Figure label="Compressor outlet" value={show.temp(r.compressorOutletC, system)} detail={`manifold ${show.temp(r.manifoldTempC, system)}`} />
      </dl>

      <FitmentCautions cautions={result.cautions} />

      {best && (
        <p className="flex flex-wrap items-center gap-2 text-lg">
          <span className="font-semibold">Best fit:</span>
          <span className="part-no">{best.frameCode}</span> {best.frameName}
          <VerdictBadge verdict={best.verdict} />
          {best.verdict !== 'fits' && best.verdict !== 'marginal' && <span className="text-cast">— no frame in the range fits this engine well.</span>}
        </p>
      )}

      <div className="rounded-lg bg-panel p-4">
        <SaveFitmentForm request={request} signedIn={signedIn} saved={saved} onSaved={onSaved} />
      </div>

      <section ref={mapRef} aria-labelledby="fitment-map-heading" className="grid scroll-mt-4 gap-3">
        <h3 id="fitment-map-heading" className="flex flex-wrap items-center gap-2 text-xl font-bold">
          On the map: <span className="part-no">{chosen?.frameCode}</span> {chosen?.frameName}
          {chosen && <VerdictBadge verdict={chosen.verdict} />}
        </h3>
        {maps.isPending ? (
          <LoadingState label="Loading the compressor map…" />
        ) : maps.isError ? (
          <ErrorState title="The compressor map did not load" message={maps.error.message} onRetry={() => maps.refetch()} />
        ) : frame && chosen ? (
          <CompressorMapChart frame={frame} line={result.operatingLine} candidate={chosen} system={system} />
        ) : (
          <p className="text-cast">We have no map for this frame.</p>
        )}
        {chosen && <FrameParts frameCode={chosen.frameCode} fitment={saved} onAddedToCart={onAddedToCart} />}
      </section>

      <section aria-labelledby="fitment-frames-heading" className="grid gap-3">
        <h3 id="fitment-frames-heading" className="text-xl font-bold">
          Every frame, best fit first
        </h3>
        <p className="text-cast">Each verdict follows the engine across its rev range, from full boost at {show.rpm(a.fullBoostRpm)} to peak power. Pick one to see it on the map.</p>
        <CandidateList candidates={result.candidates} selected={chosen?.frameCode ?? null} cameFrom={cameFrom} onSelect={select} />
      </section>

      <AssumptionsUsed result={result} system={system} />
    </section>
  );
}
