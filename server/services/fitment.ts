import { and, asc, count, desc, eq, isNotNull } from 'drizzle-orm';
import { changeFeedFor } from '../db/change-feed';
import type { Db } from '../db/client';
import { frames, parts, partSpecs, savedFitments } from '../db/schema';
import { runFitmentCheck } from '../../shared/fitment/check';
import { APPLICATION_DEFAULTS } from '../../shared/fitment/defaults';
import type { FitmentFrame } from '../../shared/fitment/frame';
import { BEARINGS } from '../../shared/catalog';
import { CompressorMapSchema } from '../../shared/schemas/compressor-map';
import { FitmentRequestSchema, type FitmentRequest, type FitmentResponse, type Verdict } from '../../shared/schemas/fitment';
import { SAVED_FITMENTS_PER_USER_MAX, type FitmentFrameMap, type SavedFitment } from '../../shared/schemas/saved-fitments';
import { ConflictError, NotFoundError } from './errors';

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

export function createFitmentService(db: Db) {
  const savedColumns = {
    id: savedFitments.id,
    name: savedFitments.name,
    input: savedFitments.input,
    summary: savedFitments.summary,
    bestFrameCode: savedFitments.bestFrameCode,
    createdAt: savedFitments.createdAt,
  };
  const savedOne = (tx: Pick<Db, 'select'>, id: number, userId: string) =>
    tx.select(savedColumns).from(savedFitments).where(and(eq(savedFitments.id, id), eq(savedFitments.userId, userId))).get();

  // The frames, their maps and the housings on sale are read and parsed once, and again after the frames or the
  // catalogue change in any process (the change feed).
  const feed = changeFeedFor(db);
  let cache: { frames: FitmentFrame[]; maps: FitmentFrameMap[]; framesAt: number; partsAt: number } | null = null;
  function loadFrames() {
    const versions = feed.current();
    if (cache && cache.framesAt === versions.frames && cache.partsAt === versions.parts) return cache;
    const rows = db.select().from(frames).orderBy(asc(frames.maxFlowLbMin)).all();
    // The turbine housings the catalogue sells for each frame: the matching recommends only what can be ordered.
    const housingRows = db
      .selectDistinct({ frameCode: parts.frameCode, ar: partSpecs.turbineAr })
      .from(parts)
      .innerJoin(partSpecs, eq(partSpecs.partId, parts.id))
      .where(and(eq(parts.category, 'turbine-housings'), eq(parts.status, 'active'), isNotNull(partSpecs.turbineAr)))
      .orderBy(asc(partSpecs.turbineAr))
      .all();
    // A map is parsed again only when the frames changed: its look-up tables hang on the parsed object.
    const keepMaps = cache !== null && cache.framesAt === versions.frames;
    const list = rows.map((r): { frame: FitmentFrame; map: FitmentFrameMap } => {
      const kept = keepMaps ? cache?.frames.find((f) => f.code === r.code)?.map : undefined;
      const parsed = kept ? { success: true as const, data: kept } : CompressorMapSchema.safeParse(r.compressorMap);
      if (!parsed.success) throw new Error(`frame ${r.code} has a compressor map that does not parse: ${parsed.error.message}`);
      const bearingOptions = r.bearingOptions.filter((b) => (BEARINGS as readonly string[]).includes(b));
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
          turbineArOptions: housingRows.flatMap((h) => (h.frameCode === r.code && h.ar !== null ? [h.ar] : [])),
        },
        map: { code: r.code, name: r.name, powerBandHp, maxShaftRpm: r.maxShaftRpm, bearingOptions, map: parsed.data },
      };
    });
    cache = { frames: list.map((x) => x.frame), maps: list.map((x) => x.map), framesAt: versions.frames, partsAt: versions.parts };
    return cache;
  }

  function check(input: FitmentRequest): FitmentResponse {
    return runFitmentCheck(input, loadFrames().frames);
  }

  function toSaved(row: NonNullable<ReturnType<typeof savedOne>>): SavedFitment {
    return { ...row, input: FitmentRequestSchema.parse(row.input) };
  }

  return {
    check,
    frameMaps: () => loadFrames().maps,
    /** Forget the cached frames, after the catalogue's frames change. */
    reloadFrames: () => {
      cache = null;
    },
    listSaved: (userId: string): SavedFitment[] =>
      db
        .select(savedColumns)
        .from(savedFitments)
        .where(eq(savedFitments.userId, userId))
        .orderBy(desc(savedFitments.createdAt), desc(savedFitments.id))
        .all()
        .map(toSaved),
    getSaved: (userId: string, id: number): SavedFitment => {
      const row = Number.isSafeInteger(id) ? savedOne(db, id, userId) : undefined;
      if (!row) throw new NotFoundError('No such saved fitment check');
      return toSaved(row);
    },
    /** Recomputes the check here rather than trusting a summary from the client. */
    save: (userId: string, name: string, input: FitmentRequest): SavedFitment => {
      const result = check(input);
      const summary = fitmentSummary(input, result);
      const best = result.candidates[0]?.frameCode ?? null;
      const row = db.transaction((tx) => {
        const held = tx.select({ n: count() }).from(savedFitments).where(eq(savedFitments.userId, userId)).get()?.n ?? 0;
        if (held >= SAVED_FITMENTS_PER_USER_MAX) {
          throw new ConflictError(`You have ${SAVED_FITMENTS_PER_USER_MAX} saved checks. Delete some you no longer need, then save again.`);
        }
        const { id } = tx.insert(savedFitments).values({ userId, name, input, summary, bestFrameCode: best }).returning({ id: savedFitments.id }).get();
        return savedOne(tx, id, userId);
      });
      if (!row) throw new Error('the saved check was not written');
      return toSaved(row);
    },
    removeSaved: (userId: string, id: number): void => {
      const changes = Number.isSafeInteger(id)
        ? db.delete(savedFitments).where(and(eq(savedFitments.id, id), eq(savedFitments.userId, userId))).run().changes
        : 0;
      if (changes === 0) throw new NotFoundError('No such saved fitment check');
    },
  };
}

export type FitmentService = ReturnType<typeof createFitmentService>;
