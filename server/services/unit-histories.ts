import { asc, count, desc, eq, or, type SQL } from 'drizzle-orm';
import type { Db } from '../db/client';
import { dealerAccounts, parts, savedFitments, shaftLogs, units, user } from '../db/schema';
import type { Role } from '../../shared/allowed-values';
import type { Application } from '../../shared/schemas/fitment';
import type { ShaftLog } from '../../shared/schemas/shaft-logs';
import { APPLICATION_LABELS, MY_UNITS_PAGE_SIZE, type MyUnitsPage, type UnitHistory, type UnitLogUpload, type UnitSummary } from '../../shared/schemas/units';
import type { CurrentUser } from './current-user';
import { InvalidError, NotFoundError } from './errors';
import type { ServiceRemindersService, UnitRow } from './service-reminders';
import type { ShaftLogFile, ShaftLogService } from './shaft-logs';
import type { UnitsService } from './units';

/** Staff who see every unit's history: the Floor packs them, the Bench services them, the Office keeps the books. */
const STAFF: Role[] = ['warehouse', 'workshop', 'admin'];

/**
 * Units as buyers and staff see them: "My units" (the buyer's and their trade account's), one unit's history, its use,
 * and shaft-speed logs uploaded for it. Anyone else is told the unit does not exist.
 */
export function createUnitHistories(deps: { db: Db; units: UnitsService; reminders: ServiceRemindersService; shaftLogs: ShaftLogService }) {
  const { db, units: unitsService, reminders, shaftLogs: logs } = deps;

  const accountOf = (u: CurrentUser) => (u.dealer && u.dealer.status === 'approved' ? u.dealer.id : null);
  const isOwner = (u: CurrentUser, unit: UnitRow) => unit.ownerUserId === u.id || (unit.dealerAccountId !== null && unit.dealerAccountId === accountOf(u));
  const ownedWhere = (u: CurrentUser): SQL => {
    const account = accountOf(u);
    return account === null ? eq(units.ownerUserId, u.id) : or(eq(units.ownerUserId, u.id), eq(units.dealerAccountId, account))!;
  };

  function summary(unit: UnitRow): UnitSummary {
    const part = unit.partId ? db.select({ partNumber: parts.partNumber, title: parts.title, category: parts.category }).from(parts).where(eq(parts.id, unit.partId)).get() : undefined;
    const due = reminders.dueOf(db, unit);
    return {
      serial: unit.serial,
      partNumber: part?.partNumber ?? null,
      title: part?.title ?? null,
      category: part?.category ?? null,
      frameCode: unit.frameCode,
      bearing: unit.bearing,
      application: unit.application,
      origin: unit.origin,
      since: unit.createdAt,
      lastServiceAt: due.lastServiceAt,
      intervalMonths: due.intervalMonths,
      nextServiceDue: due.dueOn,
    };
  }

  /** The unit, if this person may see it; otherwise "no such unit", so serials cannot be probed. */
  function visible(u: CurrentUser, serial: string): UnitRow {
    const unit = unitsService.bySerial(db, serial);
    if (!unit || !(STAFF.includes(u.role) || isOwner(u, unit))) throw new NotFoundError(`No unit ${serial.slice(0, 20)}`);
    return unit;
  }
  function owned(u: CurrentUser, serial: string): UnitRow {
    const unit = unitsService.bySerial(db, serial);
    if (!unit || !isOwner(u, unit)) throw new NotFoundError(`No unit ${serial.slice(0, 20)} of yours`);
    return unit;
  }

  function myUnits(u: CurrentUser, page: number): MyUnitsPage {
    const where = ownedWhere(u);
    const total = db.select({ n: count() }).from(units).where(where).get()?.n ?? 0;
    const rows = db
      .select()
      .from(units)
      .where(where)
      .orderBy(desc(units.id))
      .limit(MY_UNITS_PAGE_SIZE)
      .offset((page - 1) * MY_UNITS_PAGE_SIZE)
      .all();
    return { items: rows.map(summary), total, page, pageSize: MY_UNITS_PAGE_SIZE };
  }

  function history(u: CurrentUser, serial: string): UnitHistory {
    const unit = visible(u, serial);
    const mine = isOwner(u, unit);
    const events = unitsService.history(db, unit.id).map((e) => ({ kind: e.kind, summary: e.summary, ref: e.ref, at: e.createdAt }));
    const logRows = db
      .select({ id: shaftLogs.id, name: shaftLogs.name, frameCode: shaftLogs.frameCode, rowCount: shaftLogs.rowCount, durationS: shaftLogs.durationS, createdAt: shaftLogs.createdAt, savedFitmentId: shaftLogs.savedFitmentId, checkOwner: savedFitments.userId })
      .from(shaftLogs)
      .innerJoin(savedFitments, eq(savedFitments.id, shaftLogs.savedFitmentId))
      .where(eq(shaftLogs.unitId, unit.id))
      .orderBy(asc(shaftLogs.id))
      .all();
    const owner = mine
      ? null
      : (db
          .select({ name: user.name, company: dealerAccounts.companyName })
          .from(units)
          .leftJoin(user, eq(user.id, units.ownerUserId))
          .leftJoin(dealerAccounts, eq(dealerAccounts.id, units.dealerAccountId))
          .where(eq(units.id, unit.id))
          .get() ?? null);
    return {
      unit: summary(unit),
      owner: owner ? { name: owner.name ?? '(no buyer on record)', company: owner.company ?? null } : null,
      events,
      logs: logRows.map(({ savedFitmentId, checkOwner, ...l }) => ({ ...l, mapLink: checkOwner === u.id ? `/fitment/saved/${savedFitmentId}/logs?log=${l.id}` : null })),
      isOwner: mine,
      savedChecks: mine ? db.select({ id: savedFitments.id, name: savedFitments.name }).from(savedFitments).where(eq(savedFitments.userId, u.id)).orderBy(desc(savedFitments.id)).limit(50).all() : [],
    };
  }

  function setApplication(u: CurrentUser, serial: string, application: Application): UnitSummary {
    const unit = owned(u, serial);
    if (unit.application === application) return summary(unit);
    return db.transaction((tx) => {
      tx.update(units).set({ application }).where(eq(units.id, unit.id)).run();
      const months = reminders.monthsFor(tx, unit.bearing, application);
      unitsService.addEvent(tx, unit.id, { kind: 'note', summary: `Use set to ${APPLICATION_LABELS[application].toLowerCase()} (was ${APPLICATION_LABELS[unit.application].toLowerCase()}): service every ${months} months`, actorUserId: u.id });
      return summary({ ...unit, application });
    });
  }

  /** A log from the unit's page: stored with the engine's saved check (for the map) and the unit, with a history line. */
  function uploadLog(u: CurrentUser, serial: string, form: UnitLogUpload, file: ShaftLogFile): ShaftLog {
    const unit = owned(u, serial);
    if (!unit.frameCode) throw new InvalidError('This unit has no frame on record, so its log cannot be laid on a map', { file: ['ask the workshop to record the frame first'] });
    return logs.upload(u.id, form.savedFitmentId, { frameCode: unit.frameCode, name: form.name }, file, {
      unitId: unit.id,
      stored: (tx, log) => unitsService.addEvent(tx, unit.id, { kind: 'log-uploaded', summary: `Shaft-speed log “${log.name}” uploaded: ${log.rowCount} rows over ${Math.round(log.durationS)} s`, ref: `log-${log.id}`, actorUserId: u.id }),
    });
  }

  return { myUnits, history, setApplication, uploadLog, isOwner };
}

export type UnitHistoriesService = ReturnType<typeof createUnitHistories>;
