import fs from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { frames, parts } from '../../server/db/schema';
import { createUnitsService } from '../../server/services/units';
import { normalizeSerial } from '../../shared/unit-serial';
import { createTestDb } from '../support/test-app';

describe('units and their histories', () => {
  const { db, dir } = createTestDb();
  afterAll(() => {
    db.$client.close();
    fs.rmSync(dir, { recursive: true, force: true });
  });
  const units = createUnitsService({ db });

  it('gives each new unit the next valid serial of the year and keeps its history in order', () => {
    const frame = db.select({ code: frames.code }).from(frames).limit(1).get()!;
    const part = db.select({ id: parts.id }).from(parts).limit(1).get()!;
    const a = units.register(db, { partId: part.id, frameCode: frame.code, bearing: 'ball', origin: 'sold' });
    const b = units.register(db, { frameCode: frame.code, bearing: 'journal', application: 'circuit', origin: 'sold' });
    expect(normalizeSerial(a.serial)).toBe(a.serial);
    expect(Number(b.serial.slice(5, 11))).toBe(Number(a.serial.slice(5, 11)) + 1);
    units.addEvent(db, a.id, { kind: 'sold', summary: 'Sold on SY-1001', ref: 'SY-1001' });
    units.addEvent(db, a.id, { kind: 'booked-in', summary: 'Booked in for service', ref: 'SR-7001' });
    expect(units.history(db, a.id).map((e) => e.kind)).toEqual(['sold', 'booked-in']);
    expect(units.bySerial(db, a.serial.toLowerCase().replace(/-/g, ''))?.id).toBe(a.id);
  });

  it('takes a serial already on a unit, refuses one with a wrong check digit and a second unit with the same serial', () => {
    const given = units.nextSerial(db, 2025);
    units.register(db, { serial: given, bearing: 'journal', origin: 'booked-in' });
    expect(() => units.register(db, { serial: given, bearing: 'journal', origin: 'booked-in' })).toThrow(/UNIQUE/);
    const wrong = given.slice(0, -1) + String((Number(given.slice(-1)) + 1) % 10);
    expect(() => units.register(db, { serial: wrong, bearing: 'journal', origin: 'booked-in' })).toThrow(/not one of our serials/);
  });
});
