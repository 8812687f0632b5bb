import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dealerMembers, partLinks, parts, serviceReminders, unitEvents, units } from '../../server/db/schema';
import { and, eq, inArray } from 'drizzle-orm';
import { SavedFitmentSchema } from '../../shared/schemas/saved-fitments';
import { MyUnitsPageSchema, ServiceIntervalsSchema, UnitHistorySchema } from '../../shared/schemas/units';
import { OrderDetailSchema } from '../../shared/schemas/orders';
import { normalizeSerial } from '../../shared/unit-serial';
import { addMonths } from '../../shared/service-due';
import { createCustomer, createDealer, createOrder, createPart, createUser, type TestUser } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let floor: Client;
let workshop: Client;
let admin: Client;

beforeAll(async () => {
  t = await startTestApp({ fakes: true });
  [floor, workshop, admin] = (await Promise.all([createUser(t, { role: 'warehouse' }), createUser(t, { role: 'workshop' }), createUser(t, { role: 'admin' })])).map((u) => u.client) as [Client, Client, Client];
}, 60_000);
afterAll(async () => {
  await t.close();
});

const one = <T>(q: string, ...p: unknown[]) => t.db.$client.prepare(q).get(...p) as T;

/** A complete unit and a cartridge of our own (frame GIM), and a gasket that gets no serial. */
function ownParts() {
  const turbo = createPart(t, { category: 'turbochargers', frameCode: 'GIM', title: 'Factory GIM turbocharger, journal bearing', specs: { bearing: 'journal' } });
  const cartridge = createPart(t, { category: 'cartridges', frameCode: 'GIM', title: 'Factory GIM cartridge, ball bearing', specs: { bearing: 'ball' } });
  const gasket = createPart(t, {});
  return { turbo, cartridge, gasket };
}

async function packedOrder(buyer: TestUser, lines: Array<{ partNumber: string; quantity: number }>) {
  const { order } = await createOrder(buyer, lines);
  if (order.status === 'pending_payment') {
    // The card payment settles through the fake's webhook; wait for it (also from a beforeAll, where expect.poll cannot run).
    for (let i = 0; i < 100; i++) {
      if (((await buyer.client.get(`/api/orders/${order.number}`)).body as { status: string }).status === 'paid') break;
      await new Promise((r) => setTimeout(r, 50));
    }
  }
  const pickList = (await floor.get(`/api/warehouse/orders/${order.number}/pick-list`)).body as { lines: Array<{ lineId: number; partNumber: string; toPick: number }> };
  for (const l of pickList.lines) {
    expect((await floor.send('POST', `/api/warehouse/orders/${order.number}/picks`, { lineId: l.lineId, scannedPartNumber: l.partNumber, quantity: l.toPick })).status).toBe(200);
  }
  const packed = await floor.send('POST', `/api/warehouse/orders/${order.number}/pack`, { cartons: 1, weightKg: 25 });
  expect(packed.status, JSON.stringify(packed.body)).toBe(200);
  return order.number;
}

describe('rebuild kits in the demo catalogue', () => {
  it('are a category of their own, linked both ways with the cartridges and complete units they rebuild', () => {
    const kits = t.db.select().from(parts).where(eq(parts.category, 'rebuild-kits')).all();
    expect(kits.length).toBeGreaterThanOrEqual(20);
    const kit = kits.find((k) => k.frameCode === 'GIM' && k.bearing === 'journal')!;
    const linked = t.db.select({ id: partLinks.relatedPartId }).from(partLinks).where(eq(partLinks.partId, kit.id)).all().map((r) => r.id);
    const family = t.db
      .select({ id: parts.id, category: parts.category, bearing: parts.bearing })
      .from(parts)
      .where(and(eq(parts.frameCode, 'GIM'), eq(parts.status, 'active'), inArray(parts.category, ['cartridges', 'turbochargers'])))
      .all()
      .filter((p) => p.bearing === 'journal');
    expect(new Set(linked)).toEqual(new Set(family.map((p) => p.id)));
    expect(family.some((p) => p.category === 'cartridges') && family.some((p) => p.category === 'turbochargers')).toBe(true);
    for (const p of family) expect(t.db.select().from(partLinks).where(and(eq(partLinks.partId, p.id), eq(partLinks.relatedPartId, kit.id))).get()).toBeDefined();
  });

  it('show in the catalogue list, its facets and search', async () => {
    const list = (await t.get('/api/parts?category=rebuild-kits')).body as { total: number; facets: { category: Array<{ value: string; count: number }> } };
    expect(list.total).toBeGreaterThanOrEqual(20);
    const all = (await t.get('/api/parts')).body as { facets: { category: Array<{ value: string; count: number }> } };
    expect(all.facets.category.find((f) => f.value === 'rebuild-kits')?.count).toBe(list.total);
    const found = (await t.get('/api/parts?q=rebuild+kit')).body as { items: Array<{ category: string }> };
    expect(found.items.some((p) => p.category === 'rebuild-kits')).toBe(true);
  });
});

