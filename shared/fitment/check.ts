import type { FitmentAssumptions, FitmentCaution, FitmentCandidate, FitmentRequest, FitmentResponse } from '../schemas/fitment';
import { celsiusToKelvin, kwToHp, lbPerMinToKgPerS, psiToKpa } from '../units';
import { defaultAfr, defaultBsfcLbPerHpH, petrolEquivalentHp } from './airflow';
import { isaPressureKpa } from './atmosphere';
import {
  APPLICATION_DEFAULTS,
  CHARGE_TEMP_LIMIT_C,
  DEFAULT_ALTITUDE_M,
  DEFAULT_AMBIENT_C,
  DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED,
  DEFAULT_CHARGE_LOSS_PSI_NO_INTERCOOLER,
  DEFAULT_COMPRESSOR_EFFICIENCY,
  DEFAULT_INLET_LOSS_PSI,
  DEFAULT_INTERCOOLED,
  DEFAULT_VOLUMETRIC_EFFICIENCY,
  DIESEL_SPECIFIC_OUTPUT_SHARE,
  FUEL_DENSITY_KG_L,
  HOT_OUTLET_C,
  INJECTOR_DUTY_CYCLE,
  LARGE_INJECTOR_CC_MIN,
  NO_INTERCOOLER_PR_LIMIT,
} from './defaults';
import type { EngineModel } from './engine';
import type { FitmentFrame } from './frame';
import { operatingLine, type EngineConditions } from './operating-line';
import { compressorInletKpa } from './pressure-ratio';
import { DEFAULT_TURBINE_EFFICIENCY, EXHAUST_SYSTEM_LOSS_KPA, TURBINE_INLET_C } from './turbine';
import { assessFrame, BAND_TOLERANCE, isUsable, LITTLE_BOOST_PR, rankCandidates, type AssessmentContext } from './verdict';

/** Shown beside every result. */
export const FITMENT_CAUTIONS: readonly FitmentCaution[] = [
  { code: 'estimate', message: 'A fitment check is an estimate from a model of the engine, not a measurement.' },
  {
    code: 'qualified-person',
    message:
      'Engine internals, fuel system, oil supply and tuning must be matched to the boost by a qualified person; a turbocharger run past its limits can fail suddenly and hot parts can burn.',
  },
  {
    code: 'road-legality',
    message: 'Road legality and emissions rules are local: check them, and have the installation done by a licensed mechanic where the law requires one.',
  },
];

/** Twin layouts are offered for larger engines (usually a V or a long six) or when no single unit serves. */
const TWIN_FROM_LITRES = 3.5;

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
    intercoolerEffectiveness: intercooled
      ? pick('intercoolerEffectiveness', given.intercoolerEffectiveness, application.intercoolerEffectiveness)
      : 0,
    chargeLossPsi: pick('chargeLossPsi', given.chargeLossPsi, intercooled ? DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED : DEFAULT_CHARGE_LOSS_PSI_NO_INTERCOOLER),
    inletLossPsi: pick('inletLossPsi', given.inletLossPsi, DEFAULT_INLET_LOSS_PSI),
    compressorEfficiency: pick('compressorEfficiency', given.compressorEfficiency, DEFAULT_COMPRESSOR_EFFICIENCY),
    // Never later than peak power itself.
    fullBoostRpm: Math.min(input.rpm, pick('fullBoostRpm', given.fullBoostRpm, Math.round((input.rpm * application.fullBoostFraction) / 50) * 50)),
    cylinders: given.cylinders ?? null,
    turbineInletC: TURBINE_INLET_C[input.fuel],
    turbineEfficiency: DEFAULT_TURBINE_EFFICIENCY,
    defaulted,
  };
}

// Formatters made once (toLocaleString builds a new one per call).
const FORMATS = [0, 1, 2].map((d) => new Intl.NumberFormat('en-US', { maximumFractionDigits: d, minimumFractionDigits: d }));
const fmt = (value: number, digits = 0) => FORMATS[Math.min(digits, 2)]!.format(value);

