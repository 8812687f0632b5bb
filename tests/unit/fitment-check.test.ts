import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FRAMES, maxShaftRpmFor } from '../../catalog-seed/frames';
import { runFitmentCheck } from '../../shared/fitment/check';
import { buildCompressorMap } from '../../shared/fitment/compressor-map';
import type { FitmentFrame } from '../../shared/fitment/frame';
import { APPLICATIONS, FUELS, FitmentRequestSchema, FitmentResponseSchema, type FitmentRequestInput } from '../../shared/schemas/fitment';
import { hpToKw } from '../../shared/units';

const frames: FitmentFrame[] = FRAMES.map((frame) => {
  const maxShaftRpm = maxShaftRpmFor(frame.exducerMm);
  return { ...frame, maxShaftRpm, map: buildCompressorMap({ ...frame, maxShaftRpm }) };
});
const check = (body: FitmentRequestInput, list: readonly FitmentFrame[] = frames) =>
  runFitmentCheck(FitmentRequestSchema.parse(body), list);

describe('trade facts (common practice)', () => {
  it('about 100 hp from a 0.5 L petrol street engine at 9000 rpm: the smallest frame, AWL, is the best fit', () => {
    const result = check({ displacementL: 0.5, powerHp: 100, rpm: 9000, fuel: 'petrol', application: 'street' });
    const [best, ...rest] = result.candidates;
    expect(best?.frameCode).toBe('AWL');
    expect(best?.verdict).toBe('fits');
    for (const other of rest) expect(['too-large', 'marginal']).toContain(other.verdict);
  });

  it('about 2000 hp in petrol drag racing (8.0 L at 7500 rpm): only the largest frame, KRF, fits or is marginal', () => {
    const result = check({ displacementL: 8.0, powerHp: 2000, rpm: 7500, fuel: 'petrol', application: 'drag' });
    const usable = result.candidates.filter((candidate) => candidate.verdict === 'fits' || candidate.verdict === 'marginal');
    expect(usable.map((candidate) => candidate.frameCode)).toEqual(['KRF']);
    expect(result.candidates[0]?.frameCode).toBe('KRF');
    const nextLargest = result.candidates.find((candidate) => candidate.frameCode === 'JIG');
    expect(nextLargest?.verdict).toBe('too-small');
  });

  it('continuous duty keeps more shaft-speed margin than drag: the same engine and frame is judged harder for marine', () => {
    // 3.0 L petrol, 700 hp at 7000 rpm needs the GIM near the top of its speed range.
    const body = { displacementL: 3.0, powerHp: 700, rpm: 7000, fuel: 'petrol', intercooled: true } as const;
    const drag = check({ ...body, application: 'drag' }).candidates.find((c) => c.frameCode === 'GIM');
    const marine = check({ ...body, application: 'marine' }).candidates.find((c) => c.frameCode === 'GIM');
    expect(drag?.verdict).toBe('fits');
    expect(marine?.verdict).not.toBe('fits');
    expect(marine?.reasons.join(' ')).toMatch(/marine use/);
  });

  it('a frame that is too small says so at the rpm and flow where it runs out, in plain words', () => {
    const result = check({ displacementL: 3.0, powerHp: 420, rpm: 7000, fuel: 'petrol', application: 'street' });
    const small = result.candidates.find((candidate) => candidate.frameCode === 'CHS');
    expect(small?.verdict).toBe('too-small');
    expect(small?.reasons[0]).toMatch(/^at \d+ rpm the engine needs \d+ lb\/min at a pressure ratio of \d\.\d\d[,;] /);
    const large = result.candidates.find((candidate) => candidate.frameCode === 'KRF');
    expect(large?.verdict).toBe('too-large');
    expect(large?.reasons[0]).toMatch(/surge/);
  });

  it('notes the ball-bearing option among the reasons for a usable frame', () => {
    const result = check({ displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street' });
    expect(result.candidates[0]?.reasons.some((reason) => reason.includes('ball-bearing'))).toBe(true);
  });
});

describe('the response', () => {
  it('matches the published response schema, ranks best first and echoes every assumption', () => {
    const result = check({ displacementL: 2.0, powerKw: hpToKw(300), rpm: 6500, fuel: 'e85', application: 'circuit', altitudeM: 800 });
    expect(FitmentResponseSchema.parse(result)).toEqual(result);
    expect(result.candidates.map((candidate) => candidate.rank)).toEqual(frames.map((_, index) => index + 1));
    expect(result.assumptions.powerHp).toBeCloseTo(300, 9);
    expect(result.assumptions.bsfc).toBeCloseTo(0.77, 9); // e85 0.70 × circuit 1.10
    expect(result.assumptions.defaulted).toEqual(
      expect.arrayContaining(['bsfc', 'afr', 'volumetricEfficiency', 'ambientC', 'intercooled', 'chargeLossPsi', 'inletLossPsi', 'compressorEfficiency']),
    );
    expect(result.assumptions.defaulted).not.toContain('altitudeM');
    expect(result.operatingLine.length).toBeGreaterThanOrEqual(6);
    expect(result.cautions.length).toBeGreaterThan(0);
  });

  it('gives the same answer for the same power in hp or kW', () => {
    const base = { displacementL: 1.6, rpm: 6000, fuel: 'petrol', application: 'street' } as const;
    expect(check({ ...base, powerKw: hpToKw(220) }).required.airflowLbMin).toBeCloseTo(check({ ...base, powerHp: 220 }).required.airflowLbMin, 9);
  });
});

const requestArbitrary = fc.record({
  displacementL: fc.double({ min: 0.5, max: 8, noNaN: true }),
  powerHp: fc.double({ min: 50, max: 1500, noNaN: true }),
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
        const lower = check(body, []).required;
        const higher = check({ ...body, powerHp: body.powerHp + extra }, []).required;
        return higher.airflowLbMin >= lower.airflowLbMin && higher.correctedFlowLbMin >= lower.correctedFlowLbMin;
      }),
    );
  });

  it('higher altitude never needs a lower pressure ratio', () => {
    fc.assert(
      fc.property(requestArbitrary, fc.double({ min: 0, max: 1000, noNaN: true }), (body, climb) => {
        const low = check(body, []).required.pressureRatio;
        const high = check({ ...body, altitudeM: body.altitudeM + climb }, []).required.pressureRatio;
        return high >= low - 1e-12;
      }),
    );
  });
});

