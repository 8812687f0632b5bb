import { FRAMES, turbineHousingArs } from '../../catalog-seed/frames';
import { runFitmentCheck } from '../../shared/fitment/check';
import { buildCompressorMap } from '../../shared/fitment/compressor-map';
import type { FitmentFrame } from '../../shared/fitment/frame';
import { correctedShaftRpmAt, mapZoneAt } from '../../shared/fitment/map-query';
import { isUsable } from '../../shared/fitment/verdict';
import { APPLICATIONS, FitmentRequestSchema, type Application, type Fuel, type FitmentResponse } from '../../shared/schemas/fitment';

/** The demo family as the server builds it: maps from the wheels, the turbine housings the catalogue sells. */
export const demoFrames: FitmentFrame[] = FRAMES.map((f) => ({ ...f, map: buildCompressorMap(f), turbineArOptions: turbineHousingArs(f) }));

export const GRID_DISPLACEMENTS_L = [0.5, 1.0, 1.5, 2.0, 2.5, 3.0, 4.0, 5.0, 6.7, 8.0];
export const GRID_POWERS_HP = [100, 150, 200, 250, 300, 400, 500, 600, 800, 1000, 1300, 1600, 2000];
export const GRID_FUELS: Fuel[] = ['petrol', 'e85', 'diesel'];
export const GRID_ALTITUDES_M = [0, 1500, 3000];

/** Peak-power rpm by engine size and fuel, as such engines are built (common practice). */
export function gridRpm(displacementL: number, fuel: Fuel): number {
  if (fuel === 'diesel') return displacementL <= 3 ? 4200 : displacementL <= 7 ? 3400 : 3000;
  return displacementL <= 1 ? 8500 : displacementL <= 2.5 ? 7000 : displacementL <= 4 ? 6800 : 6500;
}

export interface GridCase {
  displacementL: number;
  powerHp: number;
  fuel: Fuel;
  application: Application;
  altitudeM: number;
  result: FitmentResponse;
  /**
   * Inside the family's reach as the fitment issue states it: pressure ratio 1.1–4.6 (and no higher than the family's
   * highest), flow within the largest frame's choke.
   */
  inReach: boolean;
  /**
   * Inside some frame's map: every point of the engine's full-boost line lies between surge and the flow limit, below
   * the maximum pressure ratio, on one frame (single or twin), read independently of the verdict code.
   */
  onSomeMap: boolean;
}

/** On the map, and the real shaft (faster than the corrected speed lines on a warm day) within its limit. */
function lineOnMap(frame: FitmentFrame, units: number, line: FitmentResponse['operatingLine'], inletTempK: number): boolean {
  return line.every((p) => {
    const flow = p.correctedFlowLbMin / units;
    const pr = Math.max(p.pressureRatio, 1);
    if (mapZoneAt(frame.map, flow, pr) !== 'inside') return false;
    const corrected = correctedShaftRpmAt(frame.map, flow, pr);
    return corrected === null || corrected * Math.sqrt(inletTempK / 288.15) <= frame.maxShaftRpm;
  });
}

/** The top of the reach box the fitment issue measured against. */
export const REACH_MAX_PR = 4.6;

export function fitmentGrid(frames: readonly FitmentFrame[] = demoFrames): GridCase[] {
  const familyMaxPr = Math.max(...frames.map((f) => f.map.maxPressureRatio));
  const largestChoke = Math.max(...frames.map((f) => f.map.chokeLine.at(-1)!.flowLbMin));
  const cases: GridCase[] = [];
  for (const displacementL of GRID_DISPLACEMENTS_L)
    for (const powerHp of GRID_POWERS_HP)
      for (const application of APPLICATIONS)
        for (const fuel of GRID_FUELS)
          for (const altitudeM of GRID_ALTITUDES_M) {
            const input = FitmentRequestSchema.safeParse({ displacementL, powerHp, rpm: gridRpm(displacementL, fuel), fuel, application, altitudeM });
            if (!input.success) continue; // beyond any engine (more than 1,000 hp per litre): refused at the door
            const result = runFitmentCheck(input.data, frames);
            const { pressureRatio, correctedFlowLbMin } = result.required;
            const inReach = pressureRatio >= 1.1 && pressureRatio <= Math.min(familyMaxPr, REACH_MAX_PR) && correctedFlowLbMin <= largestChoke;
            const inletK = result.assumptions.ambientC + 273.15;
            const onSomeMap = inReach && frames.some((f) => lineOnMap(f, 1, result.operatingLine, inletK) || lineOnMap(f, 2, result.operatingLine, inletK));
            cases.push({ displacementL, powerHp, fuel, application, altitudeM, result, inReach, onSomeMap });
          }
  return cases;
}

export function summariseGrid(cases: GridCase[]) {
  const inReach = cases.filter((c) => c.inReach);
  const usable = inReach.filter((c) => c.result.candidates.some(isUsable));
  const share = (list: GridCase[]) => (list.length === 0 ? 1 : list.filter((c) => c.result.candidates.some(isUsable)).length / list.length);
  const by = <K extends keyof GridCase>(key: K) =>
    Object.fromEntries([...new Set(inReach.map((c) => c[key]))].map((v) => [String(v), Math.round(share(inReach.filter((c) => c[key] === v)) * 1000) / 10]));
  const deadEnds = cases.filter((c) => !c.result.candidates.some(isUsable) && c.result.nextSteps.length === 0);
  const unusable = inReach.filter((c) => !c.result.candidates.some(isUsable));
  const onMap = cases.filter((c) => c.onSomeMap);
  return {
    requests: cases.length,
    inReach: inReach.length,
    usableInReach: usable.length,
    usableSharePct: Math.round((usable.length / Math.max(inReach.length, 1)) * 1000) / 10,
    onSomeMap: onMap.length,
    usableOnSomeMapPct: Math.round(share(onMap) * 1000) / 10,
    byFuelPct: by('fuel'),
    byAltitudePct: by('altitudeM'),
    byApplicationPct: by('application'),
    twinAnswers: usable.filter((c) => c.result.candidates.find(isUsable)?.layout === 'twin').length,
    deadEnds: deadEnds.length,
    unusableExamples: unusable.slice(0, 12).map((c) => `${c.displacementL} L ${c.powerHp} hp ${c.fuel} ${c.application} ${c.altitudeM} m: PR ${c.result.required.pressureRatio.toFixed(2)}, ${c.result.candidates[0]?.frameCode} ${c.result.candidates[0]?.verdict}: ${c.result.candidates[0]?.reasons[0] ?? ''}`),
  };
}