/**
 * The fitment check: the engine's line from boost threshold through full boost to peak power, each frame judged on
 * its own map as a single unit (and, for larger engines, as a twin layout), with the turbine housing that spools in
 * time, best first. Pure and deterministic; `input` is a request already parsed by FitmentRequestSchema.
 */
export function runFitmentCheck(input: FitmentRequest, frames: readonly FitmentFrame[]): FitmentResponse {
  const resolved = resolveAssumptions(input);
  const result = evaluate(resolved, frames);
  const nextSteps = result.candidates.some(isUsable) ? [] : explainNoFit(resolved, frames, result);
  return { ...result, nextSteps, cautions: [...reactingCautions(resolved, result), ...FITMENT_CAUTIONS] };
}

type Evaluation = Omit<FitmentResponse, 'nextSteps' | 'cautions'>;

function assessmentContext(resolved: Resolved, linePoints?: number) {
  const ambient = isaPressureKpa(resolved.altitudeM);
  const inletTempK = celsiusToKelvin(resolved.ambientC);
  const statedEfficiency = resolved.defaulted.includes('compressorEfficiency') ? null : resolved.compressorEfficiency;
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
  const line = operatingLine(conditions, resolved.powerHp, resolved.rpm, resolved.fullBoostRpm, linePoints);
  const engine: EngineModel = {
    displacementL: resolved.displacementL,
    volumetricEfficiency: resolved.volumetricEfficiency,
    peakRpm: resolved.rpm,
    fullBoostRpm: resolved.fullBoostRpm,
    ambient,
    inletTempK,
    inletKpa: compressorInletKpa(ambient, resolved.inletLossPsi),
    chargeLossKpa: psiToKpa(resolved.chargeLossPsi),
    intercoolerEffectiveness: resolved.intercoolerEffectiveness,
    manifoldTempK: resolved.manifoldTempC === null ? null : celsiusToKelvin(resolved.manifoldTempC),
    afr: resolved.afr,
    t3K: celsiusToKelvin(resolved.turbineInletC),
    p4Kpa: ambient + EXHAUST_SYSTEM_LOSS_KPA,
    turbineEfficiency: resolved.turbineEfficiency,
    assumedEfficiency: resolved.compressorEfficiency,
  };
  const context: AssessmentContext & { line: typeof line; statedEfficiency: number | null } = {
    application: resolved.application,
    engine,
    demand: line.map((p) => ({ rpm: p.rpm, airflowLbMin: p.airflowLbMin, pressureRatio: p.pressureRatio })),
    statedEfficiency,
    fullBoostRpm: resolved.fullBoostRpm,
    line,
  };
  return context;
}


function evaluate(
  resolved: Resolved,
  frames: readonly FitmentFrame[],
  options: { twins?: boolean; turbine?: boolean; linePoints?: number } = {},
): Evaluation {
  const context = assessmentContext(resolved, options.linePoints);
  const { engine, line, statedEfficiency } = context;
  const ambient = engine.ambient;
  const peak = line[line.length - 1];
  if (!peak) throw new Error('the operating line has no points');
  const turbine = { turbine: options.turbine ?? true };
  const singles = frames.map((frame) => assessFrame(frame, 'single', context, turbine));
  const wantTwins = options.twins ?? (resolved.displacementL >= TWIN_FROM_LITRES || !singles.some(isUsable));
  // Only usable twins are offered, and a frame far outside its band cannot be one: skip those.
  const perUnit = petrolEquivalentHp(peak.correctedFlowLbMin / 2);
  const twins = wantTwins
    ? frames.filter((frame) => nearBand(frame, perUnit)).map((frame) => assessFrame(frame, 'twin', context, turbine)).filter(isUsable)
    : [];
  const candidates = rankCandidates([...singles, ...twins]);

  const fuelFlowLbH = resolved.powerHp * resolved.bsfc;
  const injectorCcMin =
    resolved.cylinders === null
      ? null
      : ((fuelFlowLbH * 0.45359237) / 60 / FUEL_DENSITY_KG_L[resolved.fuel] / resolved.cylinders / INJECTOR_DUTY_CYCLE) * 1000;

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
      compressorInletKpa: engine.inletKpa,
      petrolEquivalentHp: petrolEquivalentHp(peak.correctedFlowLbMin),
      fuelFlowLbH,
      injectorCcMin,
      specificOutputHpPerL: resolved.powerHp / resolved.displacementL,
      temperaturesFrom: statedEfficiency === null ? `an assumed ${Math.round(resolved.compressorEfficiency * 100)} % compressor efficiency; each frame's own map gives its figures` : `the stated ${Math.round(statedEfficiency * 100)} % compressor efficiency`,
    },
    operatingLine: line,
    candidates,
  };
}

