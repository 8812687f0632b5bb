import { CompressorMapSchema, type CompressorMap } from '../../shared/schemas/compressor-map';
import type { OperatingPoint } from '../../shared/schemas/fitment';
import type { ShaftLogEngine } from '../../shared/fitment/shaft-log';

/**
 * An invented compressor map for tests, built here so the tests do not move when the catalogue's maps are retuned:
 * a surge line rising from (0, 1), speed lines falling from it to a choke line, the top line at the frame's limit.
 * Its shape is an assumption of the test, not data.
 */
export function testCompressorMap(options: { maxShaftRpm?: number; chokeFlowLbMin?: number; maxPressureRatio?: number } = {}): CompressorMap {
  const maxShaftRpm = options.maxShaftRpm ?? 200_000;
  const chokeTop = options.chokeFlowLbMin ?? 48;
  const maxPr = options.maxPressureRatio ?? 3.0;
  const k = 0.4 / 1.4;
  const head = maxPr ** k - 1;
  const round = (v: number, d: number) => Math.round(v * 10 ** d) / 10 ** d;
  const surgePr = (n: number) => (1 + head * n * n) ** (1 / k);
  const choke = (n: number) => chokeTop * n;
  const surge = (n: number) => choke(n) * (0.3 + 0.15 * n * n);
  const point = (x: number, n: number) => ({
    flowLbMin: round(surge(n) + x * (choke(n) - surge(n)), 3),
    pressureRatio: round(1 + (surgePr(n) - 1) * (1 - 0.3 * x ** 3), 4),
  });
  const fractions = [0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1];
  return CompressorMapSchema.parse({
    surgeLine: fractions.map((n) => point(0, n)),
    chokeLine: fractions.map((n) => point(1, n)),
    speedLines: fractions.map((n) => ({ rpm: Math.round(maxShaftRpm * n), points: [0, 0.25, 0.5, 0.75, 0.9, 1].map((x) => point(x, n)) })),
    efficiencyIslands: [],
    maxPressureRatio: maxPr,
    maxShaftRpm,
  });
}

/** The engine of the fitment chain's worked example A: 2.0 L, VE 0.90, sea level, 25 °C, losses 2.0 and 0.5 psi. */
export const TEST_ENGINE: ShaftLogEngine = {
  displacementL: 2,
  volumetricEfficiency: 0.9,
  altitudeM: 0,
  ambientC: 25,
  chargeLossPsi: 2,
  inletLossPsi: 0.5,
};

/** A wastegated line for that engine: 16 psi from 3600 rpm to peak power at 6500 rpm. */
export function testOperatingLine(boostPsi = 16): Array<Pick<OperatingPoint, 'rpm' | 'boostPsi'>> {
  return [3600, 4083, 4567, 5050, 5533, 6017, 6500].map((rpm) => ({ rpm, boostPsi }));
}
