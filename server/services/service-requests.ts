import fs from 'node:fs';
import path from 'node:path';
import type Stripe from 'stripe';
import { and, count, desc, eq, inArray, ne, or, sql, type SQL } from 'drizzle-orm';
import type { SQLiteUpdateSetSource } from 'drizzle-orm/sqlite-core';
import type { Db } from '../db/client';
import {
  dealerAccounts,
  frames,
  partLinks,
  parts,
  serviceRequestEvents,
  serviceRequestLines,
  serviceRequestPhotos,
  serviceRequests,
  units,
  user,
} from '../db/schema';
import type { ServiceStatus } from '../../shared/allowed-values';
import { checkCredit, invoiceDueDate } from '../../shared/credit';
import { formatMoney } from '../../shared/format';
import { normalizePartNumber } from '../../shared/part-number';
import { normalizeSerial } from '../../shared/unit-serial';
import { trackingUrl, type TrackingUrlPatterns } from '../../shared/carriers';
import {
  balanceLimitPerPlaneGmm,
  balancePasses,
  BENCH_QUEUES,
  normalizeServiceReference,
  priceInspectionFee,
  priceQuote,
  rotorMassKg,
  serviceInvoiceNumber,
  serviceReference,
  SERVICE_SYMPTOM_KEYS,
  shaftPlayFlags,
  shaftPlayLimits,
  type BenchQueue,
} from '../../shared/service';
import {
  InspectionSchema,
  RebuildSchema,
  SERVICE_PAGE_SIZE,
  type BenchQueuePage,
  type BenchRequest,
  type Inspection,
  type Quote,
  type Rebuild,
  type ServiceBooking,
  type ServiceDecision,
  type ServiceInvoice,
  type ServiceLabel,
  type ServicePage,
  type ServiceRequestView,
  type ServiceShip,
} from '../../shared/schemas/service';
import { z } from 'zod';
import { code128Svg } from './barcodes';
import type { CurrentUser } from './current-user';
import { dealerOpenBalance } from './dealer-accounts';
import { ConflictError, InvalidError, NotAllowedError, NotFoundError, PaymentDeclinedError, PaymentServiceError } from './errors';
import { resolveScan as resolveCode } from './scan';
import type { Query } from './orders/order-reads';
import type { StockService } from './stock';
import type { UnitsService } from './units';
import type { StoredImage } from './uploads';

/** What the Bench tells the customer, in the transaction of the step (mail outbox and on-site notice). */
export interface ServiceNotifier {
  booked(q: Query, requestId: number): void;
  quoted(q: Query, requestId: number): void;
  decided(q: Query, requestId: number): void;
  shipped(q: Query, requestId: number, trackingLink: string | null): void;
}

export interface ServiceRates {
  labourRateCents: number;
  inspectionFeeCents: number;
  balancingCents: number;
  taxRatePct: number;
}