/** Within the band's tolerance: outside it a frame is ruled too small or too large whatever its map says. */
const nearBand = (frame: FitmentFrame, equivalentHp: number) =>
  equivalentHp <= frame.powerBandHp[1] * (1 + BAND_TOLERANCE) && equivalentHp >= frame.powerBandHp[0] * (1 - BAND_TOLERANCE);

/** Whether any frame, single or twin, serves: compressor side only, a short line, stopping at the first that does. */
function anyUsable(resolved: Resolved, frames: readonly FitmentFrame[]): boolean {
  const context = assessmentContext(resolved, 3);
  const peakFlow = context.line[context.line.length - 1]?.correctedFlowLbMin ?? 0;
  for (const [layout, units] of [['single', 1], ['twin', 2]] as const) {
    for (const frame of frames) {
      // Outside its band by more than the tolerance a frame is ruled out anyway: skip the map work.
      const equivalent = petrolEquivalentHp(peakFlow / units);
      if (!nearBand(frame, equivalent)) continue;
      if (isUsable(assessFrame(frame, layout, context, { turbine: false }))) return true;
    }
  }
  return false;
}

/** The reacting cautions: each triggered by a value, each naming it, each deferring to a qualified person. */
function reactingCautions(resolved: Resolved, result: Evaluation): FitmentCaution[] {
  const out: FitmentCaution[] = [];
  const best: FitmentCandidate | undefined = result.candidates.find(isUsable) ?? result.candidates[0];
  const rules = APPLICATION_DEFAULTS[resolved.application];
  const chargeC = best?.manifoldTempC ?? result.required.manifoldTempC;
  const limit = CHARGE_TEMP_LIMIT_C[resolved.fuel];
  if (chargeC > limit) {
    out.push({
      code: 'charge-temperature',
      message: `The charge reaches the manifold at about ${fmt(chargeC)} °C, above the ${limit} °C that ${resolved.fuel === 'e85' ? 'E85' : resolved.fuel} tolerates without the tune pulling timing or fuel. A larger or better-placed charge cooler helps; have a qualified tuner set the engine up for it.`,
    });
  }
  const pr = best?.pressureRatio ?? result.required.pressureRatio;
  if (!resolved.intercooled && pr > NO_INTERCOOLER_PR_LIMIT) {
    out.push({
      code: 'no-intercooler',
      message: `A pressure ratio of ${pr.toFixed(2)} without a charge cooler: above about ${NO_INTERCOOLER_PR_LIMIT} the heat of compression goes straight into the cylinders. Fit an intercooler, and have a qualified tuner check the engine's knock margin.`,
    });
  }
  const outlet = best?.compressorOutletC ?? result.required.compressorOutletC;
  if (outlet > HOT_OUTLET_C) {
    out.push({
      code: 'hot-outlet',
      message: `The compressor outlet runs at about ${fmt(outlet)} °C: use hoses and couplers rated for it before the charge cooler, and keep them clear of wiring.`,
    });
  }
  const injector = result.required.injectorCcMin;
  if (injector !== null && injector > LARGE_INJECTOR_CC_MIN) {
    out.push({
      code: 'fuel-flow',
      message: `Peak power needs about ${fmt(result.required.fuelFlowLbH)} lb/h of fuel: ${fmt(injector)} cc/min from each of ${resolved.cylinders} injectors at ${Math.round(0.8 * 100)} % duty, more than common street injectors give. The pump, lines and injectors must be sized for it by a qualified person.`,
    });
  } else if (injector === null && result.required.fuelFlowLbH > 250) {
    out.push({
      code: 'fuel-flow',
      message: `Peak power needs about ${fmt(result.required.fuelFlowLbH)} lb/h of fuel. Give the number of cylinders for the flow per injector; the pump, lines and injectors must be sized for it by a qualified person.`,
    });
  }
  const turbine = best?.turbine;
  if (turbine && turbine.backPressureRatio > rules.maxBackPressureRatio) {
    out.push({
      code: 'back-pressure',
      message: `With the recommended A/R ${turbine.housingAr.toFixed(2)} turbine housing the exhaust manifold runs at ${turbine.backPressureRatio.toFixed(2)} × boost pressure (${fmt(turbine.exhaustManifoldKpa)} kPa absolute) at peak power: more heat in the cylinders and in the turbine. Have exhaust temperatures watched by a qualified tuner.`,
    });
  }
  if (best && best.shaftRpm !== null && best.shaftRpm > 0.92 * best.maxShaftRpm) {
    out.push({
      code: 'overspeed-margin',
      message:
        best.shaftRpm > best.maxShaftRpm
          ? `The shaft would turn ${fmt(best.shaftRpm, 0)} rpm, past the frame's ${fmt(best.maxShaftRpm)} rpm limit: do not run it there. A shaft-speed sensor shows the real figure; wheels run past their limit can burst.`
          : `The shaft peaks at ${fmt(best.shaftRpm, 0)} rpm, ${Math.round((100 * best.shaftRpm) / best.maxShaftRpm)} % of the frame's ${fmt(best.maxShaftRpm)} rpm limit: little in hand for a hot day or thin air. A shaft-speed sensor shows the real figure; wheels run past their limit can burst.`,
    });
  }
  const perLitre = resolved.powerHp / resolved.displacementL;
  const typical = rules.typicalHpPerLitre * (resolved.fuel === 'diesel' ? DIESEL_SPECIFIC_OUTPUT_SHARE : 1);
  if (perLitre > typical) {
    out.push({
      code: 'specific-output',
      message: `${fmt(perLitre)} hp per litre is beyond the ${fmt(typical)} hp per litre that a ${resolved.fuel === 'diesel' ? 'diesel' : 'petrol'} engine in ${rules.label} use usually survives: pistons, rods, head gasket and cooling need to be built for it. Have the engine checked by a licensed mechanic before you raise boost.`,
    });
  }
  return out;
}

