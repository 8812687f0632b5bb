import crypto from 'node:crypto';
import type { Db } from '../db/client';
import { HttpError } from '../middleware/errors';
import type { CurrentUser } from '../middleware/session';
import { normalizePartNumber } from '../../shared/part-number';
import { DEALER_TIERS, priceOrder, type Buyer, type DeliveryZone } from '../../shared/pricing';
import { CART_LINES_MAX, QUANTITY_MAX, type CartView, type OrderRowResult } from '../../shared/schemas/orders';
import type { SearchService } from './search';

export type CartOwner = { userId: string } | { guestToken: string };

interface PartLookup {
  id: number;
  partNumber: string;
  title: string;
  category: string;
  frameCode: string | null;
  status: string;
  supersededBy: string | null;
  condition: 'new' | 'exchange';
  priceCents: number;
  coreDepositCents: number;
  weightGrams: number;
  flangePattern: string | null;
  mounting: string | null;
  photo: string | null;
  available: number;
}

interface LineRow extends PartLookup {
  lineId: number;
  quantity: number;
  allowBackorder: number;
  fitmentId: number | null;
  fitmentName: string | null;
  fitmentSummary: string | null;
}

export function buyerOf(user: CurrentUser | null): Buyer {
  const dealer = user?.role === 'dealer' && user.dealer?.status === 'approved' && user.dealer.tier ? user.dealer : null;
  return dealer ? { kind: 'dealer', tier: dealer.tier! } : { kind: 'retail' };
}

const PART_SELECT = `SELECT p.id, p.part_number AS partNumber, p.title, p.category, p.frame_code AS frameCode, p.status, p.superseded_by AS supersededBy,
  p.condition, p.price_cents AS priceCents, p.core_deposit_cents AS coreDepositCents, p.weight_grams AS weightGrams, s.flange_pattern AS flangePattern,
  s.mounting, json_extract(p.images, '$[0]') AS photo, p.available
  FROM parts p LEFT JOIN part_specs s ON s.part_id = p.id`;

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

