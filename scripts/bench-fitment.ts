import { performance } from 'node:perf_hooks';
import { openDatabase } from '../server/db/client';
import { createFitmentService } from '../server/services/fitment';
import { APPLICATIONS, FUELS, FitmentRequestSchema, type FitmentRequest } from '../shared/schemas/fitment';
import type { BenchEnv } from './bench-catalogues';
import { section, summarize } from './bench-harness';

const FITMENT_P95_TARGET_MS = 2;
const ROUNDS = 20;
const WARM_UP_ROUNDS = 5;

/** A spread of engines from a small single to a large race V8, on every fuel and use: builds a frame serves. */
function requests(): FitmentRequest[] {
  const engines = [
    { displacementL: 0.5, powerHp: 100, rpm: 9000 },
    { displacementL: 1.6, powerHp: 220, rpm: 6500 },
    { displacementL: 2.0, powerHp: 300, rpm: 6500 },
    { displacementL: 3.0, powerHp: 550, rpm: 7000 },
    { displacementL: 5.0, powerHp: 900, rpm: 6800 },
    { displacementL: 8.0, powerHp: 2000, rpm: 7500 },
  ];
  return engines.flatMap((engine, i) =>
    APPLICATIONS.map((application, j) =>
      FitmentRequestSchema.parse({
        ...engine,
        application,
        fuel: FUELS[(i + j) % FUELS.length],
        rpm: FUELS[(i + j) % FUELS.length] === 'diesel' ? Math.min(engine.rpm, 4500) : engine.rpm,
        altitudeM: (i * 400) % 2000,
        intercooled: j % 2 === 0,
      }),
    ),
  );
}

/** runFitmentCheck against every frame of the demo catalogue, read from its database as the server reads them. */
export const fitmentSection = section<BenchEnv>('Fitment check (all frames)', (ctx, env) => {
  const demo = env.catalogues[0];
  if (!demo) throw new Error('the catalogue section did not build the demo catalogue');
  const db = openDatabase(demo.file);
  try {
    const fitment = createFitmentService(db);
    const frames = fitment.frameMaps().length;
    const inputs = requests();
    // Warm up as a running server is: the first rounds compile the code and fill the per-map tables.
    for (let round = 0; round < WARM_UP_ROUNDS; round++) for (const input of inputs) fitment.check(input);
    // Served builds (every frame, single and twin where offered, every turbine housing) and, apart, requests that
    // nothing serves, which also search for the next steps.
    const served: number[] = [];
    const unserved: number[] = [];
    const rounds = env.quick ? 4 : ROUNDS;
    for (let round = 0; round < rounds; round++) {
      for (const input of inputs) {
        const t = performance.now();
        const result = fitment.check(input);
        (result.nextSteps.length === 0 ? served : unserved).push(performance.now() - t);
      }
    }
    const s = summarize(served);
    const all = summarize([...served, ...unserved]);
    ctx.log(`${inputs.length} engines × ${rounds} rounds against ${frames} frames (${served.length} served, ${unserved.length} not)`);
    ctx.record(`runFitmentCheck() p50, ${frames} frames`, all.p50, 'ms');
    // The target is the check itself: every frame, layout and housing. A request nothing serves also runs the
    // next-step searches (each a run of the compressor side at a changed goal), reported beside it.
    ctx.record(`runFitmentCheck() p95 when a frame serves, ${frames} frames`, s.p95, 'ms', { target: { op: '<=', value: FITMENT_P95_TARGET_MS }, detail: `${s.n} checks` });
    ctx.record(`runFitmentCheck() p95, every request, ${frames} frames`, all.p95, 'ms', { detail: `${all.n} checks` });
    ctx.record(`runFitmentCheck() max, ${frames} frames`, all.max, 'ms');
    if (unserved.length > 0) {
      const u = summarize(unserved);
      ctx.record('runFitmentCheck() p95 when nothing serves (with next-step searches)', u.p95, 'ms', { detail: `${u.n} checks` });
    }
  } finally {
    db.$client.close();
  }
});
