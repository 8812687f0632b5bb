import type { Db } from '../db/client';
import { runFitmentCheck } from '../../shared/fitment/check';
import { APPLICATION_DEFAULTS } from '../../shared/fitment/defaults';
import type { FitmentFrame } from '../../shared/fitment/frame';
import { BEARINGS, type Bearing } from '../../shared/catalog';
import { CompressorMapSchema } from '../../shared/schemas/compressor-map';
import { FitmentRequestSchema, type FitmentRequest, type FitmentResponse, type Verdict } from '../../shared/schemas/fitment';
import { SAVED_FITMENTS_PER_USER_MAX, type FitmentFrameMap, type SavedFitment } from '../../shared/schemas/saved-fitments';
import { HttpError, notFound } from '../middleware/errors';

interface FrameRow {
  code: string;
  name: string;
  inducerMm: number;
  exducerMm: number;
  turbineWheelMm: number;
  powerMinHp: number;
  powerMaxHp: number;
  maxFlowLbMin: number;
  maxPressureRatio: number;
  maxShaftRpm: number;
  bearingOptions: string;
  compressorMap: string;
}

interface SavedRow {
  id: number;
  name: string;
  input: string;
  summary: string;
  bestFrameCode: string | null;
  createdAt: string;
}

const VERDICT_WORDS: Record<Verdict, string> = { fits: 'fits', marginal: 'marginal', 'too-small': 'too small', 'too-large': 'too large' };

const round = (value: number, digits = 0) => {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
};

/** One line for lists, cart lines and orders: engine, power, use and the best frame with its verdict. */
export function fitmentSummary(input: FitmentRequest, result: FitmentResponse): string {
  const power = input.powerKw !== undefined ? `${round(input.powerKw)} kW` : `${round(input.powerHp ?? 0)} hp`;
  const engine = `${input.displacementL.toFixed(1)} L ${input.fuel === 'e85' ? 'E85' : input.fuel}, ${power} at ${round(input.rpm)} rpm, ${APPLICATION_DEFAULTS[input.application].label}`;
  const best = result.candidates[0];
  if (!best) return `${engine} — no frames to compare`;
  const usable = best.verdict === 'fits' || best.verdict === 'marginal';
  return usable
    ? `${engine} — best fit ${best.frameCode} ${best.frameName} (${VERDICT_WORDS[best.verdict]})`
    : `${engine} — no frame fits; closest ${best.frameCode} ${best.frameName} (${VERDICT_WORDS[best.verdict]})`;
}

function toBearings(json: string): Bearing[] {
  const parsed: unknown = JSON.parse(json);
  return Array.isArray(parsed) ? parsed.filter((b): b is Bearing => (BEARINGS as readonly unknown[]).includes(b)) : [];
}