export function createCartService(db: Db, search: SearchService, config: { taxRatePct: number }) {
  const sqlite = db.$client;
  const stmt = {
    partByNumber: sqlite.prepare(`${PART_SELECT} WHERE p.normalized_number = ?`),
    partById: sqlite.prepare(`${PART_SELECT} WHERE p.id = ?`),
    cartByUser: sqlite.prepare('SELECT id, delivery_zone AS zone FROM carts WHERE user_id = ?'),
    cartByGuest: sqlite.prepare('SELECT id, delivery_zone AS zone FROM carts WHERE guest_token = ?'),
    createCart: sqlite.prepare('INSERT INTO carts (user_id, guest_token, delivery_zone) VALUES (?, ?, ?) RETURNING id'),
    lines: sqlite.prepare(
      `SELECT l.id AS lineId, l.quantity, l.allow_backorder AS allowBackorder, l.fitment_id AS fitmentId, f.name AS fitmentName, f.summary AS fitmentSummary, p.*
       FROM cart_lines l JOIN (${PART_SELECT}) p ON p.id = l.part_id LEFT JOIN saved_fitments f ON f.id = l.fitment_id WHERE l.cart_id = ? ORDER BY l.id`,
    ),
    lineCount: sqlite.prepare('SELECT count(*) AS n FROM cart_lines WHERE cart_id = ?'),
    upsertLine: sqlite.prepare(
      `INSERT INTO cart_lines (cart_id, part_id, quantity, fitment_id, allow_backorder) VALUES (?, ?, ?, ?, ?)
       ON CONFLICT (cart_id, part_id) DO UPDATE SET quantity = min(${QUANTITY_MAX}, cart_lines.quantity + excluded.quantity),
         fitment_id = COALESCE(excluded.fitment_id, cart_lines.fitment_id), allow_backorder = max(cart_lines.allow_backorder, excluded.allow_backorder)
       RETURNING id`,
    ),
    lineOf: sqlite.prepare('SELECT id FROM cart_lines WHERE id = ? AND cart_id = ?'),
    fitmentOf: sqlite.prepare('SELECT id FROM saved_fitments WHERE id = ? AND user_id = ?'),
    touch: sqlite.prepare("UPDATE carts SET updated_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?"),
  };

  const cartRow = (owner: CartOwner) =>
    ('userId' in owner ? stmt.cartByUser.get(owner.userId) : stmt.cartByGuest.get(owner.guestToken)) as { id: number; zone: DeliveryZone } | undefined;

  function cartId(owner: CartOwner, create: boolean): number | null {
    const found = cartRow(owner);
    if (found) return found.id;
    if (!create) return null;
    const row = stmt.createCart.get('userId' in owner ? owner.userId : null, 'guestToken' in owner ? owner.guestToken : null, 'national') as { id: number };
    return row.id;
  }

  /** Resolves a typed number to the part sold today, following supersessions. */
  function resolvePart(typed: string): { part: PartLookup; replacedFrom: string | null } | null {
    let part = stmt.partByNumber.get(normalizePartNumber(typed)) as PartLookup | undefined;
    if (!part) return null;
    let replacedFrom: string | null = null;
    for (let hops = 0; part.status === 'superseded' && part.supersededBy && hops < 5; hops++) {
      const next = stmt.partByNumber.get(normalizePartNumber(part.supersededBy)) as PartLookup | undefined;
      if (!next) break;
      replacedFrom ??= part.partNumber;
      part = next;
    }
    return { part, replacedFrom };
  }

  function suggestionsFor(typed: string) {
    return search
      .search(typed, 3)
      .map((h) => stmt.partById.get(h.partId) as PartLookup | undefined)
      .filter((p): p is PartLookup => !!p && p.status !== 'superseded')
      .map((p) => ({ partNumber: p.partNumber, title: p.title }));
  }

  /** Checks rows of part number + quantity as a person typed them (quick order, stock-list upload). */
  function validateRows(rows: Array<{ partNumber: string; quantity: string }>, buyer: Buyer): OrderRowResult[] {
    return rows.map((input, i) => {
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
      return { ...known, quantity: qty, status: 'ok', message: backorderNote ? backorderNote.trim() : null };
    });
  }

  function view(owner: CartOwner, user: CurrentUser | null, notices: string[] = []): CartView {
    const cart = cartRow(owner);
    const rows = cart ? (stmt.lines.all(cart.id) as LineRow[]) : [];
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
        allowBackorder: r.allowBackorder === 1,
        backorderQuantity: Math.max(0, r.quantity - available),
        unitCents: priced.unitCents,
        retailUnitCents: r.priceCents,
        lineCents: priced.lineCents,
        coreDepositCents: priced.lineCoreDepositCents,
        weightGrams: priced.lineWeightGrams,
        fitment: r.fitmentId ? { id: r.fitmentId, name: r.fitmentName ?? '', summary: r.fitmentSummary ?? '' } : null,
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

  function addLines(owner: CartOwner, user: CurrentUser | null, lines: Array<{ partNumber: string; quantity: number; fitmentId?: number; allowBackorder?: boolean }>) {
    const notices: string[] = [];
    sqlite.transaction(() => {
      const id = cartId(owner, true)!;
      for (const line of lines) {
        const resolved = resolvePart(line.partNumber);
        if (!resolved) {
          const s = suggestionsFor(line.partNumber);
          throw new HttpError(404, s.length ? `No part ${line.partNumber}. Did you mean ${s[0]!.partNumber}?` : `No part ${line.partNumber}`);
        }
        const { part, replacedFrom } = resolved;
        if (replacedFrom) notices.push(`${replacedFrom} is superseded: ${part.partNumber} was added instead.`);
        if (part.status === 'discontinued' && part.available <= 0) throw new HttpError(409, `${part.partNumber} is discontinued and out of stock`);
        if (line.fitmentId !== undefined && (!user || !stmt.fitmentOf.get(line.fitmentId, user.id))) throw new HttpError(404, 'No such saved fitment check');
        stmt.upsertLine.run(id, part.id, line.quantity, line.fitmentId ?? null, line.allowBackorder ? 1 : 0);
      }
      if ((stmt.lineCount.get(id) as { n: number }).n > CART_LINES_MAX) throw new HttpError(409, `A cart holds at most ${CART_LINES_MAX} lines`);
      stmt.touch.run(id);
    })();
    return view(owner, user, notices);
  }

  function updateLine(owner: CartOwner, user: CurrentUser | null, lineId: number, change: { quantity?: number; allowBackorder?: boolean; fitmentId?: number | null }) {
    const id = cartId(owner, false);
    if (!id || !stmt.lineOf.get(lineId, id)) throw new HttpError(404, 'No such line in your cart');
    if (change.allowBackorder && buyerOf(user).kind !== 'dealer') throw new HttpError(403, 'Back-orders are for trade accounts');
    if (change.fitmentId && (!user || !stmt.fitmentOf.get(change.fitmentId, user.id))) throw new HttpError(404, 'No such saved fitment check');
    const sets: string[] = [];
    const params: Array<number | null> = [];
    const set = (column: string, value: number | null) => {
      sets.push(`${column} = ?`);
      params.push(value);
    };
    if (change.quantity !== undefined) set('quantity', change.quantity);
    if (change.allowBackorder !== undefined) set('allow_backorder', change.allowBackorder ? 1 : 0);
    if (change.fitmentId !== undefined) set('fitment_id', change.fitmentId);
    sqlite.prepare(`UPDATE cart_lines SET ${sets.join(', ')} WHERE id = ?`).run(...params, lineId);
    return view(owner, user);
  }

  function removeLine(owner: CartOwner, user: CurrentUser | null, lineId: number) {
    const id = cartId(owner, false);
    if (!id || !stmt.lineOf.get(lineId, id)) throw new HttpError(404, 'No such line in your cart');
    sqlite.prepare('DELETE FROM cart_lines WHERE id = ?').run(lineId);
    return view(owner, user);
  }

  function setZone(owner: CartOwner, user: CurrentUser | null, zone: DeliveryZone) {
    const id = cartId(owner, true)!;
    sqlite.prepare('UPDATE carts SET delivery_zone = ? WHERE id = ?').run(zone, id);
    return view(owner, user);
  }

  /** At sign-in the guest cart's lines join the user's cart (quantities add up), and the guest cart goes. */
  function mergeGuest(guestToken: string, userId: string) {
    sqlite.transaction(() => {
      const guest = stmt.cartByGuest.get(guestToken) as { id: number } | undefined;
      if (!guest) return;
      const target = cartId({ userId }, true)!;
      for (const l of sqlite.prepare('SELECT part_id AS partId, quantity FROM cart_lines WHERE cart_id = ?').all(guest.id) as Array<{ partId: number; quantity: number }>) {
        stmt.upsertLine.run(target, l.partId, l.quantity, null, 0);
      }
      sqlite.prepare('DELETE FROM carts WHERE id = ?').run(guest.id);
    })();
  }

  return { view, addLines, updateLine, removeLine, setZone, mergeGuest, validateRows, resolvePart, cartId, newGuestToken: () => crypto.randomBytes(18).toString('base64url') };
}

export type CartService = ReturnType<typeof createCartService>;
