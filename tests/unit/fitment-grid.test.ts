import { describe, expect, it } from 'vitest';
import { isUsable } from '../../shared/fitment/verdict';
import { GRID_ALTITUDES_M, GRID_POWERS_HP, fitmentGrid, summariseGrid, type GridCase } from '../support/fitment-grid';

/**
 * The fitment grid: 10 displacements × 13 power goals × 5 uses × 3 fuels × 3 altitudes through the whole check
 * (scripts/fitment-grid.ts prints the same figures). Requests beyond 1,000 hp per litre are refused at the door.
 */
describe('the fitment grid', () => {
  const cases = fitmentGrid();
  const summary = summariseGrid(cases);

  it('serves at least 95 % of the requests in reach (pressure ratio 1.1–4.6, flow within the largest choke)', () => {
    expect(summary.inReach).toBeGreaterThan(1500);
    expect(summary.usableSharePct).toBeGreaterThanOrEqual(95);
  });

  it('serves at least 95 % of the engines whose full-boost line lies on some frame’s map (single or twin)', () => {
    expect(summary.onSomeMap).toBeGreaterThan(1000);
    expect(summary.usableOnSomeMapPct).toBeGreaterThanOrEqual(95);
  });

  it('has no dead ends: every request without a usable frame says what binds and what to change', () => {
    expect(summary.deadEnds).toBe(0);
    for (const c of cases.filter((x) => !x.result.candidates.some(isUsable))) {
      for (const step of c.result.nextSteps) expect(step).toMatch(/\d/);
    }
  });

  it('required pressure ratio and flow never fall as power or altitude rise', () => {
    const key = (c: GridCase, without: 'powerHp' | 'altitudeM') =>
      [c.displacementL, c.fuel, c.application, without === 'powerHp' ? c.altitudeM : c.powerHp].join('|');
    for (const [field, order] of [
      ['powerHp', GRID_POWERS_HP],
      ['altitudeM', GRID_ALTITUDES_M],
    ] as const) {
      const groups = new Map<string, GridCase[]>();
      for (const c of cases) groups.set(key(c, field), [...(groups.get(key(c, field)) ?? []), c]);
      for (const group of groups.values()) {
        const sorted = group.sort((a, b) => order.indexOf(a[field]) - order.indexOf(b[field]));
        for (let i = 1; i < sorted.length; i++) {
          const [a, b] = [sorted[i - 1]!.result.required, sorted[i]!.result.required];
          expect(b.pressureRatio).toBeGreaterThanOrEqual(a.pressureRatio - 1e-9);
          expect(b.correctedFlowLbMin).toBeGreaterThanOrEqual(a.correctedFlowLbMin - 1e-9);
        }
      }
    }
  });
}, 240_000);
