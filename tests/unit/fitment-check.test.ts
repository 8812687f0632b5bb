import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { runFitmentCheck } from '../../shared/fitment/check';
import type { FitmentFrame } from '../../shared/fitment/frame';
import { isUsable } from '../../shared/fitment/verdict';
import { APPLICATIONS, FUELS, FitmentRequestSchema, FitmentResponseSchema, type FitmentRequestInput } from '../../shared/schemas/fitment';
import { hpToKw, litresToCubicInches } from '../../shared/units';
import { demoFrames as frames } from '../support/fitment-grid';

const check = (body: FitmentRequestInput, list: readonly FitmentFrame[] = frames) => runFitmentCheck(FitmentRequestSchema.parse(body), list);
const single = (result: ReturnType<typeof check>, code: string) => result.candidates.find((c) => c.frameCode === code && c.layout === 'single');

describe('trade facts (common practice)', () => {
  it('about 100 hp from a 0.5 L petrol street engine at 9000 rpm: the smallest frame, AWL, is the one to use', () => {
    const result = check({ displacementL: 0.5, powerHp: 100, rpm: 9000, fuel: 'petrol', application: 'street' });
    const [best, ...rest] = result.candidates;
    expect(best).toMatchObject({ frameCode: 'AWL', layout: 'single' });
    expect(isUsable(best!)).toBe(true);
    for (const other of rest) expect(isUsable(other)).toBe(false);
  });

  it('about 2000 hp in petrol drag racing (8.0 L at 7500 rpm): the largest single frame, KRF, about 40 kg, serves it', () => {
    const result = check({ displacementL: 8.0, powerHp: 2000, rpm: 7500, fuel: 'petrol', application: 'drag' });
    const krf = single(result, 'KRF');
    expect(krf && isUsable(krf)).toBe(true);
    expect(single(result, 'JIG')?.verdict).toBe('too-small');
    // A large engine is also offered as a twin layout, two units sharing the flow.
    expect(result.candidates.some((c) => c.layout === 'twin' && isUsable(c))).toBe(true);
  });

  it('continuous duty keeps more margin than drag: the same engine and frame is judged harder for marine', () => {
    const body = { displacementL: 3.0, powerHp: 700, rpm: 7000, fuel: 'petrol', intercooled: true } as const;
    expect(single(check({ ...body, application: 'drag' }), 'GIM')?.verdict).toBe('fits');
    const marine = single(check({ ...body, application: 'marine' }), 'GIM');
    expect(marine?.verdict).toBe('marginal');
    expect(marine?.reasons.join(' ')).toMatch(/marine use/);
  });

  it('a frame that is too small says where it runs out, in plain words and numbers', () => {
    const result = check({ displacementL: 3.0, powerHp: 420, rpm: 7000, fuel: 'petrol', application: 'street' });
    const small = single(result, 'DRF');
    expect(small?.verdict).toBe('too-small');
    expect(small?.reasons[0]).toMatch(/^at 7,000 rpm the engine needs \d+ lb\/min at a pressure ratio of \d\.\d\d, \d+ % past this frame's choke limit/);
    const large = single(result, 'KRF');
    expect(large?.verdict).toBe('too-large');
    expect(large?.reasons[0]).toMatch(/surge/);
  });

  it('never tells one engine "go bigger" from one frame and "go smaller" from the next without saying what binds', () => {
    for (const body of [
      { displacementL: 1.0, powerHp: 150, rpm: 6500, fuel: 'petrol', application: 'street' },
      { displacementL: 0.5, powerHp: 100, rpm: 6500, fuel: 'petrol', application: 'street' },
      { displacementL: 6.7, powerHp: 450, rpm: 3200, fuel: 'diesel', application: 'offroad' },
    ] as const) {
      const result = check(body);
      if (!result.candidates.some(isUsable)) expect(result.nextSteps.length, JSON.stringify(body)).toBeGreaterThan(0);
      else expect(result.nextSteps).toEqual([]);
    }
  });

  it('notes the ball-bearing option among the reasons for a usable frame', () => {
    const result = check({ displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street' });
    expect(result.candidates[0]?.reasons.some((reason) => reason.includes('ball-bearing'))).toBe(true);
  });
});

describe('each frame judged on its own map', () => {
  const result = check({ displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street' });

  it('takes outlet temperature from the frame’s efficiency at the point, not a fixed 72 %', () => {
    const best = result.candidates[0]!;
    // T₂ = T₁·(1 + (PR^0.2857 − 1)/η) with T₁ = 298.15 K (the textbook isentropic relation).
    const expected = 298.15 * (1 + (best.pressureRatio ** (0.4 / 1.4) - 1) / best.efficiency!) - 273.15;
    expect(best.compressorOutletC).toBeCloseTo(expected, 0);
    const efficiencies = new Set(result.candidates.filter((c) => c.efficiency !== null).map((c) => c.efficiency));
    expect(efficiencies.size).toBeGreaterThan(1);
  });

  it('judges the power band on corrected flow: thin air needs more corrected flow for the same power', () => {
    const high = check({ displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street', altitudeM: 3000 });
    expect(high.required.petrolEquivalentHp).toBeGreaterThan(result.required.petrolEquivalentHp * 1.3);
  });

  it('recommends a turbine housing with its expansion ratio, back pressure and wastegate share, and says why not the others', () => {
    const best = result.candidates[0]!;
    expect(best.turbine).not.toBeNull();
    const t = best.turbine!;
    expect(t.expansionRatio).toBeGreaterThan(1.2);
    expect(t.exhaustManifoldKpa).toBeCloseTo(t.expansionRatio * (result.required.ambientPressureKpa + 7), -1);
    expect(t.backPressureRatio).toBeGreaterThan(0.6);
    expect(t.wastegateShare).toBeGreaterThanOrEqual(0);
    expect(t.wastegateShare).toBeLessThan(1);
    expect(best.housings.filter((h) => h.recommended)).toHaveLength(1);
    for (const h of best.housings) expect(h.note).toMatch(/\d/);
    // A smaller A/R spools sooner and backs up more exhaust.
    const byAr = [...best.housings].sort((a, b) => a.housingAr - b.housingAr);
    for (let i = 1; i < byAr.length; i++) {
      expect(byAr[i]!.backPressureRatio).toBeLessThanOrEqual(byAr[i - 1]!.backPressureRatio);
      if (byAr[i]!.fullBoostRpm !== null && byAr[i - 1]!.fullBoostRpm !== null) expect(byAr[i]!.fullBoostRpm!).toBeGreaterThanOrEqual(byAr[i - 1]!.fullBoostRpm!);
    }
  });

  it('draws the spool segment below full boost and checks it against surge', () => {
    const best = result.candidates[0]!;
    const spool = best.points.filter((p) => p.segment === 'spool');
    expect(spool.length).toBeGreaterThan(0);
    expect(best.boostThresholdRpm).toBeLessThan(best.turbine!.fullBoostRpm!);
    for (const p of spool) {
      expect(p.rpm).toBeLessThan(best.turbine!.fullBoostRpm!);
      expect(p.pressureRatio).toBeLessThan(best.pressureRatio);
      expect(p.surgeMarginPct).not.toBeNull();
    }
  });
});

describe('assumptions and reacting cautions', () => {
  it('honours and echoes full-boost rpm, intercooler effectiveness and cylinders', () => {
    const result = check({
      displacementL: 2.0,
      powerHp: 300,
      rpm: 6500,
      fuel: 'petrol',
      application: 'street',
      assumptions: { fullBoostRpm: 4500, intercoolerEffectiveness: 0.6, cylinders: 4 },
    });
    expect(result.assumptions).toMatchObject({ fullBoostRpm: 4500, intercoolerEffectiveness: 0.6, cylinders: 4 });
    expect(result.assumptions.defaulted).not.toContain('fullBoostRpm');
    expect(result.operatingLine[0]!.rpm).toBe(4500);
  });

  it('states the fuel flow: power × BSFC, and per injector at 80 % duty with a cylinder count', () => {
    const result = check({ displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street', assumptions: { cylinders: 4 } });
    // 300 hp × 0.50 lb/(hp·h) = 150 lb/h (definition of BSFC); per injector: 150 lb/h = 1.1340 kg/min,
    // / 0.74 kg/L = 1.5324 L/min, / 4 / 0.8 = 479 cc/min (worked by hand).
    expect(result.required.fuelFlowLbH).toBeCloseTo(150, 6);
    expect(result.required.injectorCcMin).toBeCloseTo(479, 0);
  });

  it('cautions react to the numbers: a hot uncooled charge at 2.0 L 260 hp, each naming its value', () => {
    const result = check({ displacementL: 2.0, powerHp: 260, rpm: 6500, fuel: 'petrol', application: 'street', intercooled: false });
    const codes = result.cautions.map((c) => c.code);
    expect(codes).toEqual(expect.arrayContaining(['no-intercooler', 'charge-temperature']));
    for (const c of result.cautions.filter((x) => ['no-intercooler', 'charge-temperature'].includes(x.code))) {
      expect(c.message).toMatch(/\d/);
      expect(c.message).toMatch(/qualified/);
    }
  });

  it('a mild engine gets only the general cautions', () => {
    const result = check({ displacementL: 2.0, powerHp: 220, rpm: 6500, fuel: 'petrol', application: 'street' });
    expect(result.cautions.map((c) => c.code)).toEqual(['estimate', 'qualified-person', 'road-legality']);
  });

  it('specific output between plausible and absurd is a caution; beyond 1,000 hp per litre the request is refused naming the unit', () => {
    const bold = check({ displacementL: 1.0, powerHp: 400, rpm: 8500, fuel: 'petrol', application: 'street' });
    expect(bold.cautions.find((c) => c.code === 'specific-output')?.message).toMatch(/400 hp per litre/);
    // 7 typed into a cubic-inch field: 0.1147 L.
    const parsed = FitmentRequestSchema.safeParse({ displacementL: 7 / litresToCubicInches(1), displacementUnit: 'in3', powerHp: 260, rpm: 6500, fuel: 'petrol', application: 'street' });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]?.message).toMatch(/read as 7 cubic inches \(0\.11 L\) gives 2,267 hp per litre/);
    expect(parsed.error?.issues[0]?.path).toEqual(['displacementL']);
  });

  it('when nothing serves, says what binds and what to change, each step with a number', () => {
    // A 2.0 L diesel asked for 250 hp at 4,200 rpm needs a pressure ratio of about 4.5 on the road.
    const result = check({ displacementL: 2.0, powerHp: 250, rpm: 4200, fuel: 'diesel', application: 'street' });
    expect(result.candidates.some(isUsable)).toBe(false);
    expect(result.nextSteps.length).toBeGreaterThan(0);
    for (const step of result.nextSteps) expect(step).toMatch(/\d/);
  });
});

describe('the response', () => {
  it('matches the published response schema, ranks best first and echoes every assumption', () => {
    const result = check({ displacementL: 2.0, powerKw: hpToKw(300), rpm: 6500, fuel: 'e85', application: 'circuit', altitudeM: 800 });
    expect(FitmentResponseSchema.parse(result)).toEqual(result);
    expect(result.candidates.map((candidate) => candidate.rank)).toEqual(result.candidates.map((_, index) => index + 1));
    expect(result.candidates.filter((c) => c.layout === 'single')).toHaveLength(frames.length);
    expect(result.assumptions.powerHp).toBeCloseTo(300, 9);
    expect(result.assumptions.bsfc).toBeCloseTo(0.77, 9); // e85 0.70 × circuit 1.10
    expect(result.assumptions.defaulted).toEqual(
      expect.arrayContaining(['bsfc', 'afr', 'volumetricEfficiency', 'ambientC', 'intercooled', 'chargeLossPsi', 'inletLossPsi', 'compressorEfficiency', 'fullBoostRpm']),
    );
    expect(result.assumptions.defaulted).not.toContain('altitudeM');
    expect(result.operatingLine.length).toBeGreaterThanOrEqual(6);
  });

  it('gives the same answer for the same power in hp or kW', () => {
    const base = { displacementL: 1.6, rpm: 6000, fuel: 'petrol', application: 'street' } as const;
    expect(check({ ...base, powerKw: hpToKw(220) }).required.airflowLbMin).toBeCloseTo(check({ ...base, powerHp: 220 }).required.airflowLbMin, 9);
  });
});

const requestArbitrary = fc.record({
  displacementL: fc.double({ min: 0.5, max: 8, noNaN: true }),
  powerHp: fc.double({ min: 50, max: 400, noNaN: true }),
  rpm: fc.integer({ min: 3000, max: 9000 }),
  fuel: fc.constantFrom(...FUELS),
  application: fc.constantFrom(...APPLICATIONS),
  altitudeM: fc.double({ min: 0, max: 4000, noNaN: true }),
  ambientC: fc.double({ min: -10, max: 45, noNaN: true }),
  intercooled: fc.boolean(),
});

describe('properties (fast-check)', () => {
  it('more power never needs less air', () => {
    fc.assert(
      fc.property(requestArbitrary, fc.double({ min: 0, max: 500, noNaN: true }), (body, extra) => {
        fc.pre((body.powerHp + extra) / body.displacementL <= 1000);
        const lower = check(body, []).required;
        const higher = check({ ...body, powerHp: body.powerHp + extra }, []).required;
        return higher.airflowLbMin >= lower.airflowLbMin && higher.correctedFlowLbMin >= lower.correctedFlowLbMin;
      }),
      { numRuns: 60 },
    );
  });

  it('higher altitude never needs a lower pressure ratio', () => {
    fc.assert(
      fc.property(requestArbitrary, fc.double({ min: 0, max: 1000, noNaN: true }), (body, climb) => {
        const low = check(body, []).required.pressureRatio;
        const high = check({ ...body, altitudeM: body.altitudeM + climb }, []).required.pressureRatio;
        return high >= low - 1e-12;
      }),
      { numRuns: 60 },
    );
  });
});

describe('robustness', () => {
  it('answers every request inside the limits with a valid, finite response', () => {
    const anyRequest = fc.record({
      displacementL: fc.double({ min: 0.5, max: 20, noNaN: true }),
      powerHp: fc.double({ min: 10, max: 3000, noNaN: true }),
      rpm: fc.integer({ min: 1000, max: 20000 }),
      fuel: fc.constantFrom(...FUELS),
      application: fc.constantFrom(...APPLICATIONS),
      altitudeM: fc.double({ min: -500, max: 5000, noNaN: true }),
      ambientC: fc.double({ min: -40, max: 60, noNaN: true }),
      intercooled: fc.boolean(),
    }).filter((b) => b.powerHp / b.displacementL <= 1000);
    fc.assert(
      fc.property(anyRequest, (body) => {
        const result = check(body);
        FitmentResponseSchema.parse(result);
        const numbers = [
          ...Object.values(result.required).filter((v) => typeof v === 'number'),
          ...result.operatingLine.flatMap((point) => Object.values(point)),
          ...result.candidates.flatMap((c) => [c.score, c.pressureRatio, c.compressorOutletC, ...c.points.map((p) => p.pressureRatio)]),
        ];
        const answered = result.candidates.some(isUsable) || result.nextSteps.length > 0;
        return numbers.every((value) => Number.isFinite(value)) && answered;
      }),
      { numRuns: 80 },
    );
  });
});