/**
 * When nothing serves, say what binds with a number and what would change it. Searches run on the compressor side
 * only (singles and twins), so they stay cheap.
 */
function explainNoFit(resolved: Resolved, frames: readonly FitmentFrame[], result: Evaluation): string[] {
  const steps: string[] = [];
  const pr = result.required.pressureRatio;
  const familyMaxPr = Math.max(...frames.map((f) => f.map.maxPressureRatio));
  const largest = frames.reduce<FitmentFrame | undefined>((a, f) => (!a || f.maxFlowLbMin > a.maxFlowLbMin ? f : a), undefined);
  const usableAt = (changes: Partial<Resolved>) => anyUsable({ ...resolved, ...changes }, frames);
  const search = (lo: number, hi: number, ok: (v: number) => boolean, rising: boolean): number | null => {
    // Finds the value nearest the request at which something serves (bisection on a monotone yes/no). Five halvings
    // narrow a search to about 2 % of the request, finer than the rounded figure a next step states.
    if (!ok(rising ? hi : lo)) return null;
    let a = lo;
    let b = hi;
    for (let i = 0; i < 5; i += 1) {
      const mid = (a + b) / 2;
      if (ok(mid) === rising) b = mid;
      else a = mid;
    }
    return rising ? b : a;
  };

  if (pr < LITTLE_BOOST_PR) {
    steps.push(
      `The engine makes ${fmt(resolved.powerHp)} hp at ${fmt(resolved.rpm)} rpm with a pressure ratio of only ${pr.toFixed(2)}: it hardly needs a turbocharger. Raise the power goal, or check the displacement and rpm.`,
    );
    return steps;
  }
  if (pr > familyMaxPr) {
    steps.push(
      `At ${fmt(resolved.rpm)} rpm the engine needs a pressure ratio of ${pr.toFixed(2)}, above the ${familyMaxPr.toFixed(2)} the strongest frame can make; a two-stage layout (two compressors in series) goes beyond that, and needs a specialist build.`,
    );
  }
  const power = search(resolved.powerHp * 0.3, resolved.powerHp, (hp) => usableAt({ powerHp: hp }), false);
  if (power !== null) steps.push(`Lower the power goal to about ${fmt(Math.floor(power / 10) * 10)} hp: a frame serves that at ${fmt(resolved.rpm)} rpm.`);
  const rpm = search(resolved.rpm, Math.min(resolved.rpm * 1.5, 20000), (r) => usableAt({ rpm: r, fullBoostRpm: Math.round(r * APPLICATION_DEFAULTS[resolved.application].fullBoostFraction) }), true);
  if (rpm !== null && rpm > resolved.rpm * 1.02) steps.push(`Raise the peak-power rpm to about ${fmt(Math.ceil(rpm / 100) * 100)} rpm: the same power then needs less boost.`);
  if (!resolved.intercooled && usableAt({ intercooled: true, intercoolerEffectiveness: APPLICATION_DEFAULTS[resolved.application].intercoolerEffectiveness, chargeLossPsi: DEFAULT_CHARGE_LOSS_PSI_INTERCOOLED })) {
    steps.push(
      `Add an intercooler: the charge now reaches the manifold at about ${fmt(result.required.manifoldTempC)} °C, and a cooled charge lets a frame serve ${fmt(resolved.powerHp)} hp.`,
    );
  }
  const later = resolved.fullBoostRpm < resolved.rpm * 0.85 ? Math.round((resolved.fullBoostRpm + resolved.rpm) / 2 / 50) * 50 : null;
  if (later !== null && usableAt({ fullBoostRpm: later })) {
    steps.push(`Accept full boost later, from about ${fmt(later)} rpm instead of ${fmt(resolved.fullBoostRpm)} rpm: the compressor then stays clear of surge low in the range.`);
  }
  if (largest && result.required.correctedFlowLbMin > largest.map.chokeLine.at(-1)!.flowLbMin) {
    steps.push(
      `The engine needs ${fmt(result.required.correctedFlowLbMin)} lb/min of corrected air, past the ${fmt(largest.map.chokeLine.at(-1)!.flowLbMin)} lb/min one ${largest.code} passes: a twin layout shares the flow between two units.`,
    );
  }
  if (steps.length === 0) {
    const closest = result.candidates[0];
    steps.push(
      closest
        ? `The closest frame, ${closest.frameCode}${closest.layout === 'twin' ? ' as a twin' : ''}, is ruled out because ${closest.reasons[0] ?? 'it runs off its map'}; change the power goal (now ${fmt(resolved.powerHp)} hp) or the rpm (now ${fmt(resolved.rpm)}) and check again.`
        : `No frames to compare; ${fmt(resolved.powerHp)} hp at ${fmt(resolved.rpm)} rpm could not be checked.`,
    );
  }
  return steps;
}

