import { and, count, desc, eq, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/sqlite-core';
import type { Db } from '../db/client';
import { cartLines, carts, orderLines, orders, parts, partsListLines, partsLists, user } from '../db/schema';
import { ConflictError, NotAllowedError, NotFoundError } from './errors';
import type { CurrentUser } from './current-user';
import { buyerOf, type CartService } from './cart';
import { dealerUnitPriceCents } from '../../shared/pricing';
import { QUANTITY_MAX } from '../../shared/schemas/orders';
import {
  LIST_LINES_MAX,
  LISTS_PER_ACCOUNT_MAX,
  type AddToList,
  type AddToListResult,
  type ListDetail,
  type ListSummary,
  type OrderFromList,
} from '../../shared/schemas/parts-lists';

const now = sql<string>`strftime('%Y-%m-%dT%H:%M:%fZ','now')`;
const editor = alias(user, 'editor');
const creator = alias(user, 'creator');
const adder = alias(user, 'adder');

/**
 * Named parts lists of a trade account. Every user of the account sees and edits the same lists; anyone else gets
 * 404 for a list that is not their account's, exactly as for one that does not exist. Lists are a trade tool: a
 * retail buyer (or a pending applicant) is refused with the reason.
 */
export function createPartsListsService(deps: { db: Db; cart: CartService }) {
  const { db, cart } = deps;

  function accountOf(u: CurrentUser): number {
    if (u.role !== 'dealer' || u.dealer?.status !== 'approved') throw new NotAllowedError('Parts lists are kept by trade accounts: apply for one from your account page');
    return u.dealer.id;
  }

  const summaryColumns = {
    id: partsLists.id,
    name: partsLists.name,
    lineCount: sql<number>`(select count(*) from ${partsListLines} where ${partsListLines.listId} = ${partsLists.id})`,
    unitCount: sql<number>`(select coalesce(sum(${partsListLines.quantity}), 0) from ${partsListLines} where ${partsListLines.listId} = ${partsLists.id})`,
    updatedAt: partsLists.updatedAt,
    updatedByName: editor.name,
  };

  function summaries(dealerId: number, listId?: number): ListSummary[] {
    return db
      .select(summaryColumns)
      .from(partsLists)
      .leftJoin(editor, eq(editor.id, partsLists.updatedBy))
      .where(listId === undefined ? eq(partsLists.dealerAccountId, dealerId) : and(eq(partsLists.dealerAccountId, dealerId), eq(partsLists.id, listId)))
      .orderBy(desc(partsLists.updatedAt), desc(partsLists.id))
      .all();
  }

  function ownList(dealerId: number, listId: number) {
    const list = db.select().from(partsLists).where(and(eq(partsLists.id, listId), eq(partsLists.dealerAccountId, dealerId))).get();
    if (!list) throw new NotFoundError('No such list');
    return list;
  }

  const touch = (listId: number, by: string) => db.update(partsLists).set({ updatedAt: now, updatedBy: by }).where(eq(partsLists.id, listId)).run();

  function nameTaken(dealerId: number, name: string, except?: number) {
    const found = db
      .select({ id: partsLists.id })
      .from(partsLists)
      .where(and(eq(partsLists.dealerAccountId, dealerId), sql`lower(${partsLists.name}) = lower(${name})`))
      .get();
    return found !== undefined && found.id !== except;
  }

  function createInside(u: CurrentUser, dealerId: number, name: string): number {
    if (nameTaken(dealerId, name)) throw new ConflictError(`Your account already has a list called “${name}”`);
    const held = db.select({ n: count() }).from(partsLists).where(eq(partsLists.dealerAccountId, dealerId)).get();
    if ((held?.n ?? 0) >= LISTS_PER_ACCOUNT_MAX) throw new ConflictError(`An account keeps at most ${LISTS_PER_ACCOUNT_MAX} lists: delete one first`);
    return db.insert(partsLists).values({ dealerAccountId: dealerId, name, createdBy: u.id, updatedBy: u.id }).returning({ id: partsLists.id }).get().id;
  }

  function list(u: CurrentUser) {
    return { items: summaries(accountOf(u)) };
  }

  function create(u: CurrentUser, name: string): ListSummary {
    const dealerId = accountOf(u);
    const id = db.transaction(() => createInside(u, dealerId, name), { behavior: 'immediate' });
    return summaries(dealerId, id)[0]!;
  }

  function detail(u: CurrentUser, listId: number): ListDetail {
    const dealerId = accountOf(u);
    ownList(dealerId, listId);
    const head = db
      .select({ ...summaryColumns, createdByName: creator.name })
      .from(partsLists)
      .leftJoin(editor, eq(editor.id, partsLists.updatedBy))
      .leftJoin(creator, eq(creator.id, partsLists.createdBy))
      .where(eq(partsLists.id, listId))
      .get()!;
    const buyer = buyerOf(u);
    const lines = db
      .select({
        id: partsListLines.id,
        partNumber: parts.partNumber,
        title: parts.title,
        status: parts.status,
        supersededBy: parts.supersededBy,
        quantity: partsListLines.quantity,
        available: parts.available,
        priceCents: parts.priceCents,
        addedByName: adder.name,
      })
      .from(partsListLines)
      .innerJoin(parts, eq(parts.id, partsListLines.partId))
      .leftJoin(adder, eq(adder.id, partsListLines.addedBy))
      .where(eq(partsListLines.listId, listId))
      .orderBy(partsListLines.id)
      .all();
    return {
      ...head,
      lines: lines.map(({ priceCents, ...l }) => ({ ...l, available: Math.max(0, l.available), unitCents: buyer.tier ? dealerUnitPriceCents(priceCents, buyer.tier) : priceCents })),
    };
  }

  function rename(u: CurrentUser, listId: number, name: string): ListSummary {
    const dealerId = accountOf(u);
    db.transaction(
      () => {
        ownList(dealerId, listId);
        if (nameTaken(dealerId, name, listId)) throw new ConflictError(`Your account already has a list called “${name}”`);
        db.update(partsLists).set({ name, updatedAt: now, updatedBy: u.id }).where(eq(partsLists.id, listId)).run();
      },
      { behavior: 'immediate' },
    );
    return summaries(dealerId, listId)[0]!;
  }

  function remove(u: CurrentUser, listId: number) {
    const dealerId = accountOf(u);
    ownList(dealerId, listId);
    db.delete(partsLists).where(eq(partsLists.id, listId)).run();
  }

  /** What a source puts on a list: part and quantity per line, superseded numbers followed to what replaced them. */
  function sourceLines(u: CurrentUser, source: AddToList['source']) {
    const notices: string[] = [];
    let wanted: Array<{ partNumber: string; quantity: number }> = [];
    if (source.kind === 'part') wanted = [{ partNumber: source.partNumber, quantity: source.quantity }];
    if (source.kind === 'cart') {
      wanted = db
        .select({ partNumber: parts.partNumber, quantity: cartLines.quantity })
        .from(cartLines)
        .innerJoin(carts, eq(carts.id, cartLines.cartId))
        .innerJoin(parts, eq(parts.id, cartLines.partId))
        .where(eq(carts.userId, u.id))
        .orderBy(cartLines.id)
        .all();
      if (wanted.length === 0) throw new ConflictError('Your cart is empty');
    }
    if (source.kind === 'order') {
      const order = db.select({ id: orders.id, userId: orders.userId }).from(orders).where(eq(orders.number, source.orderNumber)).get();
      if (!order || order.userId !== u.id) throw new NotFoundError(`No order ${source.orderNumber}`);
      wanted = db.select({ partNumber: orderLines.partNumber, quantity: orderLines.quantity }).from(orderLines).where(eq(orderLines.orderId, order.id)).orderBy(orderLines.id).all();
    }
    const resolved: Array<{ partId: number; quantity: number }> = [];
    for (const w of wanted) {
      const found = cart.resolvePart(w.partNumber);
      if (!found) {
        if (source.kind === 'part') throw new NotFoundError(`No part ${w.partNumber}`);
        notices.push(`${w.partNumber} is no longer in the catalogue and was left out.`);
        continue;
      }
      if (found.replacedFrom) notices.push(`${found.replacedFrom} is superseded: ${found.part.partNumber} is on the list instead.`);
      resolved.push({ partId: found.part.id, quantity: w.quantity });
    }
    return { lines: resolved, notices };
  }

  /** Adds lines to a list (or a new one); a part already on it gets the quantities added together. */
  function add(u: CurrentUser, input: AddToList): AddToListResult {
    const dealerId = accountOf(u);
    const { lines, notices } = sourceLines(u, input.source);
    const listId = db.transaction(
      (tx) => {
        const id = input.listId !== undefined ? ownList(dealerId, input.listId).id : createInside(u, dealerId, input.newListName!);
        for (const l of lines) {
          tx.insert(partsListLines)
            .values({ listId: id, partId: l.partId, quantity: Math.min(QUANTITY_MAX, l.quantity), addedBy: u.id })
            .onConflictDoUpdate({ target: [partsListLines.listId, partsListLines.partId], set: { quantity: sql`min(${QUANTITY_MAX}, ${partsListLines.quantity} + excluded.quantity)` } })
            .run();
        }
        const held = tx.select({ n: count() }).from(partsListLines).where(eq(partsListLines.listId, id)).get();
        if ((held?.n ?? 0) > LIST_LINES_MAX) throw new ConflictError(`A list holds at most ${LIST_LINES_MAX} lines`);
        touch(id, u.id);
        return id;
      },
      { behavior: 'immediate' },
    );
    return { list: summaries(dealerId, listId)[0]!, added: lines.length, notices };
  }

  function lineOf(listId: number, lineId: number) {
    const line = db.select().from(partsListLines).where(and(eq(partsListLines.id, lineId), eq(partsListLines.listId, listId))).get();
    if (!line) throw new NotFoundError('No such line on this list');
    return line;
  }

  function setQuantity(u: CurrentUser, listId: number, lineId: number, quantity: number) {
    ownList(accountOf(u), listId);
    lineOf(listId, lineId);
    db.update(partsListLines).set({ quantity }).where(eq(partsListLines.id, lineId)).run();
    touch(listId, u.id);
    return detail(u, listId);
  }

  function removeLine(u: CurrentUser, listId: number, lineId: number) {
    ownList(accountOf(u), listId);
    lineOf(listId, lineId);
    db.delete(partsListLines).where(eq(partsListLines.id, lineId)).run();
    touch(listId, u.id);
    return detail(u, listId);
  }

  /** The chosen lines at the chosen quantities go into this user's cart; the list itself stays as it is. */
  function order(u: CurrentUser, listId: number, input: OrderFromList) {
    const dealerId = accountOf(u);
    ownList(dealerId, listId);
    const notices: string[] = [];
    const addable: Array<{ partNumber: string; quantity: number }> = [];
    for (const chosen of input.lines) {
      const line = lineOf(listId, chosen.lineId);
      const part = db.select({ partNumber: parts.partNumber }).from(parts).where(eq(parts.id, line.partId)).get()!;
      const resolved = cart.resolvePart(part.partNumber);
      if (!resolved) continue;
      if (resolved.part.status === 'discontinued' && resolved.part.available <= 0) {
        notices.push(`${resolved.part.partNumber} is discontinued and out of stock, so it was left out.`);
        continue;
      }
      if (resolved.replacedFrom) notices.push(`${part.partNumber} is superseded: ${resolved.part.partNumber} was added instead.`);
      addable.push({ partNumber: resolved.part.partNumber, quantity: chosen.quantity });
    }
    const view = addable.length ? cart.addLines({ userId: u.id }, u, addable) : null;
    return { added: addable.length, notices: [...(view?.notices ?? []), ...notices] };
  }

  return { list, create, detail, rename, remove, add, setQuantity, removeLine, order };
}

export type PartsListsService = ReturnType<typeof createPartsListsService>;
