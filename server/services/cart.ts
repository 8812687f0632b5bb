import crypto from 'node:crypto';
import { and, count, eq, sql, type SQL } from 'drizzle-orm';
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core';
import type { Db } from '../db/client';
import { CART_LINE_COMPRESSOR_CLOCK_KEY, CART_LINE_TURBINE_CLOCK_KEY, cartLines, carts, parts, partSpecs, savedFitments } from '../db/schema';
import { parse } from 'csv-parse/sync';
import { ConflictError, InvalidError, NotAllowedError, NotFoundError, TooLargeError } from './errors';
import type { CurrentUser } from './current-user';
import { normalizePartNumber } from '../../shared/part-number';
import { DEALER_TIERS, priceOrder, type Buyer, type DeliveryZone } from '../../shared/pricing';
import { CART_LINES_MAX, CSV_MAX_ROWS, QUANTITY_MAX, type CartView, type OrderRowResult } from '../../shared/schemas/orders';
import { clockingOf, orientationFrom, orientationProblem, takesOrientation, type Orientation } from '../../shared/exploded-view';
import type { SearchService } from './search';

export type CartOwner = { userId: string } | { guestToken: string };

export function buyerOf(user: CurrentUser | null): Buyer {
  const dealer = user?.role === 'dealer' && user.dealer?.status === 'approved' && user.dealer.tier ? user.dealer : null;
  return dealer ? { kind: 'dealer', tier: dealer.tier! } : { kind: 'retail' };
}

const partColumns = {
  id: parts.id,
  partNumber: parts.partNumber,
  title: parts.title,
  category: parts.category,
  frameCode: parts.frameCode,
  status: parts.status,
  supersededBy: parts.supersededBy,
  condition: parts.condition,
  priceCents: parts.priceCents,
  coreDepositCents: parts.coreDepositCents,
  weightGrams: parts.weightGrams,
  flangePattern: partSpecs.flangePattern,
  mounting: partSpecs.mounting,
  photo: sql<string | null>`json_extract(${parts.images}, '$[0]')`,
  available: parts.available,
};

/** The value an upsert tried to insert into a column. */
const excluded = (column: SQLiteColumn) => sql.raw(`excluded.${column.name}`);

/**
 * Long lists are checked in slices of at most this many milliseconds, and the slices of every list being checked take
 * turns: one slice per turn of the event loop, whoever sent it, with other requests (the health check among them)
 * answered between turns. So eight lists checked at once hold a waiting request for about one slice, not eight.
 */
const SLICE_MS = 2;
/** Lists this short are checked at once: they cost less than a slice. */
const SHORT_LIST_ROWS = 20;
let lastTurn: Promise<void> = Promise.resolve();
function nextTurn(): Promise<void> {
  lastTurn = lastTurn.then(() => new Promise<void>((resolve) => setImmediate(resolve)));
  return lastTurn;
}

const MATCHING = new Set(['cartridges', 'compressor-housings', 'turbine-housings', 'gaskets-fittings', 'turbochargers']);

/** Warnings for lines that will not bolt together: housings and cartridges of different frames, or flanges that differ. */
export function compatibilityWarnings(lines: Array<{ lineId: number; partNumber: string; category: string; frameCode: string | null; flangePattern: string | null }>) {
  const warnings: Array<{ lineId: number; message: string }> = [];
  const framed = lines.filter((l) => MATCHING.has(l.category) && l.frameCode && l.category !== 'gaskets-fittings');
  const core = framed.find((l) => l.category === 'cartridges') ?? framed.find((l) => l.category === 'turbochargers');
  for (const l of framed) {
    const other = core && core !== l ? core : framed.find((o) => o !== l && o.frameCode !== l.frameCode);
    if (other && other.frameCode !== l.frameCode && (l.category.endsWith('housings') || l.category === 'cartridges')) {
      warnings.push({ lineId: l.lineId, message: `${l.partNumber} is for frame ${l.frameCode}, but ${other.partNumber} in your cart is frame ${other.frameCode}: they do not fit together.` });
    }
  }
  const turbineFlanges = new Set(lines.filter((l) => (l.category === 'turbine-housings' || l.category === 'turbochargers') && l.flangePattern).map((l) => l.flangePattern));
  for (const g of lines.filter((l) => l.category === 'gaskets-fittings' && l.flangePattern)) {
    if (turbineFlanges.size > 0 && !turbineFlanges.has(g.flangePattern)) {
      warnings.push({ lineId: g.lineId, message: `${g.partNumber} is for a ${g.flangePattern} flange, but the turbine flange in your cart is ${[...turbineFlanges].join(' / ')}.` });
    }
  }
  return warnings;
}