describe('timing', () => {
  it('runs the check over all 10 frames well under 5 ms at p95', () => {
    const body = FitmentRequestSchema.parse({ displacementL: 2.0, powerHp: 300, rpm: 6500, fuel: 'petrol', application: 'street' });
    for (let warm = 0; warm < 300; warm += 1) runFitmentCheck(body, frames);
    const samples: number[] = [];
    for (let run = 0; run < 1000; run += 1) {
      const started = performance.now();
      runFitmentCheck(body, frames);
      samples.push(performance.now() - started);
    }
    samples.sort((a, b) => a - b);
    const p95 = samples[Math.floor(samples.length * 0.95)] ?? Number.POSITIVE_INFINITY;
    console.info(`fitment check over ${frames.length} frames: p95 ${p95.toFixed(3)} ms, median ${samples[500]?.toFixed(3)} ms`);
    expect(p95).toBeLessThan(5);
  });
});

describe('robustness', () => {
  it('answers every request inside the limits with a valid, finite response', () => {
    const anyRequest = fc.record({
      displacementL: fc.double({ min: 0.1, max: 20, noNaN: true }),
      powerHp: fc.double({ min: 10, max: 3000, noNaN: true }),
      rpm: fc.integer({ min: 1000, max: 20000 }),
      fuel: fc.constantFrom(...FUELS),
      application: fc.constantFrom(...APPLICATIONS),
      altitudeM: fc.double({ min: -500, max: 5000, noNaN: true }),
      ambientC: fc.double({ min: -40, max: 60, noNaN: true }),
      intercooled: fc.boolean(),
    });
    fc.assert(
      fc.property(anyRequest, (body) => {
        const result = check(body);
        FitmentResponseSchema.parse(result);
        const numbers = [
          ...Object.values(result.required),
          ...result.operatingLine.flatMap((point) => Object.values(point)),
          ...result.candidates.map((candidate) => candidate.score),
        ];
        return numbers.every((value) => Number.isFinite(value)) && result.candidates.length === frames.length;
      }),
      { numRuns: 200 },
    );
  });
});