export function createFitmentService(db: Db) {
  const sqlite = db.$client;
  const stmt = {
    frames: sqlite.prepare(
      `SELECT code, name, inducer_mm AS inducerMm, exducer_mm AS exducerMm, turbine_wheel_mm AS turbineWheelMm, power_min_hp AS powerMinHp, power_max_hp AS powerMaxHp,
              max_flow_lb_min AS maxFlowLbMin, max_pressure_ratio AS maxPressureRatio, max_shaft_rpm AS maxShaftRpm,
              bearing_options AS bearingOptions, compressor_map AS compressorMap
       FROM frames ORDER BY max_flow_lb_min`,
    ),
    list: sqlite.prepare(
      `SELECT id, name, input, summary, best_frame_code AS bestFrameCode, created_at AS createdAt
       FROM saved_fitments WHERE user_id = ? ORDER BY created_at DESC, id DESC`,
    ),
    one: sqlite.prepare(
      `SELECT id, name, input, summary, best_frame_code AS bestFrameCode, created_at AS createdAt
       FROM saved_fitments WHERE id = ? AND user_id = ?`,
    ),
    count: sqlite.prepare('SELECT count(*) FROM saved_fitments WHERE user_id = ?').pluck(),
    // The turbine housings the catalogue sells for each frame: the matching recommends only what can be ordered.
    housings: sqlite.prepare(
      `SELECT DISTINCT p.frame_code AS frameCode, s.turbine_ar AS ar FROM parts p JOIN part_specs s ON s.part_id = p.id
       WHERE p.category = 'turbine-housings' AND p.status = 'active' AND s.turbine_ar IS NOT NULL ORDER BY s.turbine_ar`,
    ),
    insert: sqlite.prepare('INSERT INTO saved_fitments (user_id, name, input, summary, best_frame_code) VALUES (?, ?, ?, ?, ?)'),
    remove: sqlite.prepare('DELETE FROM saved_fitments WHERE id = ? AND user_id = ?'),
  };

  // The frames and their maps change only with a catalogue reload, so they are read and parsed once.
  let cache: { frames: FitmentFrame[]; maps: FitmentFrameMap[] } | null = null;
  function frames() {
    if (cache) return cache;
    const rows = stmt.frames.all() as FrameRow[];
    const housingRows = stmt.housings.all() as Array<{ frameCode: string; ar: number }>;
    const list = rows.map((r): { frame: FitmentFrame; map: FitmentFrameMap } => {
      const parsed = CompressorMapSchema.safeParse(JSON.parse(r.compressorMap));
      if (!parsed.success) throw new Error(`frame ${r.code} has a compressor map that does not parse: ${parsed.error.message}`);
      const bearingOptions = toBearings(r.bearingOptions);
      const powerBandHp: [number, number] = [r.powerMinHp, r.powerMaxHp];
      return {
        frame: {
          code: r.code,
          name: r.name,
          inducerMm: r.inducerMm,
          exducerMm: r.exducerMm,
          powerBandHp,
          maxFlowLbMin: r.maxFlowLbMin,
          maxPressureRatio: r.maxPressureRatio,
          maxShaftRpm: r.maxShaftRpm,
          bearingOptions,
          map: parsed.data,
          turbineWheelMm: r.turbineWheelMm,
          turbineArOptions: housingRows.filter((h) => h.frameCode === r.code).map((h) => h.ar),
        },
        map: { code: r.code, name: r.name, powerBandHp, maxShaftRpm: r.maxShaftRpm, bearingOptions, map: parsed.data },
      };
    });
    cache = { frames: list.map((x) => x.frame), maps: list.map((x) => x.map) };
    return cache;
  }

  function check(input: FitmentRequest): FitmentResponse {
    return runFitmentCheck(input, frames().frames);
  }

  function toSaved(row: SavedRow): SavedFitment {
    return { ...row, input: FitmentRequestSchema.parse(JSON.parse(row.input)) };
  }

  return {
    check,
    frameMaps: () => frames().maps,
    /** Forget the cached frames, after the catalogue's frames change. */
    reloadFrames: () => {
      cache = null;
    },
    listSaved: (userId: string): SavedFitment[] => (stmt.list.all(userId) as SavedRow[]).map(toSaved),
    getSaved: (userId: string, id: number): SavedFitment => {
      const row = Number.isSafeInteger(id) ? (stmt.one.get(id, userId) as SavedRow | undefined) : undefined;
      if (!row) throw notFound('No such saved fitment check');
      return toSaved(row);
    },
    /** Recomputes the check here rather than trusting a summary from the client. */
    save: (userId: string, name: string, input: FitmentRequest): SavedFitment => {
      const result = check(input);
      const summary = fitmentSummary(input, result);
      const best = result.candidates[0]?.frameCode ?? null;
      const id = sqlite.transaction(() => {
        if ((stmt.count.get(userId) as number) >= SAVED_FITMENTS_PER_USER_MAX) {
          throw new HttpError(409, `You have ${SAVED_FITMENTS_PER_USER_MAX} saved checks. Delete some you no longer need, then save again.`);
        }
        return Number(stmt.insert.run(userId, name, JSON.stringify(input), summary, best).lastInsertRowid);
      })();
      return toSaved(stmt.one.get(id, userId) as SavedRow);
    },
    removeSaved: (userId: string, id: number): void => {
      const changes = Number.isSafeInteger(id) ? stmt.remove.run(id, userId).changes : 0;
      if (changes === 0) throw notFound('No such saved fitment check');
    },
  };
}

export type FitmentService = ReturnType<typeof createFitmentService>;