/**
 * The clock positions a line is stored with: a complete unit is built to the orientation asked for, or its frame's
 * standard one (quick order, stock lists, parts lists and a guest cart come in that way); any other part has none,
 * and asking for one on it is refused.
 */
export function lineOrientation(part: { partNumber: string; category: string; frameCode: string | null; flangePattern: string | null }, asked: Orientation | undefined) {
  const frame = part.frameCode ? { code: part.frameCode, flangePattern: part.flangePattern ?? '' } : null;
  if (asked) {
    const problem = orientationProblem(part, frame, asked);
    if (problem) throw new InvalidError(problem, { orientation: [problem] });
  }
  const chosen = asked ?? (takesOrientation(part.category) && frame ? clockingOf(frame).standard : null);
  return { compressorOutletClock: chosen?.compressorOutlet ?? null, turbineInletClock: chosen?.turbineInlet ?? null };
}

export function createCartService(db: Db, search: SearchService, config: { taxRatePct: number }) {
  // The reads every cart request makes are built and prepared once (Drizzle prepared queries with placeholders).
  const $ = sql.placeholder;
  const partQuery = (where: SQL) => db.select(partColumns).from(parts).leftJoin(partSpecs, eq(partSpecs.partId, parts.id)).where(where).prepare();
  const partByNumberQuery = partQuery(eq(parts.normalizedNumber, $('number')));
  const partByIdQuery = partQuery(eq(parts.id, $('id')));
  const cartByUserQuery = db.select({ id: carts.id, zone: carts.deliveryZone }).from(carts).where(eq(carts.userId, $('userId'))).prepare();
  const cartByGuestQuery = db.select({ id: carts.id, zone: carts.deliveryZone }).from(carts).where(eq(carts.guestToken, $('guestToken'))).prepare();
  const linesQuery = db
    .select({
      lineId: cartLines.id,
      quantity: cartLines.quantity,
      allowBackorder: cartLines.allowBackorder,
      fitmentId: cartLines.fitmentId,
      fitmentName: savedFitments.name,
      fitmentSummary: savedFitments.summary,
      compressorOutletClock: cartLines.compressorOutletClock,
      turbineInletClock: cartLines.turbineInletClock,
      ...partColumns,
    })
    .from(cartLines)
    .innerJoin(parts, eq(parts.id, cartLines.partId))
    .leftJoin(partSpecs, eq(partSpecs.partId, parts.id))
    .leftJoin(savedFitments, eq(savedFitments.id, cartLines.fitmentId))
    .where(eq(cartLines.cartId, $('cartId')))
    .orderBy(cartLines.id)
    .prepare();
  const partByNumber = (number: string) => partByNumberQuery.get({ number });
  const partById = (id: number) => partByIdQuery.get({ id });
  const cartByUser = (userId: string) => cartByUserQuery.get({ userId });
  const cartByGuest = (guestToken: string) => cartByGuestQuery.get({ guestToken });
  const linesOf = (cartId: number) => linesQuery.all({ cartId });

  const upsertLineQuery = db
    .insert(cartLines)
    .values({
      cartId: $('cartId'),
      partId: $('partId'),
      quantity: $('quantity'),
      fitmentId: $('fitmentId'),
      allowBackorder: $('allowBackorder'),
      compressorOutletClock: $('compressorOutletClock'),
      turbineInletClock: $('turbineInletClock'),
    })
    .onConflictDoUpdate({
      // The unique index's own expressions: the same part in another orientation is another line.
      target: [cartLines.cartId, cartLines.partId, CART_LINE_COMPRESSOR_CLOCK_KEY, CART_LINE_TURBINE_CLOCK_KEY],
      set: {
        quantity: sql`min(${QUANTITY_MAX}, ${cartLines.quantity} + ${excluded(cartLines.quantity)})`,
        fitmentId: sql`COALESCE(${excluded(cartLines.fitmentId)}, ${cartLines.fitmentId})`,
        allowBackorder: sql`max(${cartLines.allowBackorder}, ${excluded(cartLines.allowBackorder)})`,
      },
    })
    .prepare();
  type LineValues = Pick<typeof cartLines.$inferInsert, 'cartId' | 'partId' | 'quantity' | 'fitmentId' | 'allowBackorder' | 'compressorOutletClock' | 'turbineInletClock'>;
  const upsertLine = (line: LineValues) => upsertLineQuery.run(line);
  const lineCountQuery = db.select({ n: count() }).from(cartLines).where(eq(cartLines.cartId, $('cartId'))).prepare();
  const touchCartQuery = db.update(carts).set({ updatedAt: sql`strftime('%Y-%m-%dT%H:%M:%fZ','now')` }).where(eq(carts.id, $('cartId'))).prepare();
  const lineOf = (lineId: number, cartId: number) =>
    db
      .select({ id: cartLines.id })
      .from(cartLines)
      .where(and(eq(cartLines.id, lineId), eq(cartLines.cartId, cartId)))
      .get();
  const fitmentOf = (fitmentId: number, userId: string) =>
    db
      .select({ id: savedFitments.id })
      .from(savedFitments)
      .where(and(eq(savedFitments.id, fitmentId), eq(savedFitments.userId, userId)))
      .get();

  const cartRow = (owner: CartOwner) => ('userId' in owner ? cartByUser(owner.userId) : cartByGuest(owner.guestToken));

  function cartId(owner: CartOwner, create: boolean): number | null {
    const found = cartRow(owner);
    if (found) return found.id;
    if (!create) return null;
    const row = db
      .insert(carts)
      .values({ userId: 'userId' in owner ? owner.userId : null, guestToken: 'guestToken' in owner ? owner.guestToken : null, deliveryZone: 'national' })
      .returning({ id: carts.id })
      .get();
    return row.id;
  }

  /** Resolves a typed number to the part sold today, following supersessions. */
  function resolvePart(typed: string) {
    // A number the catalogue does not hold may still name one part exactly, as search resolves it: a
    // cross-reference or an earlier number of that part.
    let part = partByNumber(normalizePartNumber(typed));
    let namedAs: string | null = null;
    if (!part) {
      const named = search.exactParts(typed);
      part = named.length === 1 ? partById(named[0]!) : undefined;
      namedAs = part ? typed : null;
    }
    if (!part) return null;
    let replacedFrom: string | null = null;
    for (let hops = 0; part.status === 'superseded' && part.supersededBy && hops < 5; hops++) {
      const next = partByNumber(normalizePartNumber(part.supersededBy));
      if (!next) break;
      replacedFrom ??= part.partNumber;
      part = next;
    }
    return { part, replacedFrom, namedAs };
  }

  /** A few numbers close to one that matched nothing: bounded index look-ups, never a full search. */
  function suggestionsFor(typed: string) {
    return search.suggest(typed, 3).flatMap((id) => {
      const p = partById(id);
      return p && p.status !== 'superseded' ? [{ partNumber: p.partNumber, title: p.title }] : [];
    });
  }

  /** Checks rows of part number + quantity as a person typed them (quick order, stock-list upload). */
  /**
   * Reads a quick-order file: part number and quantity columns, found by a header when there is one (any heading
   * with "part", any starting with "q"), else the first two columns; then checks each row as the pad does.
   */
  async function readOrderFile(text: string, buyer: Buyer): Promise<OrderRowResult[]> {
    let records: string[][];
    try {
      records = parse(text.replace(/^\uFEFF/, ''), { skip_empty_lines: true, relax_column_count: true, trim: true }) as string[][];
    } catch {
      throw new InvalidError('The file could not be read as CSV', { file: ['the file could not be read as CSV'] });
    }
    const header = records[0]?.map((h) => h.toLowerCase().replace(/[^a-z]/g, '')) ?? [];
    const hasHeader = header.some((h) => h.includes('part')) || header.some((h) => h.startsWith('q'));
    const pnCol = hasHeader ? Math.max(0, header.findIndex((h) => h.includes('part'))) : 0;
    const qtyCol = hasHeader ? Math.max(0, header.findIndex((h) => h.startsWith('q'))) : 1;
    const body = hasHeader ? records.slice(1) : records;
    if (body.length === 0) throw new InvalidError('The file has no rows', { file: ['the file has no rows'] });
    if (body.length > CSV_MAX_ROWS) throw new TooLargeError(`At most ${CSV_MAX_ROWS} rows per file; this one has ${body.length}`);
    return validateRows(body.map((r) => ({ partNumber: r[pnCol] ?? '', quantity: r[qtyCol] ?? '' })), buyer);
  }

  /**
   * Checks rows in short slices and lets the event loop run between them, so a long list from one client never
   * holds the other requests (the health check among them) for more than a slice's work.
   */
  async function validateRows(rows: Array<{ partNumber: string; quantity: string }>, buyer: Buyer): Promise<OrderRowResult[]> {
    if (rows.length <= SHORT_LIST_ROWS) return rows.map((input, i) => validateRow(input, i, buyer));
    const out: OrderRowResult[] = [];
    while (out.length < rows.length) {
      await nextTurn();
      const sliceStarted = performance.now();
      do out.push(validateRow(rows[out.length]!, out.length, buyer));
      while (out.length < rows.length && performance.now() - sliceStarted < SLICE_MS);
    }
    return out;
  }

  function validateRow(input: { partNumber: string; quantity: string }, i: number, buyer: Buyer): OrderRowResult {
    const base = { row: i + 1, input, partNumber: null, title: null, quantity: null, available: null, suggestions: [] as OrderRowResult['suggestions'] };
    const typed = input.partNumber.trim();
    if (!typed) return { ...base, status: 'error', message: 'Part number is missing' };
    const qtyText = input.quantity.trim();
    const qty = Number(qtyText);
    const resolved = resolvePart(typed);
    if (!resolved) {
      const suggestions = suggestionsFor(typed);
      return { ...base, status: 'error', message: suggestions.length ? `No part ${typed}. Did you mean ${suggestions[0]!.partNumber}?` : `No part ${typed}`, suggestions };
    }
    const { part, replacedFrom } = resolved;
    const known = { ...base, partNumber: part.partNumber, title: part.title, available: Math.max(0, part.available) };
    if (!/^\d+$/.test(qtyText) || !Number.isInteger(qty)) return { ...known, status: 'error', message: `Quantity “${qtyText}” is not a whole number` };
    if (qty < 1 || qty > QUANTITY_MAX) return { ...known, status: 'error', message: `Quantity must be between 1 and ${QUANTITY_MAX}` };
    if (part.status === 'discontinued' && part.available < qty) return { ...known, status: 'error', message: `${part.partNumber} is discontinued; ${Math.max(0, part.available)} left` };
    if (qty > part.available && buyer.kind === 'retail') {
      return { ...known, quantity: qty, status: 'error', message: `Only ${Math.max(0, part.available)} of ${part.partNumber} available` };
    }
    const backorderNote = qty > part.available ? ` ${qty - Math.max(0, part.available)} will be back-ordered.` : '';
    if (replacedFrom) return { ...known, quantity: qty, status: 'replaced', message: `${replacedFrom} is superseded by ${part.partNumber}; the new number is used.${backorderNote}` };
    const namedNote = resolved.namedAs ? `${resolved.namedAs} is ${part.partNumber}.` : '';
    return { ...known, quantity: qty, status: 'ok', message: `${namedNote}${backorderNote}`.trim() || null };
  }

  function view(owner: CartOwner, user: CurrentUser | null, notices: string[] = []): CartView {
    const cart = cartRow(owner);
    const rows = cart ? linesOf(cart.id) : [];
    const zone = cart?.zone ?? 'national';
    const buyer = buyerOf(user);
    // A dealer's freight is priced to the trade account's zone; the view reports the zone it priced with.
    const pricedZone = user?.dealer?.deliveryZone && buyer.kind === 'dealer' ? (user.dealer.deliveryZone as DeliveryZone) : zone;
    const totals = priceOrder(
      rows.map((r) => ({ partNumber: r.partNumber, quantity: r.quantity, retailUnitCents: r.priceCents, coreDepositCents: r.coreDepositCents, weightGrams: r.weightGrams })),
      buyer,
      pricedZone,
      config.taxRatePct,
    );
    const lines = rows.map((r, i) => {
      const priced = totals.lines[i]!;
      const available = Math.max(0, r.available);
      return {
        id: r.lineId,
        partNumber: r.partNumber,
        title: r.title,
        category: r.category,
        frameCode: r.frameCode,
        condition: r.condition,
        quantity: r.quantity,
        available,
        allowBackorder: r.allowBackorder,
        backorderQuantity: Math.max(0, r.quantity - available),
        unitCents: priced.unitCents,
        retailUnitCents: r.priceCents,
        lineCents: priced.lineCents,
        coreDepositCents: priced.lineCoreDepositCents,
        weightGrams: priced.lineWeightGrams,
        fitment: r.fitmentId ? { id: r.fitmentId, name: r.fitmentName ?? '', summary: r.fitmentSummary ?? '' } : null,
        orientation: orientationFrom(r.compressorOutletClock, r.turbineInletClock),
        specs: { mounting: r.mounting },
        photo: r.photo,
      };
    });
    const { lines: _pricedLines, ...sums } = totals;
    return {
      lines,
      warnings: compatibilityWarnings(rows.map((r) => ({ lineId: r.lineId, partNumber: r.partNumber, category: r.category, frameCode: r.frameCode, flangePattern: r.flangePattern }))),
      notices,
      deliveryZone: pricedZone,
      totals: sums,
      taxRatePct: config.taxRatePct,
      buyer: { kind: buyer.kind, tier: buyer.tier ?? null, discountPct: buyer.tier ? DEALER_TIERS[buyer.tier].discountPct : 0 },
    };
  }

  function addLines(owner: CartOwner, user: CurrentUser | null, lines: Array<{ partNumber: string; quantity: number; fitmentId?: number; allowBackorder?: boolean; orientation?: Orientation }>) {
    const notices: string[] = [];
    // The helpers query through db: better-sqlite3 has one connection, so they run inside this transaction.
    db.transaction(() => {
      const id = cartId(owner, true)!;
      for (const line of lines) {
        const resolved = resolvePart(line.partNumber);
        if (!resolved) {
          const s = suggestionsFor(line.partNumber);
          throw new NotFoundError(s.length ? `No part ${line.partNumber}. Did you mean ${s[0]!.partNumber}?` : `No part ${line.partNumber}`);
        }
        const { part, replacedFrom } = resolved;
        if (replacedFrom) notices.push(`${replacedFrom} is superseded: ${part.partNumber} was added instead.`);
        if (part.status === 'discontinued' && part.available <= 0) throw new ConflictError(`${part.partNumber} is discontinued and out of stock`);
        if (line.fitmentId !== undefined && (!user || !fitmentOf(line.fitmentId, user.id))) throw new NotFoundError('No such saved fitment check');
        upsertLine({ cartId: id, partId: part.id, quantity: line.quantity, fitmentId: line.fitmentId ?? null, allowBackorder: line.allowBackorder ?? false, ...lineOrientation(part, line.orientation) });
      }
      const held = lineCountQuery.get({ cartId: id });
      if ((held?.n ?? 0) > CART_LINES_MAX) throw new ConflictError(`A cart holds at most ${CART_LINES_MAX} lines`);
      touchCartQuery.run({ cartId: id });
    });
    return view(owner, user, notices);
  }

  function updateLine(owner: CartOwner, user: CurrentUser | null, lineId: number, change: { quantity?: number; allowBackorder?: boolean; fitmentId?: number | null }) {
    const id = cartId(owner, false);
    if (!id || !lineOf(lineId, id)) throw new NotFoundError('No such line in your cart');
    if (change.allowBackorder && buyerOf(user).kind !== 'dealer') throw new NotAllowedError('Back-orders are for trade accounts');
    if (change.fitmentId && (!user || !fitmentOf(change.fitmentId, user.id))) throw new NotFoundError('No such saved fitment check');
    // Fields left undefined are not set; a null fitment is set, which unlinks the check.
    db.update(cartLines).set({ quantity: change.quantity, allowBackorder: change.allowBackorder, fitmentId: change.fitmentId }).where(eq(cartLines.id, lineId)).run();
    return view(owner, user);
  }

  function removeLine(owner: CartOwner, user: CurrentUser | null, lineId: number) {
    const id = cartId(owner, false);
    if (!id || !lineOf(lineId, id)) throw new NotFoundError('No such line in your cart');
    db.delete(cartLines).where(eq(cartLines.id, lineId)).run();
    return view(owner, user);
  }

  function setZone(owner: CartOwner, user: CurrentUser | null, zone: DeliveryZone) {
    const id = cartId(owner, true)!;
    db.update(carts).set({ deliveryZone: zone }).where(eq(carts.id, id)).run();
    return view(owner, user);
  }

  /** At sign-in the guest cart's lines join the user's cart (quantities add up), and the guest cart goes. */
  function mergeGuest(guestToken: string, userId: string) {
    db.transaction((tx) => {
      const guest = cartByGuest(guestToken);
      if (!guest) return;
      const target = cartId({ userId }, true)!;
      const guestLines = tx
        .select({ partId: cartLines.partId, quantity: cartLines.quantity, compressorOutletClock: cartLines.compressorOutletClock, turbineInletClock: cartLines.turbineInletClock })
        .from(cartLines)
        .where(eq(cartLines.cartId, guest.id))
        .all();
      for (const l of guestLines) {
        upsertLine({ cartId: target, fitmentId: null, allowBackorder: false, ...l });
      }
      tx.delete(carts).where(eq(carts.id, guest.id)).run();
    });
  }

  return { view, addLines, updateLine, removeLine, setZone, mergeGuest, validateRows, readOrderFile, resolvePart, cartId, newGuestToken: () => crypto.randomBytes(18).toString('base64url') };
}

export type CartService = ReturnType<typeof createCartService>;
