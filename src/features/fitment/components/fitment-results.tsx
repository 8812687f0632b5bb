import { ArrowLeft, Ban } from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import { APPLICATION_DEFAULTS } from '../../../../shared/fitment/defaults';
import { isUsable } from '../../../../shared/fitment/verdict';
import type { FitmentCandidate, FitmentRequest, FitmentResponse } from '../../../../shared/schemas/fitment';
import type { SavedFitment } from '../../../../shared/schemas/saved-fitments';
import { FitmentCautions } from './fitment-cautions';
import { ErrorState, LoadingState } from '../../../components/ui/states';
import { useFrameMaps } from '../api/get-frame-maps';
import { show, type UnitSystem } from '../lib/units';
import { BuildSheet } from './build-sheet';
import { CandidateList, candidateKey } from './candidate-list';
import { CompressorMapChart } from './compressor-map-chart';
import { FrameExploded } from './frame-exploded';
import { FrameParts } from './frame-parts';
import { FUEL_LABELS } from './fitment-form-view';
import { TurbineHousings } from './turbine-housings';
import { VerdictBadge } from './verdict-badge';

/** One ruled line of the sheet's figures: the name, the number with its unit kept together, and what it is measured against. */
function Figure({ label, value, detail }: { label: string; value: string; detail?: string }) {
  return (
    <div className="grid grid-cols-[minmax(0,1fr)_auto] items-baseline gap-x-3 border-b border-cast-line/70 py-2">
      <dt className="font-semibold">{label}</dt>
      <dd className="tabular text-right text-lg font-bold whitespace-nowrap">{value}</dd>
      {detail && <dd className="tabular col-span-2 text-sm text-cast">{detail}</dd>}
    </div>
  );
}

