import type { FitmentAssumptions, FitmentRequest, FitmentResponse } from '../schemas/fitment';
import { celsiusToKelvin, kwToHp, lbPerMinToKgPerS } from '../units';
import { defaultAfr, defaultBsfcLbPerHpH, petrolEquivalentHp } from './airflow';
import { isaPressureKpa } from './atmosphere';
import {
  APPLICATION_DEFAULTS,
  DEFAULT_ALTITUDE_M,
  DEFAULT_AMBIENT_C,
  DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED,
  DEFAULT_CHARGE_LOSS_PSI_NO_INTERCOOLER,
  DEFAULT_COMPRESSOR_EFFICIENCY,
  DEFAULT_INLET_LOSS_PSI,
  DEFAULT_INTERCOOLED,
  DEFAULT_VOLUMETRIC_EFFICIENCY,
} from './defaults';
import type { FitmentFrame } from './frame';
import { operatingLine, type EngineConditions } from './operating-line';
import { compressorInletKpa } from './pressure-ratio';
import { assessFrame, rankCandidates } from './verdict';

/** Shown beside every result. */
export const FITMENT_CAUTIONS = [
  'A fitment check is an estimate from a model of the engine, not a measurement.',
  'Engine internals, fuel system, oil supply and tuning must be matched to the boost by a qualified person; a turbocharger run past its limits can fail suddenly and hot parts can burn.',
  'Road legality and emissions rules are local: check them, and have the installation done by a licensed mechanic where the law requires one.',
] as const;

type Resolved = Omit<FitmentAssumptions, 'manifoldTempC'> & { manifoldTempC: number | null };

function resolveAssumptions(input: FitmentRequest): Resolved {
  const given = input.assumptions ?? {};
  const defaulted: string[] = [];
  function pick<T>(name: string, value: T | undefined, fallback: T): T {
    if (value !== undefined) return value;
    defaulted.push(name);
    return fallback;
  }
  const application = APPLICATION_DEFAULTS[input.application];
  const intercooled = pick('intercooled', input.intercooled, DEFAULT_INTERCOOLED);
  const powerHp = input.powerHp ?? kwToHp(input.powerKw ?? Number.NaN);
  return {
    powerHp,
    rpm: input.rpm,
    displacementL: input.displacementL,
    fuel: input.fuel,
    application: input.application,
    altitudeM: pick('altitudeM', input.altitudeM, DEFAULT_ALTITUDE_M),
    ambientC: pick('ambientC', input.ambientC, DEFAULT_AMBIENT_C),
    intercooled,
    bsfc: pick('bsfc', given.bsfc, defaultBsfcLbPerHpH(input.fuel, input.application)),
    afr: pick('afr', given.afr, defaultAfr(input.fuel, input.application)),
    volumetricEfficiency: pick('volumetricEfficiency', given.volumetricEfficiency, DEFAULT_VOLUMETRIC_EFFICIENCY),
    manifoldTempC: given.manifoldTempC ?? null,
    manifoldTempGiven: given.manifoldTempC !== undefined,
    intercoolerEffectiveness: pick(
      'intercoolerEffectiveness',
      undefined,
      intercooled ? application.intercoolerEffectiveness : 0,
    ),
    chargeLossPsi: pick(
      'chargeLossPsi',
      given.chargeLossPsi,
      intercooled ? DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED : DEFAULT_CHARGE_LOSS_PSI_NO_INTERCOOLER,
    ),
    inletLossPsi: pick('inletLossPsi', given.inletLossPsi, DEFAULT_INLET_LOSS_PSI),
    compressorEfficiency: pick('compressorEfficiency', given.compressorEfficiency, DEFAULT_COMPRESSOR_EFFICIENCY),
    fullBoostRpm: pick('fullBoostRpm', undefined, Math.round((input.rpm * application.fullBoostFraction) / 50) * 50),
    defaulted,
  };
}

/**
 * The fitment check: the engine's operating line from full boost to peak power, and each frame's verdict on it,
 * best first. Pure and deterministic; `input` is a request already parsed by FitmentRequestSchema.
 */
export function runFitmentCheck(input: FitmentRequest, frames: readonly FitmentFrame[]): FitmentResponse {
  const resolved = resolveAssumptions(input);
  const ambient = isaPressureKpa(resolved.altitudeM);
  const inletTempK = celsiusToKelvin(resolved.ambientC);
  const conditions: EngineConditions = {
    displacementL: resolved.displacementL,
    bsfc: resolved.bsfc,
    afr: resolved.afr,
    volumetricEfficiency: resolved.volumetricEfficiency,
    ambient,
    inletTempK,
    chargeLossPsi: resolved.chargeLossPsi,
    inletLossPsi: resolved.inletLossPsi,
    compressorEfficiency: resolved.compressorEfficiency,
    intercoolerEffectiveness: resolved.intercoolerEffectiveness,
    ...(resolved.manifoldTempC === null ? {} : { manifoldTempK: celsiusToKelvin(resolved.manifoldTempC) }),
  };
  const line = operatingLine(conditions, resolved.powerHp, resolved.rpm, resolved.fullBoostRpm);
  const peak = line[line.length - 1];
  if (!peak) throw new Error('the operating line has no points');

  const equivalentHp = petrolEquivalentHp(peak.airflowLbMin);
  const candidates = rankCandidates(
    frames.map((frame) =>
      assessFrame(frame, line, {
        application: resolved.application,
        inletTempK,
        compressorEfficiency: resolved.compressorEfficiency,
        petrolEquivalentHp: equivalentHp,
      }),
    ),
  );

  return {
    assumptions: { ...resolved, manifoldTempC: resolved.manifoldTempC ?? peak.manifoldTempC },
    required: {
      airflowLbMin: peak.airflowLbMin,
      airflowKgS: lbPerMinToKgPerS(peak.airflowLbMin),
      manifoldPressureKpa: peak.manifoldPressureKpa,
      boostPsi: peak.boostPsi,
      pressureRatio: peak.pressureRatio,
      correctedFlowLbMin: peak.correctedFlowLbMin,
      compressorOutletC: peak.compressorOutletC,
      manifoldTempC: peak.manifoldTempC,
      ambientPressureKpa: ambient,
      compressorInletKpa: compressorInletKpa(ambient, resolved.inletLossPsi),
      petrolEquivalentHp: equivalentHp,
    },
    operatingLine: line,
    candidates,
    cautions: [...FITMENT_CAUTIONS],
  };
}