describe('serials at packing', () => {
  it('gives each packed complete unit and cartridge a serial owned by the buyer, with a sold line, shown on the order', async () => {
    const buyer = await createCustomer(t);
    const { turbo, cartridge, gasket } = ownParts();
    const number = await packedOrder(buyer, [
      { partNumber: turbo.partNumber, quantity: 2 },
      { partNumber: cartridge.partNumber, quantity: 1 },
      { partNumber: gasket.partNumber, quantity: 3 },
    ]);
    const order = OrderDetailSchema.parse((await buyer.client.get(`/api/orders/${number}`)).body);
    const byPart = (pn: string) => order.lines.find((l) => l.partNumber === pn)!.serials;
    expect(byPart(turbo.partNumber)).toHaveLength(2);
    expect(byPart(cartridge.partNumber)).toHaveLength(1);
    expect(byPart(gasket.partNumber)).toEqual([]);
    for (const s of [...byPart(turbo.partNumber), ...byPart(cartridge.partNumber)]) expect(normalizeSerial(s)).toBe(s);

    const row = t.db.select().from(units).where(eq(units.serial, byPart(cartridge.partNumber)[0]!)).get()!;
    expect(row).toMatchObject({ origin: 'sold', ownerUserId: buyer.id, dealerAccountId: null, bearing: 'ball', frameCode: 'GIM', partId: cartridge.id });
    expect(t.db.select({ kind: unitEvents.kind, ref: unitEvents.ref }).from(unitEvents).where(eq(unitEvents.unitId, row.id)).all()).toEqual([{ kind: 'sold', ref: number }]);

    // Packing again (a corrected weight) gives no second set of serials; staff see the same serials on the slip's order.
    expect((await floor.send('POST', `/api/warehouse/orders/${number}/pack`, { cartons: 2, weightKg: 26 })).status).toBe(200);
    const again = OrderDetailSchema.parse((await floor.get(`/api/orders/${number}`)).body);
    expect(again.lines.find((l) => l.partNumber === turbo.partNumber)!.serials).toEqual(byPart(turbo.partNumber));
  });

  it('puts a dealer’s units on their trade account, so everyone on it sees them in My units', async () => {
    const dealer = await createDealer(t);
    const colleague = await createUser(t, { role: 'dealer' });
    t.db.insert(dealerMembers).values({ userId: colleague.id, dealerAccountId: dealer.dealerAccountId }).run();
    const { turbo } = ownParts();
    const number = await packedOrder(dealer, [{ partNumber: turbo.partNumber, quantity: 1 }]);
    const serial = OrderDetailSchema.parse((await dealer.client.get(`/api/orders/${number}`)).body).lines[0]!.serials[0]!;
    expect(t.db.select({ a: units.dealerAccountId }).from(units).where(eq(units.serial, serial)).get()?.a).toBe(dealer.dealerAccountId);
    for (const c of [dealer.client, colleague.client]) {
      const mine = MyUnitsPageSchema.parse((await c.get('/api/units/mine')).body);
      expect(mine.items.map((u) => u.serial)).toContain(serial);
    }
    expect((await colleague.client.get(`/api/units/${serial}`)).status).toBe(200);
  });
});

