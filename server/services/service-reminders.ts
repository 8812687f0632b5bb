import { and, desc, eq, inArray, isNotNull } from 'drizzle-orm';
import type { Db } from '../db/client';
import { mailOutbox, notices, parts, serviceIntervals, serviceReminders, unitEvents, units, user } from '../db/schema';
import type { Bearing } from '../../shared/catalog';
import type { Application } from '../../shared/schemas/fitment';
import { APPLICATION_LABELS, SERVICE_EVENT_KINDS, type ServiceInterval } from '../../shared/schemas/units';
import { addMonths, dayOf, isDue } from '../../shared/service-due';
import { enqueueMail } from './mail-outbox';
import { renderServiceReminder } from './mail-templates/service-reminder';
import type { Query } from './orders/order-reads';
import type { UnitsService } from './units';
import { NotFoundError } from './errors';

/** When nothing is stored for a bearing and use (never, after the migration's defaults): once a year. */
const FALLBACK_MONTHS = 12;

export type UnitRow = typeof units.$inferSelect;

/**
 * Service intervals (by bearing and use, kept by staff in the Office) and the reminders the housekeeping job sends
 * when a unit falls due: one e-mail through the outbox, a line in the unit's history and an on-site notice, written
 * together, and never twice for the same due date (service_reminders holds one row per unit and date).
 */
export function createServiceReminders(deps: { db: Db; units: UnitsService; publicUrl: string }) {
  const { db, units: unitsService } = deps;
  const url = (p: string) => new URL(p, deps.publicUrl).toString();

  function intervals(q: Query = db): ServiceInterval[] {
    return q
      .select({ bearing: serviceIntervals.bearing, application: serviceIntervals.application, months: serviceIntervals.months, note: serviceIntervals.note, updatedAt: serviceIntervals.updatedAt, updatedBy: user.name })
      .from(serviceIntervals)
      .leftJoin(user, eq(user.id, serviceIntervals.updatedBy))
      .orderBy(serviceIntervals.bearing, serviceIntervals.application)
      .all();
  }

  function monthsFor(q: Query, bearing: Bearing, application: Application): number {
    return (
      q
        .select({ months: serviceIntervals.months })
        .from(serviceIntervals)
        .where(and(eq(serviceIntervals.bearing, bearing), eq(serviceIntervals.application, application)))
        .get()?.months ?? FALLBACK_MONTHS
    );
  }

  function setInterval(actorUserId: string, bearing: Bearing, application: Application, months: number): ServiceInterval {
    const changed = db
      .update(serviceIntervals)
      .set({ months, updatedBy: actorUserId, updatedAt: new Date().toISOString() })
      .where(and(eq(serviceIntervals.bearing, bearing), eq(serviceIntervals.application, application)))
      .run().changes;
    if (changed === 0) throw new NotFoundError(`No interval for ${bearing} bearing, ${application}`);
    return intervals().find((i) => i.bearing === bearing && i.application === application)!;
  }

  /** The last service on the Bench, if any: the latest history line that counts as one. */
  function lastServiceAt(q: Query, unitId: number): string | null {
    return (
      q
        .select({ at: unitEvents.createdAt })
        .from(unitEvents)
        .where(and(eq(unitEvents.unitId, unitId), inArray(unitEvents.kind, [...SERVICE_EVENT_KINDS])))
        .orderBy(desc(unitEvents.id))
        .limit(1)
        .get()?.at ?? null
    );
  }

  /** Last service (or, before any, the day we sold or first saw the unit) plus its interval. */
  function dueOf(q: Query, unit: UnitRow): { lastServiceAt: string | null; intervalMonths: number; dueOn: string } {
    const last = lastServiceAt(q, unit.id);
    const intervalMonths = monthsFor(q, unit.bearing, unit.application);
    return { lastServiceAt: last, intervalMonths, dueOn: addMonths(dayOf(last ?? unit.createdAt), intervalMonths) };
  }

  /**
   * Sends a reminder for every owned unit due on or before `today` that has had none for that due date. Each unit is
   * its own transaction; a unit reminded already (by this or another process) is skipped by the unique row.
   */
  function sendDue(today: Date = new Date()): number {
    const day = dayOf(today);
    const candidates = db.select().from(units).where(isNotNull(units.ownerUserId)).all();
    let sent = 0;
    for (const unit of candidates) {
      const { dueOn, intervalMonths, lastServiceAt: last } = dueOf(db, unit);
      if (!isDue(dueOn, day)) continue;
      const done = db.transaction((tx) => {
        const claimed = tx.insert(serviceReminders).values({ unitId: unit.id, dueOn }).onConflictDoNothing().run().changes;
        if (claimed === 0) return false;
        const owner = tx.select({ id: user.id, name: user.name, email: user.email }).from(user).where(eq(user.id, unit.ownerUserId!)).get();
        if (!owner) return false;
        const part = unit.partId ? tx.select({ partNumber: parts.partNumber, title: parts.title }).from(parts).where(eq(parts.id, unit.partId)).get() : undefined;
        const what = part ? `${part.partNumber} ${part.title}` : `${unit.frameCode ?? ''} ${unit.bearing} bearing unit`.trim();
        const bearingAndUse = `${unit.bearing} bearing, ${APPLICATION_LABELS[unit.application].toLowerCase()}`;
        const bookPath = `/service/new?serial=${encodeURIComponent(unit.serial)}`;
        const unitPath = `/units/${encodeURIComponent(unit.serial)}`;
        enqueueMail(tx, 'service-reminder', () => ({
          to: owner.email,
          ...renderServiceReminder({ name: owner.name, serial: unit.serial, what, bearingAndUse, intervalMonths, dueOn, lastService: dayOf(last ?? unit.createdAt), bookUrl: url(bookPath), unitUrl: url(unitPath) }),
        }));
        // The message just written (one connection: the newest row is ours), kept beside the reminder for staff.
        const mail = tx.select({ id: mailOutbox.id }).from(mailOutbox).orderBy(desc(mailOutbox.id)).limit(1).get();
        if (mail) tx.update(serviceReminders).set({ mailId: mail.id }).where(and(eq(serviceReminders.unitId, unit.id), eq(serviceReminders.dueOn, dueOn))).run();
        unitsService.addEvent(tx, unit.id, { kind: 'reminder-sent', summary: `Service reminder sent to ${owner.email}: due ${dueOn} (every ${intervalMonths} months, ${bearingAndUse})`, ref: dueOn });
        tx.insert(notices)
          .values({ userId: owner.id, orderId: null, kind: 'service-due', title: `Unit ${unit.serial} is due for a service`, body: `Due ${dueOn}: every ${intervalMonths} months for a ${bearingAndUse} unit (common practice). Book it in when it suits you.`, link: unitPath })
          .run();
        return true;
      });
      if (done) sent += 1;
    }
    return sent;
  }

  return { intervals, monthsFor, setInterval, lastServiceAt, dueOf, sendDue };
}

export type ServiceRemindersService = ReturnType<typeof createServiceReminders>;