const now = sql<string>`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;
const STAFF = new Set(['workshop', 'admin']);
const SymptomsSchema = z.array(z.enum(SERVICE_SYMPTOM_KEYS)).catch([]);
const InspectionStored = InspectionSchema.extend({ axialPlayMm: z.number(), radialPlayMm: z.number() });

type RequestRow = typeof serviceRequests.$inferSelect;

/** Open open requests, newest first: a unit's serial finds the request it is on the Bench for. */
const OPEN_STATUSES: ServiceStatus[] = ['booked', 'received', 'inspected', 'quoted', 'approved', 'declined', 'rebuilt'];

/**
 * The Bench: service requests from booking in to shipping back with an invoice. Every step checks the request's
 * state, changes it in one transaction with the unit's history event, the request's timeline, any stock movement and
 * the message to the customer. Card money is taken at the customer's decision through the payment SDK (one
 * idempotency key per request, so a repeat never charges twice); account money goes on the dealer's statement.
 */
export function createServiceRequests(deps: {
  db: Db;
  stock: StockService;
  units: UnitsService;
  payments: Stripe;
  notify: ServiceNotifier;
  photosDir: string;
  rates: ServiceRates;
  trackingUrls: TrackingUrlPatterns;
}) {
  const { db, stock, units: unitsService, payments, notify, rates } = deps;

  const frameOf = (q: Query, code: string) => q.select().from(frames).where(eq(frames.code, code)).get();
  const nameOf = (q: Query, id: string | null) => (id ? (q.select({ name: user.name }).from(user).where(eq(user.id, id)).get()?.name ?? null) : null);

  function event(q: Query, r: Pick<RequestRow, 'id' | 'unitId' | 'reference'>, status: string, note: string, actor: string | null, unitKind?: Parameters<UnitsService['addEvent']>[2]['kind']) {
    q.insert(serviceRequestEvents).values({ requestId: r.id, status, note, actorUserId: actor }).run();
    if (unitKind) unitsService.addEvent(q, r.unitId, { kind: unitKind, summary: note, ref: r.reference, actorUserId: actor });
  }

  function row(q: Query, reference: string): RequestRow {
    const ref = normalizeServiceReference(reference);
    const r = ref ? q.select().from(serviceRequests).where(eq(serviceRequests.reference, ref)).get() : undefined;
    if (!r) throw new NotFoundError(`No service request ${reference.trim().slice(0, 20)}`);
    return r;
  }

  /** The buyer's own request (or their trade account's); staff see every one. */
  function visibleRow(q: Query, who: CurrentUser, reference: string): RequestRow {
    const r = row(q, reference);
    if (STAFF.has(who.role)) return r;
    const mine = r.userId === who.id || (who.dealer !== null && r.dealerAccountId === who.dealer.id);
    if (!mine) throw new NotFoundError(`No service request ${reference.trim().slice(0, 20)}`);
    return r;
  }

  function setStatus(q: Query, id: number, from: ServiceStatus[], to: ServiceStatus, extra: SQLiteUpdateSetSource<typeof serviceRequests> = {}) {
    const done = q
      .update(serviceRequests)
      .set({ ...extra, status: to, updatedAt: now })
      .where(and(eq(serviceRequests.id, id), inArray(serviceRequests.status, from)))
      .run();
    if (done.changes !== 1) throw new ConflictError('The request changed meanwhile: reload it and try again');
  }

  function requireStatus(r: RequestRow, allowed: ServiceStatus[], what: string) {
    if (!allowed.includes(r.status)) throw new ConflictError(`${r.reference} is ${r.status.replace('_', ' ')}: ${what}`);
  }

  function view(q: Query, r: RequestRow): ServiceRequestView {
    const unit = q.select({ serial: units.serial, origin: units.origin }).from(units).where(eq(units.id, r.unitId)).get();
    const frame = frameOf(q, r.frameCode);
    const owner = q.select({ name: user.name }).from(user).where(eq(user.id, r.userId)).get();
    const dealer = r.dealerAccountId ? q.select({ companyName: dealerAccounts.companyName }).from(dealerAccounts).where(eq(dealerAccounts.id, r.dealerAccountId)).get() : undefined;
    const lines = q.select().from(serviceRequestLines).where(eq(serviceRequestLines.requestId, r.id)).orderBy(serviceRequestLines.id).all();
    const photos = q.select({ name: serviceRequestPhotos.storedName, stage: serviceRequestPhotos.stage }).from(serviceRequestPhotos).where(eq(serviceRequestPhotos.requestId, r.id)).orderBy(serviceRequestPhotos.id).all();
    const timeline = q
      .select({ status: serviceRequestEvents.status, note: serviceRequestEvents.note, by: user.name, at: serviceRequestEvents.createdAt })
      .from(serviceRequestEvents)
      .leftJoin(user, eq(user.id, serviceRequestEvents.actorUserId))
      .where(eq(serviceRequestEvents.requestId, r.id))
      .orderBy(serviceRequestEvents.id)
      .all();
    const limits = shaftPlayLimits(frame?.inducerMm ?? 40, r.bearing);
    const found = r.inspection ? InspectionStored.safeParse(r.inspection) : null;
    const rebuilt = r.rebuild ? RebuildSchema.safeParse(r.rebuild) : null;
    const limitPerPlane = balanceLimitPerPlaneGmm(frame?.weightKg ?? 5, frame?.maxShaftRpm ?? 150_000);
    return {
      id: r.id,
      reference: r.reference,
      status: r.status,
      serial: unit?.serial ?? '',
      unitOrigin: unit?.origin ?? 'booked-in',
      frameCode: r.frameCode,
      frameName: frame?.name ?? r.frameCode,
      bearing: r.bearing,
      application: r.application,
      symptoms: SymptomsSchema.parse(r.symptoms),
      symptomNotes: r.symptomNotes,
      customer: owner?.name ?? '',
      companyName: dealer?.companyName ?? null,
      isDealer: r.dealerAccountId !== null,
      returnAddress: { name: r.returnName, line1: r.returnLine1, city: r.returnCity, postcode: r.returnPostcode },
      photos,
      receivedAt: r.receivedAt,
      receivedBy: nameOf(q, r.receivedBy),
      inspection:
        found?.success && r.inspectedAt
          ? { ...found.data, limits, ...shaftPlayFlags(found.data, limits), inspectedAt: r.inspectedAt, inspectedBy: nameOf(q, r.inspectedBy) ?? '' }
          : null,
      quote:
        r.quotedAt && r.totalCents !== null
          ? {
              lines: lines.map((l) => ({ partNumber: l.partNumber, title: l.title, quantity: l.quantity, retailUnitCents: l.retailUnitCents, unitCents: l.unitCents, lineCents: l.unitCents * l.quantity })),
              labourHours: (r.labourTenths ?? 0) / 10,
              labourRateCents: r.labourRateCents ?? 0,
              labourCents: r.labourCents ?? 0,
              balancingCents: r.balancingCents ?? 0,
              partsCents: r.partsCents ?? 0,
              discountCents: r.discountCents ?? 0,
              taxCents: r.taxCents ?? 0,
              totalCents: r.totalCents,
              notes: r.quoteNotes ?? '',
              quotedAt: r.quotedAt,
            }
          : null,
      inspectionFee: priceInspectionFee(r.inspectionFeeCents, rates.taxRatePct),
      decision: r.decision,
      decidedAt: r.decidedAt,
      paymentMethod: r.paymentMethod,
      paymentState: r.paymentState,
      purchaseOrder: r.purchaseOrder,
      chargeCents: r.chargeCents,
      rebuild:
        rebuilt?.success && r.rebuiltAt
          ? { ...rebuilt.data, limitPerPlaneGmm: limitPerPlane, balancePass: balancePasses(rebuilt.data.balance.after, limitPerPlane), rebuiltAt: r.rebuiltAt, rebuiltBy: nameOf(q, r.rebuiltBy) ?? '' }
          : null,
      shipment:
        r.carrier && r.trackingNumber && r.shippedAt
          ? { carrier: r.carrier, trackingNumber: r.trackingNumber, trackingUrl: trackingUrl(deps.trackingUrls, r.carrier, r.trackingNumber), shippedAt: r.shippedAt }
          : null,
      invoiceNumber: r.invoiceNumber,
      timeline,
      createdAt: r.createdAt,
    };
  }

  function dropPhotos(photos: StoredImage[]) {
    for (const p of photos) fs.rmSync(path.join(deps.photosDir, p.storedName), { force: true });
  }

  /** A buyer books a unit in: ours by serial, or a unit we register now with a serial of ours. */
  function book(who: CurrentUser, input: ServiceBooking, photos: StoredImage[]): ServiceRequestView {
    if (who.role !== 'customer' && who.role !== 'dealer') throw new NotAllowedError('Only buyers book units in for service');
    try {
      return db.transaction((tx) => {
        const frame = frameOf(tx, input.frameCode);
        if (!frame) throw new InvalidError(`No frame ${input.frameCode}`, { frameCode: ['choose the frame from the list'] });
        if (!frame.bearingOptions.includes(input.bearing)) throw new InvalidError(`The ${frame.name} is not made with a ${input.bearing} bearing`, { bearing: ['choose the bearing the unit has'] });
        const dealerAccountId = who.dealer?.status === 'approved' ? who.dealer.id : null;
        let unit;
        if (input.noSerial) {
          unit = unitsService.register(tx, { frameCode: frame.code, bearing: input.bearing, application: input.application, origin: 'booked-in', ownerUserId: who.id, dealerAccountId });
        } else {
          const serial = normalizeSerial(input.serial);
          unit = serial ? unitsService.bySerial(tx, serial) : null;
          if (!unit) {
            // A serial of ours we have no record of (sold before records were kept): it is taken as written.
            unit = unitsService.register(tx, { serial: input.serial, frameCode: frame.code, bearing: input.bearing, application: input.application, origin: 'booked-in', ownerUserId: who.id, dealerAccountId });
          } else if (unit.ownerUserId !== null && unit.ownerUserId !== who.id && (dealerAccountId === null || unit.dealerAccountId !== dealerAccountId)) {
            throw new ConflictError(`Unit ${unit.serial} is registered to another customer. Ask them to book it in, or call us.`);
          }
          const open = tx
            .select({ reference: serviceRequests.reference })
            .from(serviceRequests)
            .where(and(eq(serviceRequests.unitId, unit.id), inArray(serviceRequests.status, OPEN_STATUSES)))
            .get();
          if (open) throw new ConflictError(`Unit ${unit.serial} is already booked in as ${open.reference}`);
        }
        const id = tx.select({ next: sql<number>`coalesce(max(${serviceRequests.id}), 0) + 1` }).from(serviceRequests).get()?.next ?? 1;
        const reference = serviceReference(id);
        const created = tx
          .insert(serviceRequests)
          .values({
            id,
            reference,
            unitId: unit.id,
            userId: who.id,
            dealerAccountId,
            frameCode: frame.code,
            bearing: input.bearing,
            application: input.application,
            symptoms: input.symptoms,
            symptomNotes: input.symptomNotes,
            returnName: input.returnName,
            returnLine1: input.returnLine1,
            returnCity: input.returnCity,
            returnPostcode: input.returnPostcode,
            inspectionFeeCents: rates.inspectionFeeCents,
          })
          .returning()
          .get();
        if (photos.length > 0) {
          tx.insert(serviceRequestPhotos)
            .values(photos.map((p) => ({ requestId: id, stage: 'booking' as const, storedName: p.storedName, mimeType: p.mimeType, bytes: p.bytes })))
            .run();
        }
        if (input.noSerial) event(tx, created, 'registered', `Registered as ${unit.serial} when booked in`, who.id, 'registered');
        event(tx, created, 'booked', `Booked in for service as ${reference} by ${who.name}`, who.id, 'booked-in');
        notify.booked(tx, id);
        return view(tx, created);
      });
    } catch (err) {
      dropPhotos(photos);
      throw err;
    }
  }

  function page(where: SQL | undefined, pageNumber: number) {
    const total = db.select({ n: count() }).from(serviceRequests).where(where).get()?.n ?? 0;
    const last = Math.max(1, Math.ceil(total / SERVICE_PAGE_SIZE));
    const p = Math.min(Math.max(1, Math.trunc(pageNumber) || 1), last);
    const items = db
      .select({
        reference: serviceRequests.reference,
        status: serviceRequests.status,
        serial: units.serial,
        frameCode: serviceRequests.frameCode,
        customer: user.name,
        companyName: dealerAccounts.companyName,
        createdAt: serviceRequests.createdAt,
        updatedAt: serviceRequests.updatedAt,
      })
      .from(serviceRequests)
      .innerJoin(units, eq(units.id, serviceRequests.unitId))
      .innerJoin(user, eq(user.id, serviceRequests.userId))
      .leftJoin(dealerAccounts, eq(dealerAccounts.id, serviceRequests.dealerAccountId))
      .where(where)
      .orderBy(desc(serviceRequests.id))
      .limit(SERVICE_PAGE_SIZE)
      .offset((p - 1) * SERVICE_PAGE_SIZE)
      .all();
    return { items, total, page: p, pageSize: SERVICE_PAGE_SIZE };
  }

  function listOwn(who: CurrentUser, pageNumber = 1): ServicePage {
    const mine = who.dealer?.status === 'approved' ? or(eq(serviceRequests.userId, who.id), eq(serviceRequests.dealerAccountId, who.dealer.id)) : eq(serviceRequests.userId, who.id);
    return page(mine, pageNumber);
  }

  function queue(which: BenchQueue, pageNumber = 1): BenchQueuePage {
    const statuses: readonly ServiceStatus[] = BENCH_QUEUES[which].statuses;
    const byStatus = db.select({ status: serviceRequests.status, n: count() }).from(serviceRequests).groupBy(serviceRequests.status).all();
    const counts = Object.fromEntries(
      Object.entries(BENCH_QUEUES).map(([k, v]) => [k, byStatus.filter((s) => (v.statuses as readonly string[]).includes(s.status)).reduce((a, s) => a + s.n, 0)]),
    );
    return { ...page(inArray(serviceRequests.status, [...statuses]), pageNumber), queue: which, counts };
  }

  function get(who: CurrentUser, reference: string): ServiceRequestView {
    return view(db, visibleRow(db, who, reference));
  }

  /** Rebuild kits that go with the unit: parts in `rebuild-kits` linked to its own part or to its frame's cartridges. */
  function suggestedKits(r: RequestRow): BenchRequest['suggestedKits'] {
    const unit = db.select({ partId: units.partId }).from(units).where(eq(units.id, r.unitId)).get();
    const cartridges = db
      .select({ id: parts.id })
      .from(parts)
      .where(and(eq(parts.frameCode, r.frameCode), eq(parts.category, 'cartridges'), ne(parts.status, 'superseded')))
      .all()
      .map((p) => p.id);
    const ids = [...new Set([...(unit?.partId ? [unit.partId] : []), ...cartridges])];
    if (ids.length === 0) return [];
    const linked = db
      .select({ a: partLinks.partId, b: partLinks.relatedPartId })
      .from(partLinks)
      .where(or(inArray(partLinks.partId, ids), inArray(partLinks.relatedPartId, ids)))
      .all();
    const others = [...new Set(linked.flatMap((l) => [l.a, l.b]).filter((id) => !ids.includes(id)))];
    if (others.length === 0) return [];
    return db
      .select({ partNumber: parts.partNumber, title: parts.title, priceCents: parts.priceCents, available: parts.available })
      .from(parts)
      .where(and(inArray(parts.id, others), eq(parts.category, 'rebuild-kits'), eq(parts.status, 'active')))
      .orderBy(parts.partNumber)
      .limit(10)
      .all();
  }

  function forBench(reference: string): BenchRequest {
    const r = row(db, reference);
    const frame = frameOf(db, r.frameCode);
    const limits = shaftPlayLimits(frame?.inducerMm ?? 40, r.bearing);
    return {
      request: view(db, r),
      limits: {
        ...limits,
        balancePerPlaneGmm: balanceLimitPerPlaneGmm(frame?.weightKg ?? 5, frame?.maxShaftRpm ?? 150_000),
        maxShaftRpm: frame?.maxShaftRpm ?? 0,
        rotorMassKg: rotorMassKg(frame?.weightKg ?? 5),
      },
      suggestedKits: suggestedKits(r),
      labourRateCents: rates.labourRateCents,
      balancingCents: rates.balancingCents,
    };
  }

  /**
   * What a scan on the Bench names: a request number (`SR-7001`, `sr7001`, `SR 7001`) or a unit serial (its open
   * request, else its latest). Kept in one function so a shared scan resolver can call it.
   */
  /** The request a Bench scan names: its label's number, or the serial plate of a unit booked in (its open request first). */
  function resolveScan(code: string): RequestRow {
    const found = resolveCode(db, code, ['service', 'unit']);
    if (found.kind === 'service') return db.select().from(serviceRequests).where(eq(serviceRequests.id, found.service.id)).get()!;
    const r = db
      .select()
      .from(serviceRequests)
      .where(eq(serviceRequests.unitId, found.unit.id))
      .orderBy(sql`${serviceRequests.status} = 'shipped'`, desc(serviceRequests.id))
      .get();
    if (!r) throw new NotFoundError(`Unit ${found.unit.serial} is not booked in: ask the customer to book it in first`);
    return r;
  }

  /** A scan receives a unit that was booked and waits; any other scan opens its request. */
  function scan(who: CurrentUser, code: string) {
    const found = resolveScan(code);
    if (found.status === 'booked') {
      receive(who, found.reference);
      return { action: 'received' as const, reference: found.reference, status: 'received' as const, message: `${found.reference} received` };
    }
    return { action: 'opened' as const, reference: found.reference, status: found.status, message: `${found.reference} is ${found.status}` };
  }

  function receive(who: CurrentUser, reference: string): ServiceRequestView {
    return db.transaction((tx) => {
      const r = row(tx, reference);
      requireStatus(r, ['booked'], 'only a booked unit is received');
      setStatus(tx, r.id, ['booked'], 'received', { receivedAt: now, receivedBy: who.id });
      event(tx, r, 'received', `Received at the Bench by ${who.name}`, who.id, 'received');
      return view(tx, row(tx, r.reference));
    });
  }

  function inspect(who: CurrentUser, reference: string, input: Inspection, photos: StoredImage[]): ServiceRequestView {
    try {
      return db.transaction((tx) => {
        const r = row(tx, reference);
        requireStatus(r, ['received', 'inspected'], 'inspect it once it is received and before it is quoted');
        const frame = frameOf(tx, r.frameCode);
        const limits = shaftPlayLimits(frame?.inducerMm ?? 40, r.bearing);
        const flags = shaftPlayFlags(input, limits);
        setStatus(tx, r.id, ['received', 'inspected'], 'inspected', { inspection: input, inspectedAt: now, inspectedBy: who.id });
        if (photos.length > 0) {
          tx.insert(serviceRequestPhotos)
            .values(photos.map((p) => ({ requestId: r.id, stage: 'inspection' as const, storedName: p.storedName, mimeType: p.mimeType, bytes: p.bytes })))
            .run();
        }
        const over = [flags.axialOver && `axial play ${input.axialPlayMm} mm over ${limits.axial}`, flags.radialOver && `radial play ${input.radialPlayMm} mm over ${limits.radial}`].filter(Boolean);
        const note = `Inspected: ${over.length > 0 ? over.join(', ') : 'shaft play within limits'}; compressor wheel ${input.compressorWheel}, turbine wheel ${input.turbineWheel}${input.housingCracks ? ', housing cracked' : ''}`;
        event(tx, r, 'inspected', note, who.id, 'inspected');
        return view(tx, row(tx, r.reference));
      });
    } catch (err) {
      dropPhotos(photos);
      throw err;
    }
  }

  function tierOf(q: Query, dealerAccountId: number | null) {
    if (dealerAccountId === null) return null;
    const d = q.select({ tier: dealerAccounts.tier, status: dealerAccounts.status }).from(dealerAccounts).where(eq(dealerAccounts.id, dealerAccountId)).get();
    return d?.status === 'approved' ? d.tier : null;
  }

  function quote(who: CurrentUser, reference: string, input: Quote): ServiceRequestView {
    return db.transaction((tx) => {
      const r = row(tx, reference);
      requireStatus(r, ['inspected'], 'quote it after the inspection, before the customer decides');
      const found = input.lines.map((l, i) => {
        const p = tx
          .select({ id: parts.id, partNumber: parts.partNumber, title: parts.title, priceCents: parts.priceCents, status: parts.status })
          .from(parts)
          .where(eq(parts.normalizedNumber, normalizePartNumber(l.partNumber)))
          .get();
        if (!p || p.status !== 'active') throw new InvalidError(`${l.partNumber} is not a part we sell`, { [`lines.${i}.partNumber`]: ['choose a part from the catalogue'] });
        return { ...l, part: p };
      });
      const tenths = Math.round(input.labourHours * 10);
      const totals = priceQuote({
        lines: found.map((l) => ({ partNumber: l.part.partNumber, quantity: l.quantity, retailUnitCents: l.part.priceCents })),
        labourHours: tenths / 10,
        labourRateCents: rates.labourRateCents,
        balancingCents: input.balancing ? rates.balancingCents : 0,
        tier: tierOf(tx, r.dealerAccountId),
        taxRatePct: rates.taxRatePct,
      });
      tx.insert(serviceRequestLines)
        .values(found.map((l, i) => ({ requestId: r.id, partId: l.part.id, partNumber: l.part.partNumber, title: l.part.title, quantity: l.quantity, retailUnitCents: l.part.priceCents, unitCents: totals.lines[i]!.unitCents })))
        .run();
      setStatus(tx, r.id, ['inspected'], 'quoted', {
        labourTenths: tenths,
        labourRateCents: rates.labourRateCents,
        labourCents: totals.labourCents,
        balancingCents: totals.balancingCents,
        partsCents: totals.partsCents,
        discountCents: totals.discountCents,
        taxCents: totals.taxCents,
        totalCents: totals.totalCents,
        quoteNotes: input.notes,
        quotedAt: now,
        quotedBy: who.id,
      });
      event(tx, r, 'quoted', `Quoted ${formatMoney(totals.totalCents)}: ${found.length} part line${found.length === 1 ? '' : 's'}, ${tenths / 10} h labour${input.balancing ? ', balancing' : ''}`, who.id, 'quoted');
      notify.quoted(tx, r.id);
      return view(tx, row(tx, r.reference));
    });
  }

  /** Approved account service work not yet invoiced, and service invoices on account not yet paid. */
  /**
   * The customer approves the quote (paying its total) or declines it (paying the inspection fee with tax). A card is
   * charged now, created and confirmed in one call with one idempotency key per request and decision; an approved
   * dealer may put it on account within the credit limit.
   */
  async function decide(who: CurrentUser, reference: string, input: ServiceDecision): Promise<ServiceRequestView> {
    const r = visibleRow(db, who, reference);
    if (STAFF.has(who.role)) throw new NotAllowedError('The customer approves or declines their own quote');
    if (r.status !== 'quoted' || r.totalCents === null) {
      throw new ConflictError(r.decidedAt ? `${r.reference} was already ${r.status === 'declined' ? 'declined' : 'approved'}` : `${r.reference} has no quote to decide on yet`);
    }
    const approve = input.decision === 'approve';
    const amount = approve ? r.totalCents : priceInspectionFee(r.inspectionFeeCents, rates.taxRatePct).totalCents;
    let intentId: string | null = null;
    if (input.method === 'account') {
      const dealer = who.dealer;
      if (!dealer || dealer.status !== 'approved' || r.dealerAccountId !== dealer.id) throw new NotAllowedError('Only an approved trade account puts service work on account');
    } else if (amount > 0) {
      try {
        const intent = await payments.paymentIntents.create(
          {
            amount,
            currency: 'usd',
            payment_method: input.paymentMethod,
            description: `Spoolyard service ${r.reference}${approve ? '' : ' inspection fee'}`,
            metadata: { service_reference: r.reference },
            receipt_email: who.email,
            confirm: true,
          },
          { idempotencyKey: `service-${r.reference}-${input.decision}-${amount}-${input.paymentMethod}`, timeout: 10_000, maxNetworkRetries: 1 },
        );
        if (intent.status !== 'succeeded') {
          // A card that asks for an authentication step: nothing is taken; the payment is cancelled at once.
          await payments.paymentIntents.cancel(intent.id, {}, { idempotencyKey: `service-${r.reference}-${intent.id}-cancel` }).catch(() => undefined);
          throw new PaymentDeclinedError('This card asks for an extra authentication step, which service payments do not take yet. Nothing was charged: use another card.');
        }
        intentId = intent.id;
      } catch (err) {
        if (err instanceof PaymentDeclinedError) throw err;
        const e = err as { type?: string; message?: string };
        if (e.type === 'StripeCardError') throw new PaymentDeclinedError(`The card was declined: ${e.message ?? 'no reason given'}. Nothing was charged.`);
        console.warn(`payments: the service payment for ${r.reference} failed:`, e.message);
        throw new PaymentServiceError('The card provider did not answer. Try again in a moment: you will not be charged twice.');
      }
    }
    try {
      return record(who, r, input, amount, intentId);
    } catch (err) {
      // The card was charged but the decision could not be recorded (decided meanwhile by another request, say): the
      // charge is given back, once, unless it is the very payment that decision recorded.
      const stored = row(db, r.reference).paymentIntentId;
      if (intentId && stored !== intentId) {
        await payments.refunds
          .create({ payment_intent: intentId, reason: 'duplicate', metadata: { service_reference: r.reference } }, { idempotencyKey: `service-${intentId}-refund` })
          .catch((e: unknown) => console.warn(`payments: could not refund ${intentId} for ${r.reference}:`, (e as Error).message));
      }
      throw err;
    }
  }

  function record(who: CurrentUser, r: RequestRow, input: ServiceDecision, amount: number, intentId: string | null): ServiceRequestView {
    const approve = input.decision === 'approve';
    return db.transaction((tx) => {
      const fresh = row(tx, r.reference);
      if (fresh.status !== 'quoted') throw new ConflictError(`${r.reference} was already decided`);
      if (input.method === 'account' && who.dealer) {
        const limit = tx.select({ creditLimitCents: dealerAccounts.creditLimitCents }).from(dealerAccounts).where(eq(dealerAccounts.id, who.dealer.id)).get()?.creditLimitCents ?? 0;
        const credit = checkCredit({ openBalanceCents: dealerOpenBalance(tx, who.dealer.id), orderCents: amount, creditLimitCents: limit });
        if (!credit.fits) {
          const what = approve ? 'repair' : 'inspection fee';
          throw new ConflictError(credit.message.replace('This order', `This ${what}`).replace('this order', `this ${what}`));
        }
      }
      setStatus(tx, r.id, ['quoted'], approve ? 'approved' : 'declined', {
        decidedAt: now,
        decision: input.decision,
        paymentMethod: input.method,
        paymentState: input.method === 'card' ? 'paid' : 'on_account',
        paymentIntentId: intentId,
        purchaseOrder: input.method === 'account' ? input.purchaseOrder : null,
        paymentTermsDays: input.method === 'account' ? (who.dealer?.paymentTermsDays ?? null) : null,
        chargeCents: amount,
      });
      const how = input.method === 'card' ? `paid ${formatMoney(amount)} by card` : `${formatMoney(amount)} on account, PO ${input.purchaseOrder}`;
      event(tx, r, approve ? 'approved' : 'declined', approve ? `Quote approved by ${who.name}: ${how}` : `Quote declined by ${who.name}: inspection fee ${how}; the unit goes back unrepaired`, who.id, approve ? 'approved' : 'declined');
      notify.decided(tx, r.id);
      return view(tx, row(tx, r.reference));
    });
  }

  /** The quoted parts leave stock through the ledger; the balance readings and the test record are kept. */
  function rebuild(who: CurrentUser, reference: string, input: Rebuild): ServiceRequestView {
    return db.transaction((tx) => {
      const r = row(tx, reference);
      requireStatus(r, ['approved'], r.status === 'quoted' ? 'the customer has not approved the quote yet' : 'only an approved request is rebuilt');
      const frame = frameOf(tx, r.frameCode);
      const limit = balanceLimitPerPlaneGmm(frame?.weightKg ?? 5, frame?.maxShaftRpm ?? 150_000);
      const balanced = balancePasses(input.balance.after, limit);
      if (!balanced) {
        throw new InvalidError(`Residual unbalance after balancing must be at most ${limit} g·mm per plane: balance again before recording the rebuild`, {
          'balance.after': [`at most ${limit} g·mm on each plane`],
        });
      }
      if (input.test.result !== 'pass' || input.test.leakCheck !== 'pass') {
        throw new InvalidError('A unit that fails its test or leak check is not recorded as rebuilt: put it right and test again', { 'test.result': ['record a passed test'] });
      }
      const lines = tx.select().from(serviceRequestLines).where(eq(serviceRequestLines.requestId, r.id)).all();
      const short: string[] = [];
      for (const l of lines) if (stock.available(l.partId) < l.quantity) short.push(`${l.partNumber} (${stock.available(l.partId)} free, ${l.quantity} needed)`);
      if (short.length > 0) throw new ConflictError(`Not enough free stock to rebuild: ${short.join(', ')}. Book the parts in first.`);
      const taken = lines.map((l) => ({ l, bins: stock.consumeForWorkshop(l.partId, l.quantity, `${r.reference} rebuild`) }));
      setStatus(tx, r.id, ['approved'], 'rebuilt', { rebuild: input, rebuiltAt: now, rebuiltBy: who.id });
      const fitted = taken.map((t) => `${t.l.quantity} × ${t.l.partNumber} from ${t.bins.map((b) => b.binCode).join(', ')}`).join('; ');
      event(tx, r, 'rebuilt', `Rebuilt by ${who.name}: ${fitted}`, who.id, 'rebuilt');
      const b = input.balance;
      event(
        tx,
        r,
        'tested',
        `Balanced at ${b.checkSpeedRpm} rpm: ${b.before.compressorGmm}/${b.before.turbineGmm} → ${b.after.compressorGmm}/${b.after.turbineGmm} g·mm (limit ${limit} per plane, pass); oil ${input.test.oilPressureKpa} kPa, leak check ${input.test.leakCheck}, end float ${input.test.endFloatMm} mm, test ${input.test.result}`,
        who.id,
        'tested',
      );
      return view(tx, row(tx, r.reference));
    });
  }

  /** Ships the unit back: the invoice is issued now (card: paid; account: on the dealer's statement). */
  function ship(who: CurrentUser, reference: string, input: ServiceShip): ServiceRequestView {
    return db.transaction((tx) => {
      const r = row(tx, reference);
      requireStatus(r, ['rebuilt', 'declined'], 'ship it once it is rebuilt, or declined');
      const invoiceNumber = r.chargeCents > 0 ? serviceInvoiceNumber(r.id) : null;
      setStatus(tx, r.id, ['rebuilt', 'declined'], 'shipped', { carrier: input.carrier, trackingNumber: input.trackingNumber, shippedAt: now, shippedBy: who.id, invoiceNumber });
      const link = trackingUrl(deps.trackingUrls, input.carrier, input.trackingNumber);
      event(
        tx,
        r,
        'shipped',
        `Shipped back ${r.status === 'declined' ? 'unrepaired ' : ''}with ${input.carrier} ${input.trackingNumber}${invoiceNumber ? `; invoice ${invoiceNumber} ${r.paymentState === 'paid' ? 'paid by card' : 'on account'}` : ''}`,
        who.id,
        'shipped',
      );
      notify.shipped(tx, r.id, link);
      return view(tx, row(tx, r.reference));
    });
  }

  async function label(who: CurrentUser, reference: string): Promise<ServiceLabel> {
    const r = visibleRow(db, who, reference);
    if (r.status !== 'booked') throw new ConflictError(`${r.reference} has already arrived at the Bench: it needs no label`);
    const v = view(db, r);
    const frame = frameOf(db, r.frameCode);
    return { reference: r.reference, serial: v.serial, frameName: v.frameName, weightKg: frame?.weightKg ?? 0, from: v.returnAddress, barcodeSvg: await code128Svg(r.reference), createdAt: r.createdAt };
  }

  function invoice(who: CurrentUser, reference: string): ServiceInvoice {
    const r = visibleRow(db, who, reference);
    if (!r.invoiceNumber || !r.paymentMethod || !r.shippedAt) throw new ConflictError(`${r.reference} has no invoice yet: it is issued when the unit ships back`);
    const v = view(db, r);
    const approved = r.decision === 'approve';
    const fee = priceInspectionFee(r.inspectionFeeCents, rates.taxRatePct);
    const lines: ServiceInvoice['lines'] = approved
      ? [
          ...(v.quote?.lines ?? []).map((l) => ({ description: `${l.partNumber} ${l.title}`, quantity: l.quantity, unitCents: l.unitCents, amountCents: l.lineCents })),
          { description: `Labour, ${v.quote?.labourHours ?? 0} h at ${formatMoney(r.labourRateCents ?? 0)}/h`, quantity: v.quote?.labourHours ?? 0, unitCents: r.labourRateCents ?? 0, amountCents: r.labourCents ?? 0 },
          ...((r.balancingCents ?? 0) > 0 ? [{ description: 'Balancing of the rotating assembly', quantity: 1, unitCents: r.balancingCents ?? 0, amountCents: r.balancingCents ?? 0 }] : []),
        ]
      : [{ description: 'Inspection fee (quote declined; the unit returned unrepaired)', quantity: 1, unitCents: fee.feeCents, amountCents: fee.feeCents }];
    return {
      invoiceNumber: r.invoiceNumber,
      reference: r.reference,
      serial: v.serial,
      date: r.shippedAt.slice(0, 10),
      dueDate: r.paymentMethod === 'account' ? invoiceDueDate(r.shippedAt, r.paymentTermsDays) : null,
      customer: v.customer,
      companyName: v.companyName,
      address: v.returnAddress,
      kind: approved ? 'repair' : 'inspection-fee',
      lines,
      discountCents: approved ? (r.discountCents ?? 0) : 0,
      taxCents: approved ? (r.taxCents ?? 0) : fee.taxCents,
      totalCents: r.chargeCents,
      paymentMethod: r.paymentMethod,
      paymentState: r.paymentState,
      purchaseOrder: r.purchaseOrder,
    };
  }

  function photoAllowed(who: CurrentUser, storedName: string) {
    const found = db
      .select({ userId: serviceRequests.userId, dealerAccountId: serviceRequests.dealerAccountId })
      .from(serviceRequestPhotos)
      .innerJoin(serviceRequests, eq(serviceRequests.id, serviceRequestPhotos.requestId))
      .where(eq(serviceRequestPhotos.storedName, storedName))
      .get();
    if (!found) return false;
    return STAFF.has(who.role) || found.userId === who.id || (who.dealer !== null && found.dealerAccountId === who.dealer.id);
  }

  return { book, listOwn, queue, get, forBench, resolveScan, scan, receive, inspect, quote, decide, rebuild, ship, label, invoice, photoAllowed };
}

export type ServiceRequests = ReturnType<typeof createServiceRequests>;