function AssumptionsUsed({ result, system }: { result: FitmentResponse; system: UnitSystem }) {
  const a = result.assumptions;
  const defaulted = new Set(a.defaulted);
  const rows: Array<[string, string, string]> = [
    ['altitudeM', 'Altitude', `${show.altitude(a.altitudeM, system)} (air at ${result.required.ambientPressureKpa.toFixed(1)} kPa)`],
    ['ambientC', 'Inlet air temperature', show.temp(a.ambientC, system)],
    ['intercooled', 'Intercooled', a.intercooled ? 'yes' : 'no'],
    ['intercoolerEffectiveness', 'Intercooler effectiveness', a.intercooled ? show.pct(a.intercoolerEffectiveness) : '—'],
    ['bsfc', 'BSFC', show.bsfc(a.bsfc, system)],
    ['afr', 'Air-fuel ratio', `${a.afr.toFixed(1)}:1`],
    ['volumetricEfficiency', 'Volumetric efficiency', show.pct(a.volumetricEfficiency)],
    ['manifoldTempC', 'Manifold air temperature', `${show.temp(a.manifoldTempC, system)}${a.manifoldTempGiven ? '' : ' (worked out)'}`],
    ['chargeLossPsi', 'Charge-side pressure loss', show.lossPsi(a.chargeLossPsi, system)],
    ['inletLossPsi', 'Inlet pressure loss', show.lossPsi(a.inletLossPsi, system)],
    ['compressorEfficiency', 'Compressor efficiency', show.pct(a.compressorEfficiency)],
    ['fullBoostRpm', 'Full boost from', show.rpm(a.fullBoostRpm)],
    ['cylinders', 'Cylinders', a.cylinders === null ? 'not given' : String(a.cylinders)],
    ['turbineInletC', 'Turbine inlet temperature', show.temp(a.turbineInletC, system)],
  ];
  const source = (key: string) => (key === 'turbineInletC' ? 'for the fuel' : key === 'cylinders' && a.cylinders === null ? '' : defaulted.has(key) ? 'our default' : 'yours');
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
              <td className="px-4 py-1.5 text-cast">{source(key)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}

/** The numbers of the build at peak power, judged on its own frame's map; without a build, the engine's needs. */
function Figures({ result, candidate, system }: { result: FitmentResponse; candidate: FitmentCandidate | undefined; system: UnitSystem }) {
  const r = result.required;
  const a = result.assumptions;
  const c = candidate;
  return (
    <dl className="grid gap-x-8 rounded-lg bg-white px-4 py-1 ring-1 ring-cast-line sm:grid-cols-2">
      <Figure label="Boost" value={show.boost(r.boostPsi, system)} detail={`manifold ${show.pressureAbs(r.manifoldPressureKpa, system)} absolute`} />
      <Figure label="Pressure ratio" value={(c?.pressureRatio ?? r.pressureRatio).toFixed(2)} detail="compressor outlet ÷ inlet" />
      <Figure
        label="Compressor outlet"
        value={show.temp(c?.compressorOutletC ?? r.compressorOutletC, system)}
        detail={c ? `on the ${c.frameCode} map` : `at an assumed ${show.pct(a.compressorEfficiency)} efficiency`}
      />
      <Figure
        label="Manifold air"
        value={show.temp(c?.manifoldTempC ?? r.manifoldTempC, system)}
        detail={a.intercooled ? `after the intercooler (${show.pct(a.intercoolerEffectiveness)})` : 'no intercooler'}
      />
      {c && (
        <>
          <Figure label="Compressor efficiency" value={c.efficiency !== null ? show.pct(c.efficiency) : 'off the map'} detail="at peak power, from the map" />
          <Figure
            label="Shaft speed"
            value={c.shaftRpm !== null ? show.shaftRpm(c.shaftRpm) : 'past choke'}
            detail={c.shaftRpm !== null ? `${Math.round((100 * c.shaftRpm) / c.maxShaftRpm)} % of the ${show.rpm(c.maxShaftRpm)} limit` : `limit ${show.rpm(c.maxShaftRpm)}`}
          />
        </>
      )}
      <Figure label="Fuel flow" value={show.fuelFlow(r.fuelFlowLbH, system)} detail={`at peak power, BSFC ${show.bsfc(a.bsfc, system)}`} />
      <Figure
        label="Per injector"
        value={r.injectorCcMin !== null ? `${Math.round(r.injectorCcMin)} cc/min` : '—'}
        detail={r.injectorCcMin !== null ? `each of ${a.cylinders ?? '—'}, at 80 % duty` : 'give the number of cylinders under Advanced assumptions'}
      />
    </dl>
  );
}

function NextSteps({ steps, closest }: { steps: string[]; closest: FitmentCandidate | undefined }) {
  return (
    <section aria-labelledby="next-steps-heading" className="grid gap-3 rounded-lg border-2 border-oxide/60 bg-white p-5 shadow-sm" data-testid="next-steps">
      <div className="flex items-start gap-3">
        <Ban aria-hidden className="mt-1 size-6 shrink-0 text-oxide" />
        <div>
          <h3 id="next-steps-heading" className="text-2xl font-bold">
            What to change
          </h3>
          <p className="text-cast">No frame in the range serves this engine as asked, so there is nothing to order yet. Any one of these would change that:</p>
        </div>
      </div>
      <ol className="grid list-decimal gap-2 pl-7 text-lg marker:font-bold">
        {(steps.length > 0 ? steps : ['Change the power goal or the peak-power rpm and check again.']).map((s, i) => (
          <li key={i}>{s}</li>
        ))}
      </ol>
      {closest && (
        <p className="flex flex-wrap items-center gap-2 text-cast">
          Closest as it stands: <span className="part-no text-ink">{closest.frameCode}</span>
          <span className="text-ink">
            {closest.frameName}
            {closest.layout === 'twin' ? ' (twin)' : ''}
          </span>
          <VerdictBadge verdict={closest.verdict} direction={false} />
        </p>
      )}
    </section>
  );
}

export interface FitmentResultsProps {
  request: FitmentRequest;
  result: FitmentResponse;
  system: UnitSystem;
  /** The frame the buyer came from (a part page): shown on the map first, and built on if it serves. */
  cameFrom: string | null;
  signedIn: boolean;
  /** An approved trade account, which may back-order what is short. */
  canBackorder: boolean;
  saved: Pick<SavedFitment, 'id' | 'name'> | null;
  onSaved: (saved: SavedFitment) => void;
  onAddedToCart?: () => unknown;
}

/** The answer to a check, read as a build sheet: what to order, then why (map, turbine, cautions, figures), then the rest. */
export function FitmentResults({ request, result, system, cameFrom, signedIn, canBackorder, saved, onSaved, onAddedToCart }: FitmentResultsProps) {
  const maps = useFrameMaps();
  const headingRef = useRef<HTMLHeadingElement>(null);
  const mapRef = useRef<HTMLElement>(null);
  const buildRef = useRef<HTMLDivElement>(null);
  const a = result.assumptions;
  const candidates = result.candidates;
  const recommended = candidates.find(isUsable);
  const fromFrame = cameFrom ? (candidates.find((c) => c.frameCode === cameFrom && isUsable(c)) ?? candidates.find((c) => c.frameCode === cameFrom)) : undefined;
  const firstBuild = fromFrame && isUsable(fromFrame) ? fromFrame : recommended;
  const [buildKey, setBuildKey] = useState<string | null>(firstBuild ? candidateKey(firstBuild) : null);
  const [mapKey, setMapKey] = useState<string | null>(() => {
    const first = fromFrame ?? firstBuild ?? candidates[0];
    return first ? candidateKey(first) : null;
  });
  const build = candidates.find((c) => candidateKey(c) === buildKey);
  const onMap = candidates.find((c) => candidateKey(c) === mapKey) ?? build ?? candidates[0];
  const frameOf = (c: FitmentCandidate | undefined) => maps.data?.items.find((f) => f.code === c?.frameCode);
  const others = candidates.filter((c) => candidateKey(c) !== buildKey);

  useEffect(() => {
    headingRef.current?.focus();
  }, [result]);

  const showOnMap = (key: string) => {
    setMapKey(key);
    mapRef.current?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  };
  const buildOn = (key: string) => {
    setBuildKey(key);
    setMapKey(key);
    buildRef.current?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  };

  return (
    <section aria-labelledby="fitment-results-heading" className="grid min-w-0 gap-6">
      <div>
        <h2 id="fitment-results-heading" ref={headingRef} tabIndex={-1} className="text-2xl font-bold outline-none">
          {recommended ? 'Build sheet' : 'No frame fits as asked'}
        </h2>
        <p className="mt-1 text-cast">
          {show.displacementIn(a.displacementL, request.displacementUnit ?? 'L')}, {FUEL_LABELS[a.fuel].toLowerCase()}, {show.power(a.powerHp, system)} at{' '}
          {show.rpm(a.rpm)}, {APPLICATION_DEFAULTS[a.application].label}: {show.flow(result.required.airflowLbMin, system)} of air and{' '}
          {show.boost(result.required.boostPsi, system)} of boost at peak power.
        </p>
      </div>

      {fromFrame && build && fromFrame !== build && (
        <p role="note" className="rounded-md bg-panel p-3 leading-8">
          The frame you came from, <span className="part-no">{fromFrame.frameCode}</span> {fromFrame.frameName}, is{' '}
          <span className="align-middle">
            <VerdictBadge verdict={fromFrame.verdict} />
          </span>{' '}
          for this engine: it is on the map below, and the build is on <span className="part-no">{build.frameCode}</span> {build.frameName}.
        </p>
      )}

      <div ref={buildRef} className="scroll-mt-4">
        {build ? (
          <BuildSheet
            key={buildKey}
            candidate={build}
            frame={frameOf(build)}
            assumptions={a}
            request={request}
            recommended={build === recommended}
            signedIn={signedIn}
            canBackorder={canBackorder}
            saved={saved}
            onSaved={onSaved}
            onAddedToCart={onAddedToCart}
          />
        ) : (
          <NextSteps steps={result.nextSteps} closest={candidates[0]} />
        )}
      </div>

      <section aria-labelledby="fitment-cautions-heading" className="grid gap-3">
        <h3 id="fitment-cautions-heading" className="text-xl font-bold">
          Cautions
        </h3>
        <FitmentCautions cautions={result.cautions} />
      </section>

      <section aria-labelledby="fitment-figures-heading" className="grid gap-3">
        <h3 id="fitment-figures-heading" className="text-xl font-bold">
          {build ? (
            <>
              At peak power on <span className="part-no">{build.frameCode}</span>
              {build.layout === 'twin' ? ', per unit' : ''}
            </>
          ) : (
            'What the engine needs at peak power'
          )}
        </h3>
        <Figures result={result} candidate={build} system={system} />
      </section>

      <section ref={mapRef} aria-labelledby="fitment-map-heading" className="grid min-w-0 scroll-mt-4 gap-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h3 id="fitment-map-heading" className="flex flex-wrap items-center gap-x-2 gap-y-1 text-xl font-bold">
            <span>
              On the map: <span className="part-no">{onMap?.frameCode}</span> {onMap?.frameName}
              {onMap?.layout === 'twin' ? ' (twin, per unit)' : ''}
            </span>
            {onMap && <VerdictBadge verdict={onMap.verdict} direction={result.candidates.some((c) => c.verdict === 'fits' || c.verdict === 'marginal')} />}
          </h3>
          {build && onMap && onMap !== build && (
            <button
              type="button"
              onClick={() => setMapKey(candidateKey(build))}
              className="inline-flex min-h-10 items-center gap-1.5 rounded-md px-3 text-sm font-semibold text-temper ring-1 ring-cast-line hover:ring-temper"
            >
              <ArrowLeft aria-hidden className="size-4" />
              Back to the build’s frame
            </button>
          )}
        </div>
        <p className="text-cast">
          {onMap?.points.some((p) => p.segment === 'spool')
            ? 'The engine’s own line on this frame, from where boost starts to build to peak power. Square points on a dashed line are the spool, while the wastegate is shut; round points on a solid line hold full boost.'
            : 'The engine’s own line on this frame, from full boost to peak power.'}
        </p>
        {maps.isPending ? (
          <LoadingState label="Loading the compressor map…" />
        ) : maps.isError ? (
          <ErrorState title="The compressor map did not load" message={maps.error.message} onRetry={() => maps.refetch()} />
        ) : frameOf(onMap) && onMap ? (
          <CompressorMapChart frame={frameOf(onMap)!} line={result.operatingLine} candidate={onMap} system={system} candidateLine />
        ) : (
          <p className="text-cast">We have no map for this frame.</p>
        )}
      </section>

      {build && (
        <section aria-labelledby="fitment-turbine-heading" className="grid gap-3">
          <h3 id="fitment-turbine-heading" className="text-xl font-bold">
            Turbine housing on <span className="part-no">{build.frameCode}</span>
          </h3>
          <p className="text-cast">
            We pick the largest housing that brings full boost by about {show.rpm(a.fullBoostRpm)} without more exhaust back pressure than{' '}
            {APPLICATION_DEFAULTS[a.application].label} use wants: a smaller A/R spools sooner but makes the engine push harder to breathe out.
          </p>
          <TurbineHousings candidate={build} />
        </section>
      )}

      <section aria-labelledby="fitment-frames-heading" className="grid gap-3">
        <h3 id="fitment-frames-heading" className="text-xl font-bold">
          {build ? 'The other frames' : 'Every frame, closest first'}
        </h3>
        <p className="text-cast">Each verdict follows the engine across its rev range, from where boost builds to peak power.</p>
        <CandidateList
          candidates={others}
          onMap={onMap ? candidateKey(onMap) : null}
          cameFrom={cameFrom}
          onShowOnMap={showOnMap}
          onBuild={buildOn}
          directions={result.candidates.some((c) => c.verdict === 'fits' || c.verdict === 'marginal')}
        />
      </section>

      {build && <FrameParts frameCode={build.frameCode} />}
      {build && <FrameExploded key={build.frameCode} frameCode={build.frameCode} />}

      <AssumptionsUsed result={result} system={system} />
    </section>
  );
}
