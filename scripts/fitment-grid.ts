/**
 * The fitment grid: 10 displacements × 13 power goals × 5 applications × 3 fuels × 3 altitudes, each through the
 * whole check. Prints how many requests inside the family's reach get a usable answer, dead ends, and monotonicity.
 * `npx tsx scripts/fitment-grid.ts` (the same grid is asserted in tests/unit/fitment-grid.test.ts).
 */
import { fitmentGrid, summariseGrid } from '../tests/support/fitment-grid';

const started = performance.now();
const summary = summariseGrid(fitmentGrid());
console.log(JSON.stringify(summary, null, 2));
console.log(`${summary.requests} checks in ${((performance.now() - started) / 1000).toFixed(1)} s`);