describe('unit history', () => {
  let buyer: TestUser;
  let serial: string;
  beforeAll(async () => {
    buyer = await createCustomer(t);
    const { turbo } = ownParts();
    const number = await packedOrder(buyer, [{ partNumber: turbo.partNumber, quantity: 1 }]);
    serial = OrderDetailSchema.parse((await buyer.client.get(`/api/orders/${number}`)).body).lines[0]!.serials[0]!;
  });

  it('shows the owner and staff what the unit is and its history in order; anyone else gets 404', async () => {
    const own = UnitHistorySchema.parse((await buyer.client.get(`/api/units/${serial}`)).body);
    expect(own.unit).toMatchObject({ serial, frameCode: 'GIM', bearing: 'journal', application: 'street' });
    expect(own.isOwner).toBe(true);
    expect(own.events.map((e) => e.kind)).toEqual(['sold']);
    // Typed without dashes, in lower case: the same unit.
    expect((await buyer.client.get(`/api/units/${serial.replace(/-/g, '').toLowerCase()}`)).status).toBe(200);
    for (const staff of [floor, workshop, admin]) {
      const seen = UnitHistorySchema.parse((await staff.get(`/api/units/${serial}`)).body);
      expect(seen.isOwner).toBe(false);
      expect(seen.owner?.name).toBe(buyer.name);
    }
    const stranger = await createCustomer(t);
    const otherDealer = await createDealer(t);
    expect((await stranger.client.get(`/api/units/${serial}`)).status).toBe(404);
    expect((await otherDealer.client.get(`/api/units/${serial}`)).status).toBe(404);
    expect((await t.get(`/api/units/${serial}`)).status).toBe(401);
    expect((await stranger.client.send('PATCH', `/api/units/${serial}`, { application: 'drag' })).status).toBe(404);
  });

  it('lets the owner set the use, which sets the interval and is written in the history', async () => {
    const before = UnitHistorySchema.parse((await buyer.client.get(`/api/units/${serial}`)).body).unit;
    expect(before.intervalMonths).toBe(12);
    const res = await buyer.client.send('PATCH', `/api/units/${serial}`, { application: 'circuit' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const after = UnitHistorySchema.parse((await buyer.client.get(`/api/units/${serial}`)).body);
    // Journal bearing in circuit use: every 3 months (common practice, as seeded).
    expect(after.unit.intervalMonths).toBe(3);
    expect(after.unit.nextServiceDue).toBe(addMonths(after.unit.since.slice(0, 10), 3));
    expect(after.events.at(-1)).toMatchObject({ kind: 'note' });
    expect((await buyer.client.send('PATCH', `/api/units/${serial}`, { application: 'rally' })).status).toBe(400);
    // Staff see the unit but do not set its use.
    expect((await workshop.send('PATCH', `/api/units/${serial}`, { application: 'drag' })).status).toBe(404);
  });

  it('takes a shaft-speed log for the unit, laid on the map through a saved check, and shows it in the history', async () => {
    const saved = SavedFitmentSchema.parse((await buyer.client.send('POST', '/api/fitments', { name: 'track car', input: { displacementL: 3.0, powerHp: 600, rpm: 7000, fuel: 'petrol', application: 'circuit' } })).body);
    const sample = await buyer.client.get(`/api/fitments/${saved.id}/shaft-logs/sample.csv?frameCode=GIM`);
    expect(sample.status).toBe(200);
    const form = new FormData();
    form.append('savedFitmentId', String(saved.id));
    form.append('name', 'Track day pulls');
    form.append('file', new Blob([String(sample.body)], { type: 'text/csv' }), 'pulls.csv');
    const up = await buyer.client.upload(`/api/units/${serial}/logs`, form);
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const history = UnitHistorySchema.parse((await buyer.client.get(`/api/units/${serial}`)).body);
    expect(history.logs).toHaveLength(1);
    expect(history.logs[0]).toMatchObject({ name: 'Track day pulls', frameCode: 'GIM' });
    expect(history.logs[0]!.mapLink).toMatch(new RegExp(`^/fitment/saved/${saved.id}/logs`));
    expect(history.events.at(-1)).toMatchObject({ kind: 'log-uploaded' });
    // The same log is on the saved check too, and staff see it on the unit without the owner's map link.
    expect(((await buyer.client.get(`/api/fitments/${saved.id}/shaft-logs`)).body as { items: unknown[] }).items).toHaveLength(1);
    expect(UnitHistorySchema.parse((await workshop.get(`/api/units/${serial}`)).body).logs[0]!.mapLink).toBeNull();

    // A bad file stores nothing and writes no history line.
    const bad = new FormData();
    bad.append('savedFitmentId', String(saved.id));
    bad.append('file', new Blob(['time_s,engine_rpm\n1,abc\n'], { type: 'text/csv' }), 'bad.csv');
    expect((await buyer.client.upload(`/api/units/${serial}/logs`, bad)).status).toBe(400);
    expect(UnitHistorySchema.parse((await buyer.client.get(`/api/units/${serial}`)).body).events.filter((e) => e.kind === 'log-uploaded')).toHaveLength(1);
    // Someone else's unit, or another's saved check: no.
    const stranger = await createCustomer(t);
    expect((await stranger.client.upload(`/api/units/${serial}/logs`, form)).status).toBe(404);
  });
});

describe('service reminders', () => {
  const mailsFor = (email: string) => one<{ n: number }>("SELECT count(*) AS n FROM mail_outbox WHERE kind = 'service-reminder' AND recipient = ?", email).n;

  it('remind a unit once when due, through the outbox with the booking link, a history line and a notice', async () => {
    const buyer = await createCustomer(t);
    const { cartridge } = ownParts();
    const number = await packedOrder(buyer, [{ partNumber: cartridge.partNumber, quantity: 1 }]);
    const serial = OrderDetailSchema.parse((await buyer.client.get(`/api/orders/${number}`)).body).lines[0]!.serials[0]!;
    // Sold two and a half years ago (the sale date moved back; the history is otherwise as packing wrote it).
    t.db.update(units).set({ createdAt: '2024-05-31T10:00:00.000Z' }).where(eq(units.serial, serial)).run();
    const unit = t.db.select().from(units).where(eq(units.serial, serial)).get()!;
    const sold = unit.createdAt.slice(0, 10);
    // Ball bearing, street use: every 24 months as seeded.
    const due = addMonths(sold, 24);
    expect(due).toBe('2026-05-31');
    const dayBefore = new Date(Date.parse(`${due}T00:00:00Z`) - 86_400_000);

    t.app.reminders.sendDue(dayBefore);
    expect(mailsFor(buyer.email)).toBe(0);

    t.app.reminders.sendDue(new Date(`${due}T09:00:00Z`));
    expect(mailsFor(buyer.email)).toBe(1);
    const mail = one<{ subject: string; text: string }>("SELECT subject, text FROM mail_outbox JOIN mail_bodies ON outbox_id = id WHERE kind = 'service-reminder' AND recipient = ?", buyer.email);
    expect(mail.subject).toContain(serial);
    expect(mail.text).toContain(`/service/new?serial=${serial}`);
    expect(t.db.select().from(serviceReminders).where(eq(serviceReminders.unitId, unit.id)).all()).toHaveLength(1);
    const history = UnitHistorySchema.parse((await buyer.client.get(`/api/units/${serial}`)).body);
    expect(history.events.map((e) => e.kind)).toEqual(['sold', 'reminder-sent']);
    const noticesPage = (await buyer.client.get('/api/notices')).body as { items: Array<{ kind: string; link: string }> };
    expect(noticesPage.items.find((n) => n.kind === 'service-due')?.link).toBe(`/units/${serial}`);

    // Never twice for the same due date, however often housekeeping runs.
    t.app.reminders.sendDue(new Date(`${due}T10:00:00Z`));
    t.app.reminders.sendDue(new Date(Date.parse(`${due}T00:00:00Z`) + 30 * 86_400_000));
    expect(mailsFor(buyer.email)).toBe(1);

    // A service on the Bench starts the interval again: not due until a full interval after it.
    t.app.units.addEvent(t.db, unit.id, { kind: 'shipped', summary: 'Back from the Bench', ref: 'SR-0001' });
    const next = UnitHistorySchema.parse((await buyer.client.get(`/api/units/${serial}`)).body).unit;
    expect(next.lastServiceAt).not.toBeNull();
    expect(next.nextServiceDue > due).toBe(true);
  });

  it('are kept per bearing and use, and only administrators change them', async () => {
    const list = ServiceIntervalsSchema.parse((await admin.get('/api/admin/service-intervals')).body);
    expect(list.items).toHaveLength(10);
    // Journal bearings in hard use a few times a season; ball bearings checked at the end of each season (common practice).
    expect(list.items.find((i) => i.bearing === 'journal' && i.application === 'drag')?.months).toBe(3);
    expect(list.items.find((i) => i.bearing === 'ball' && i.application === 'circuit')?.months).toBe(12);
    for (const c of [floor, workshop]) {
      expect((await c.get('/api/admin/service-intervals')).status).toBe(403);
      expect((await c.send('PUT', '/api/admin/service-intervals/journal/drag', { months: 2 })).status).toBe(403);
    }
    expect((await admin.send('PUT', '/api/admin/service-intervals/journal/drag', { months: 0 })).status).toBe(400);
    expect((await admin.send('PUT', '/api/admin/service-intervals/journal/rally', { months: 2 })).status).toBe(404);
    const set = await admin.send('PUT', '/api/admin/service-intervals/journal/drag', { months: 2 });
    expect(set.status, JSON.stringify(set.body)).toBe(200);
    expect(t.app.reminders.monthsFor(t.db, 'journal', 'drag')).toBe(2);
    expect((await admin.send('PUT', '/api/admin/service-intervals/journal/drag', { months: 3 })).status).toBe(200);
  });
});
