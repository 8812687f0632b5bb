import { and, asc, eq, like, sql } from 'drizzle-orm';
import type { Db } from '../db/client';
import { unitEvents, units } from '../db/schema';
import type { Bearing } from '../../shared/catalog';
import type { UnitEventKind, UnitOrigin } from '../../shared/allowed-values';
import type { Application } from '../../shared/schemas/fitment';
import { formatSerial, normalizeSerial } from '../../shared/unit-serial';
import type { Query } from './orders/order-reads';
import { InvalidError } from './errors';

export type UnitRow = typeof units.$inferSelect;
export type UnitEventRow = typeof unitEvents.$inferSelect;

export interface NewUnit {
  /** A serial already on the unit (booked in); without one the next serial of the year is given. */
  serial?: string;
  partId?: number | null;
  frameCode?: string | null;
  bearing: Bearing;
  application?: Application;
  origin: UnitOrigin;
  ownerUserId?: string | null;
  dealerAccountId?: number | null;
  orderLineId?: number | null;
}

/**
 * The units we know by serial and their histories. Every function takes the query handle it runs on, so the
 * workshop, the Floor and the shaft-speed logs write a unit's history in the transaction of the change itself.
 */
export function createUnitsService(deps: { db: Db }) {
  const { db } = deps;

  /** The next free serial of the year (the highest sequence given this year, plus one). */
  function nextSerial(q: Query, year = new Date().getUTCFullYear()): string {
    const yy = String(year % 100).padStart(2, '0');
    const last = q
      .select({ serial: units.serial })
      .from(units)
      .where(like(units.serial, `VC${yy}-%`))
      .orderBy(sql`${units.serial} DESC`)
      .limit(1)
      .get();
    return formatSerial(year, last ? Number(last.serial.slice(5, 11)) + 1 : 1);
  }

  function register(q: Query, unit: NewUnit): UnitRow {
    let serial: string;
    if (unit.serial !== undefined) {
      const s = normalizeSerial(unit.serial);
      if (!s) throw new InvalidError(`${unit.serial.slice(0, 40)} is not one of our serials: they read like VC26-004217-5`, { serial: ['check the serial on the unit'] });
      serial = s;
    } else {
      serial = nextSerial(q);
    }
    const row = q
      .insert(units)
      .values({
        serial,
        partId: unit.partId ?? null,
        frameCode: unit.frameCode ?? null,
        bearing: unit.bearing,
        application: unit.application ?? 'street',
        origin: unit.origin,
        ownerUserId: unit.ownerUserId ?? null,
        dealerAccountId: unit.dealerAccountId ?? null,
        orderLineId: unit.orderLineId ?? null,
      })
      .returning()
      .get();
    return row;
  }

  function bySerial(q: Query, typed: string): UnitRow | null {
    const serial = normalizeSerial(typed);
    if (!serial) return null;
    return q.select().from(units).where(eq(units.serial, serial)).get() ?? null;
  }

  function addEvent(q: Query, unitId: number, e: { kind: UnitEventKind; summary: string; ref?: string | null; actorUserId?: string | null }) {
    q.insert(unitEvents)
      .values({ unitId, kind: e.kind, summary: e.summary, ref: e.ref ?? null, actorUserId: e.actorUserId ?? null })
      .run();
  }

  function history(q: Query, unitId: number): UnitEventRow[] {
    return q.select().from(unitEvents).where(eq(unitEvents.unitId, unitId)).orderBy(asc(unitEvents.id)).all();
  }

  /** Units a buyer has: theirs, or their trade account's. */
  function ownedBy(q: Query, who: { userId: string; dealerAccountId: number | null }): UnitRow[] {
    const mine = who.dealerAccountId === null ? eq(units.ownerUserId, who.userId) : sql`(${units.ownerUserId} = ${who.userId} OR ${units.dealerAccountId} = ${who.dealerAccountId})`;
    return q.select().from(units).where(and(mine)).orderBy(asc(units.serial)).all();
  }

  return { nextSerial, register, bySerial, addEvent, history, ownedBy, db };
}

export type UnitsService = ReturnType<typeof createUnitsService>;
