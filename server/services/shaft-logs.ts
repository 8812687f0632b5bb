import { and, count, desc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { demoShaftLogCsv } from '../../catalog-seed/demo-logs';
import { analyseShaftLog } from '../../shared/fitment/shaft-log';
import type { FitmentFrameMap, SavedFitment } from '../../shared/schemas/saved-fitments';
import {
  SHAFT_LOG_MAX_BYTES,
  SHAFT_LOG_MAX_ROWS,
  SHAFT_LOGS_PER_CHECK_MAX,
  ShaftLogRowSchema,
  type ShaftLog,
  type ShaftLogDetail,
  type ShaftLogPoint,
  type ShaftLogSummary,
  type ShaftLogUpload,
} from '../../shared/schemas/shaft-logs';
import { parseShaftLogCsv, rowErrorsToFieldErrors } from '../../shared/shaft-log-csv';
import type { Db } from '../db/client';
import { shaftLogs } from '../db/schema';
import { ConflictError, InvalidError, NotFoundError, TooLargeError } from './errors';
import type { FitmentService } from './fitment';
import type { Query } from './orders/order-reads';

const listColumns = {
  id: shaftLogs.id,
  savedFitmentId: shaftLogs.savedFitmentId,
  name: shaftLogs.name,
  frameCode: shaftLogs.frameCode,
  boostUnit: shaftLogs.boostUnit,
  rowCount: shaftLogs.rowCount,
  durationS: shaftLogs.durationS,
  createdAt: shaftLogs.createdAt,
};

const StoredRowsSchema = z.array(ShaftLogRowSchema);

const round = (value: number, digits: number) => {
  const f = 10 ** digits;
  return Math.round(value * f) / f;
};
const roundOrNull = (value: number | null, digits: number) => (value === null ? null : round(value, digits));

/** Points go to the browser by the thousand: rounded to what a chart or a table can show, they weigh half as much. */
function forTheWire(p: ShaftLogPoint): ShaftLogPoint {
  return {
    ...p,
    t: round(p.t, 3),
    boostKpa: round(p.boostKpa, 2),
    intakeC: round(p.intakeC, 2),
    manifoldKpa: round(p.manifoldKpa, 2),
    pressureRatio: round(p.pressureRatio, 4),
    airflowLbMin: round(p.airflowLbMin, 3),
    correctedFlowLbMin: round(p.correctedFlowLbMin, 3),
    shaftSpeedPct: round(p.shaftSpeedPct, 2),
    surgeFlowLbMin: roundOrNull(p.surgeFlowLbMin, 3),
    surgeMarginPct: roundOrNull(p.surgeMarginPct, 2),
  };
}

function summaryForTheWire(s: ShaftLogSummary): ShaftLogSummary {
  return {
    ...s,
    durationS: round(s.durationS, 3),
    peakShaftSpeedPct: round(s.peakShaftSpeedPct, 2),
    timeOverSpeedS: round(s.timeOverSpeedS, 3),
    timeNearLimitS: round(s.timeNearLimitS, 3),
    timeNearOrInSurgeS: round(s.timeNearOrInSurgeS, 3),
    timeInSurgeS: round(s.timeInSurgeS, 3),
    timeAboveMapS: round(s.timeAboveMapS, 3),
    leastSurgeMarginPct: roundOrNull(s.leastSurgeMarginPct, 2),
    excursions: s.excursions.map((e) => ({
      ...e,
      durationS: round(e.durationS, 3),
      shaftSpeedPct: round(e.shaftSpeedPct, 2),
      surgeMarginPct: roundOrNull(e.surgeMarginPct, 2),
    })),
  };
}

export interface ShaftLogFile {
  text: string;
  /** The uploaded file's name, used when the form gives no name. */
  fileName?: string;
}

/** A log uploaded for one unit: stored with it, and `stored` writes the unit's history line in the same transaction. */
export interface ForUnit {
  unitId: number;
  stored: (tx: Query, log: ShaftLog) => void;
}

/** Shaft-speed logs belong to a saved check and so to its owner; anyone else is told the check does not exist. */
export function createShaftLogService(deps: { db: Db; fitment: FitmentService }) {
  const { db, fitment } = deps;

  const frameMap = (code: string): FitmentFrameMap | undefined => fitment.frameMaps().find((f) => f.code === code);

  function frameOr400(code: string): FitmentFrameMap {
    const frame = frameMap(code);
    if (!frame) throw new InvalidError('That frame is not in the catalogue', { frameCode: [`there is no frame ${code}; choose one from the list`] });
    return frame;
  }

  function logsOf(savedFitmentId: number): ShaftLog[] {
    return db
      .select(listColumns)
      .from(shaftLogs)
      .where(eq(shaftLogs.savedFitmentId, savedFitmentId))
      .orderBy(desc(shaftLogs.createdAt), desc(shaftLogs.id))
      .all();
  }

  function logRow(savedFitmentId: number, logId: number) {
    const row = Number.isSafeInteger(logId)
      ? db
          .select()
          .from(shaftLogs)
          .where(and(eq(shaftLogs.id, logId), eq(shaftLogs.savedFitmentId, savedFitmentId)))
          .get()
      : undefined;
    if (!row) throw new NotFoundError('No such log on this check');
    return row;
  }

  return {
    list(userId: string, fitmentId: number): ShaftLog[] {
      const saved = fitment.getSaved(userId, fitmentId);
      return logsOf(saved.id);
    },

    /** Reads and checks the file; nothing is stored unless every row is good. */
    upload(userId: string, fitmentId: number, form: ShaftLogUpload, file: ShaftLogFile, forUnit?: ForUnit): ShaftLog {
      const saved = fitment.getSaved(userId, fitmentId);
      const frame = frameOr400(form.frameCode);
      const parsed = parseShaftLogCsv(file.text);
      if (!parsed.ok) {
        const first = parsed.errors[0];
        if (parsed.tooLarge) {
          throw new TooLargeError(first?.message ? `The log is too large: ${first.message}` : `The log may be at most ${SHAFT_LOG_MAX_BYTES / 1_000_000} MB and ${SHAFT_LOG_MAX_ROWS} rows`);
        }
        const shown = parsed.errors.length < parsed.errorCount ? `; the first ${parsed.errors.length} are listed` : '';
        throw new InvalidError(
          `The log has ${parsed.errorCount} ${parsed.errorCount === 1 ? 'problem' : 'problems'}${shown}. Fix the file and upload it again.`,
          rowErrorsToFieldErrors(parsed.errors),
        );
      }
      const first = parsed.rows[0];
      const last = parsed.rows[parsed.rows.length - 1];
      const name = form.name ?? file.fileName?.replace(/\.(csv|txt)$/i, '').trim().slice(0, 80) ?? '';
      return db.transaction((tx) => {
        const held = tx.select({ n: count() }).from(shaftLogs).where(eq(shaftLogs.savedFitmentId, saved.id)).get();
        if ((held?.n ?? 0) >= SHAFT_LOGS_PER_CHECK_MAX) {
          throw new ConflictError(`This check already has ${SHAFT_LOGS_PER_CHECK_MAX} logs. Delete some you no longer need, then upload again.`);
        }
        const log = tx
          .insert(shaftLogs)
          .values({
            savedFitmentId: saved.id,
            frameCode: frame.code,
            name: name || `Log on ${frame.code}`,
            boostUnit: parsed.boostUnit,
            rowCount: parsed.rows.length,
            durationS: first && last ? round(last.t - first.t, 3) : 0,
            rows: parsed.rows,
            unitId: forUnit?.unitId ?? null,
          })
          .returning(listColumns)
          .get();
        forUnit?.stored(tx, log);
        return log;
      });
    },

    /** One log on its frame's map, worked out now from the saved check re-run and the frame's map of today. */
    get(userId: string, fitmentId: number, logId: number): ShaftLogDetail {
      const saved = fitment.getSaved(userId, fitmentId);
      const row = logRow(saved.id, logId);
      const frame = frameMap(row.frameCode);
      if (!frame) throw new ConflictError(`Frame ${row.frameCode} is no longer in the catalogue, so this log has no map to go on`);
      const result = fitment.check(saved.input);
      const { points, summary } = analyseShaftLog(StoredRowsSchema.parse(row.rows), result.assumptions, frame);
      const { rows: _rows, ...log } = row;
      return {
        log,
        frame,
        operatingLine: result.operatingLine,
        candidate: result.candidates.find((c) => c.frameCode === frame.code) ?? null,
        points: points.map(forTheWire),
        summary: summaryForTheWire(summary),
      };
    },

    remove(userId: string, fitmentId: number, logId: number): void {
      const saved = fitment.getSaved(userId, fitmentId);
      const gone = Number.isSafeInteger(logId)
        ? db
            .delete(shaftLogs)
            .where(and(eq(shaftLogs.id, logId), eq(shaftLogs.savedFitmentId, saved.id)))
            .run().changes
        : 0;
      if (gone === 0) throw new NotFoundError('No such log on this check');
    },

    /** An invented log for this check's engine on one frame, to try the upload with. */
    sample(userId: string, fitmentId: number, frameCode: string): { fileName: string; csv: string } {
      const saved: SavedFitment = fitment.getSaved(userId, fitmentId);
      const frame = frameOr400(frameCode);
      const result = fitment.check(saved.input);
      const csv = demoShaftLogCsv({
        engine: result.assumptions,
        chargeAirC: result.assumptions.manifoldTempC,
        frame,
        operatingLine: result.operatingLine,
        seed: saved.id,
        comments: [
          'Spoolyard shaft-speed log: a sample with invented data.',
          `Made for the saved check “${saved.name.replace(/[\r\n]+/g, ' ')}” on frame ${frame.code} ${frame.name}.`,
          'Columns: time_s (s), engine_rpm, boost_kpa (gauge), shaft_rpm, intake_c (charge air, °C).',
        ],
      });
      return { fileName: `sample-shaft-log-${frame.code}.csv`, csv };
    },
  };
}

export type ShaftLogService = ReturnType<typeof createShaftLogService>;
