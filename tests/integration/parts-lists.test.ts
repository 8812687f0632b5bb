import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { dealerMembers } from '../../server/db/schema';
import { AddToListResultSchema, ListDetailSchema, ListsSchema } from '../../shared/schemas/parts-lists';
import { CartViewSchema } from '../../shared/schemas/orders';
import { createCustomer, createDealer, createOrder, createPart, createUser, type TestDealer, type TestUser } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

/** Named parts lists belong to a trade account: every user of it sees and edits them, nobody else sees them at all. */
let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

/** A second buyer on the same trade account, as the office adds one. */
async function colleagueOf(dealer: TestDealer): Promise<TestUser> {
  const u = await createUser(t, { role: 'dealer' });
  t.db.insert(dealerMembers).values({ userId: u.id, dealerAccountId: dealer.dealerAccountId }).run();
  return u;
}
const lists = async (u: TestUser) => ListsSchema.parse((await u.client.get('/api/lists')).body).items;
const detail = async (u: TestUser, id: number) => ListDetailSchema.parse((await u.client.get(`/api/lists/${id}`)).body);

describe('parts lists of a trade account', () => {
  it('one user builds a list from a part page and a past order; a colleague sees it, edits it and orders part of it', async () => {
    const owner = await createDealer(t, { tier: 'preferred' });
    const colleague = await colleagueOf(owner);
    const a = createPart(t, { priceCents: 10_000, stock: 20 });
    const b = createPart(t, { priceCents: 2_000, stock: 20 });
    const placed = await createOrder(owner, [
      { partNumber: a.partNumber, quantity: 2 },
      { partNumber: b.partNumber, quantity: 5 },
    ]);

    const fromPart = await owner.client.send('POST', '/api/lists/add', { newListName: 'Van stock', source: { kind: 'part', partNumber: a.partNumber, quantity: 1 } });
    expect(fromPart.status, JSON.stringify(fromPart.body)).toBe(201);
    const listId = AddToListResultSchema.parse(fromPart.body).list.id;
    const fromOrder = AddToListResultSchema.parse((await owner.client.send('POST', '/api/lists/add', { listId, source: { kind: 'order', orderNumber: placed.order.number } })).body);
    // The part already on the list gets the order's quantity added; the other part comes on as a new line.
    expect(fromOrder.list).toMatchObject({ name: 'Van stock', lineCount: 2, unitCount: 8 });

    expect((await lists(colleague)).map((l) => l.name)).toEqual(['Van stock']);
    const seen = await detail(colleague, listId);
    expect(seen.lines.map((l) => [l.partNumber, l.quantity])).toEqual([
      [a.partNumber, 3],
      [b.partNumber, 5],
    ]);
    // Trade prices at the account's tier (preferred, 15 % off).
    expect(seen.lines[0]!.unitCents).toBe(8_500);
    expect(seen.createdByName).toBe(owner.name);

    const lineB = seen.lines[1]!;
    const edited = ListDetailSchema.parse((await colleague.client.send('PATCH', `/api/lists/${listId}/lines/${lineB.id}`, { quantity: 4 })).body);
    expect(edited.lines[1]!.quantity).toBe(4);
    expect(edited.updatedByName).toBe(colleague.name);
    expect((await detail(owner, listId)).lines[1]!.quantity).toBe(4);

    // Ordering part of the list: the chosen line at the chosen quantity goes into the colleague's cart; the list stays.
    const ordered = await colleague.client.send('POST', `/api/lists/${listId}/order`, { lines: [{ lineId: seen.lines[0]!.id, quantity: 2 }] });
    expect(ordered.status, JSON.stringify(ordered.body)).toBe(201);
    const cart = CartViewSchema.parse((await colleague.client.get('/api/cart')).body);
    expect(cart.lines.map((l) => [l.partNumber, l.quantity])).toEqual([[a.partNumber, 2]]);
    expect((await detail(owner, listId)).lines.map((l) => l.quantity)).toEqual([3, 4]);
  });

  it('keeps lists inside their account: another dealer sees none and gets 404 for one; a retail buyer is refused', async () => {
    const owner = await createDealer(t);
    const other = await createDealer(t);
    const retail = await createCustomer(t);
    const a = createPart(t);
    const listId = AddToListResultSchema.parse((await owner.client.send('POST', '/api/lists/add', { newListName: 'Season rebuild kit', source: { kind: 'part', partNumber: a.partNumber, quantity: 2 } })).body).list.id;
    const line = (await detail(owner, listId)).lines[0]!;

    expect(await lists(other)).toEqual([]);
    expect((await other.client.get(`/api/lists/${listId}`)).status).toBe(404);
    expect((await other.client.send('POST', '/api/lists/add', { listId, source: { kind: 'part', partNumber: a.partNumber, quantity: 1 } })).status).toBe(404);
    expect((await other.client.send('PATCH', `/api/lists/${listId}/lines/${line.id}`, { quantity: 9 })).status).toBe(404);
    expect((await other.client.send('POST', `/api/lists/${listId}/order`, { lines: [{ lineId: line.id, quantity: 1 }] })).status).toBe(404);
    expect((await other.client.send('DELETE', `/api/lists/${listId}`)).status).toBe(404);
    const refused = await retail.client.get('/api/lists');
    expect(refused.status).toBe(403);
    expect((refused.body as { error: { message: string } }).error.message).toMatch(/trade accounts/);
    expect((await t.get('/api/lists')).status).toBe(401);
    expect((await detail(owner, listId)).lines.map((l) => l.quantity)).toEqual([2]);
  });

  it('refuses a second list of the same name in an account (any case), adds the cart, and deletes a list', async () => {
    const owner = await createDealer(t);
    const a = createPart(t);
    expect((await owner.client.send('POST', '/api/lists', { name: 'Van stock' })).status).toBe(201);
    const again = await owner.client.send('POST', '/api/lists', { name: 'VAN STOCK' });
    expect(again.status).toBe(409);
    expect((await owner.client.send('POST', '/api/lists', { name: '  ' })).status).toBe(400);
    // Another account may use the same name.
    expect((await (await createDealer(t)).client.send('POST', '/api/lists', { name: 'Van stock' })).status).toBe(201);

    await owner.client.send('POST', '/api/cart/lines', { partNumber: a.partNumber, quantity: 3 });
    const fromCart = AddToListResultSchema.parse((await owner.client.send('POST', '/api/lists/add', { newListName: 'From the cart', source: { kind: 'cart' } })).body);
    expect(fromCart.list).toMatchObject({ lineCount: 1, unitCount: 3 });
    expect((await owner.client.send('DELETE', `/api/lists/${fromCart.list.id}`)).status).toBe(204);
    expect((await lists(owner)).map((l) => l.name)).toEqual(['Van stock']);
  });
});
