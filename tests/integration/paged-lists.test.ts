import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DealerAccountsSchema } from '../../shared/schemas/accounts';
import { PickQueueSchema } from '../../shared/schemas/warehouse';
import { createDealer, createOrder, createPart, createUser, type TestDealer } from '../support/factories';
import type { Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

/** The office's dealer accounts and the floor's pick queue come a page at a time, every row on exactly one page. */
let t: TestApp;
let admin: Client;
let floor: Client;
beforeAll(async () => {
  t = await startTestApp();
  admin = (await createUser(t, { role: 'admin' })).client;
  floor = (await createUser(t, { role: 'warehouse' })).client;
});
afterAll(async () => {
  await t?.close();
});

/** Every page of a list, read until the total is reached (and one past it, which must be empty). */
async function allPages<T>(read: (page: number) => Promise<{ items: T[]; total: number; page: number; pageSize: number }>) {
  const seen: T[] = [];
  let page = 1;
  let total: number;
  for (;;) {
    const answer = await read(page);
    expect(answer.page).toBe(page);
    total = answer.total;
    if (answer.items.length === 0) break;
    expect(answer.items.length).toBeLessThanOrEqual(answer.pageSize);
    seen.push(...answer.items);
    page++;
  }
  return { seen, total, pages: page - 1 };
}

describe('dealer accounts, paged', () => {
  it('lists every account exactly once across pages, pending first and newest first, with open balances', async () => {
    const made: TestDealer[] = [];
    for (const status of ['approved', 'pending', 'declined', 'approved', 'pending', 'approved', 'approved'] as const) made.push(await createDealer(t, { status }));
    const part = createPart(t, { stock: 20, priceCents: 10_000 });
    await createOrder(made[0]!, [{ partNumber: part.partNumber, quantity: 2 }]);

    const read = async (page: number) => {
      const reply = await admin.get(`/api/admin/dealers?page=${page}&pageSize=3`);
      expect(reply.status).toBe(200);
      return DealerAccountsSchema.parse(reply.body);
    };
    const { seen, total, pages } = await allPages(read);
    expect(total).toBe(made.length);
    expect(pages).toBe(3);
    expect(seen.map((d) => d.id).sort()).toEqual(made.map((d) => d.dealerAccountId).sort());
    // Pending first, then the rest; newest first within each.
    const expected = [...made].sort((a, b) => Number(b.dealerAccountId) - Number(a.dealerAccountId));
    const order = [...expected.filter((d) => d === made[1] || d === made[4]), ...expected.filter((d) => d !== made[1] && d !== made[4])];
    expect(seen.map((d) => d.id)).toEqual(order.map((d) => d.dealerAccountId));
    expect((await read(1)).pending).toBe(2);
    expect(seen.find((d) => d.id === made[0]!.dealerAccountId)?.openBalanceCents).toBeGreaterThan(0);
    expect(seen.filter((d) => d.id !== made[0]!.dealerAccountId).every((d) => d.openBalanceCents === 0)).toBe(true);
  });

  it('answers without paging options with the first page, and refuses a page size over the limit', async () => {
    const first = DealerAccountsSchema.parse((await admin.get('/api/admin/dealers')).body);
    expect(first).toMatchObject({ page: 1, pageSize: 25 });
    expect((await admin.get('/api/admin/dealers?pageSize=500')).status).toBe(400);
    expect((await admin.get('/api/admin/dealers?page=0')).status).toBe(400);
  });
});

describe('the pick queue, paged', () => {
  it('holds every order waiting exactly once across pages, oldest first, and filters on the server', async () => {
    const dealer = await createDealer(t);
    const part = createPart(t, { stock: 50 });
    const placed: string[] = [];
    for (let i = 0; i < 7; i++) placed.push((await createOrder(dealer, [{ partNumber: part.partNumber, quantity: 1 }])).order.number);

    const read = async (page: number, filter = '') => {
      const reply = await floor.get(`/api/warehouse/pick-queue?page=${page}&pageSize=3${filter}`);
      expect(reply.status).toBe(200);
      return PickQueueSchema.parse(reply.body);
    };
    const { seen, total, pages } = await allPages(read);
    expect(new Set(seen.map((o) => o.number)).size).toBe(seen.length);
    expect(seen.length).toBe(total);
    expect(pages).toBe(Math.ceil(total / 3));
    // Oldest first: the orders placed here come in the order they were placed, after any older ones.
    expect(seen.map((o) => o.number).filter((n) => placed.includes(n))).toEqual(placed);
    const times = seen.map((o) => o.createdAt);
    expect(times).toEqual([...times].sort());

    // Filters apply before paging, so the total and the pages are those of the filtered queue.
    const one = await read(1, `&q=${placed[4]!.toLowerCase()}`);
    expect(one.items.map((o) => o.number)).toEqual([placed[4]]);
    expect(one.total).toBe(1);
    const onAccount = await allPages((page) => read(page, '&payment=account&state=pick'));
    expect(onAccount.seen.map((o) => o.number).filter((n) => placed.includes(n))).toEqual(placed);
    expect((await read(1, '&payment=card')).items.filter((o) => placed.includes(o.number))).toEqual([]);
    expect((await read(1, '&state=dispatch')).items.filter((o) => placed.includes(o.number))).toEqual([]);
    expect((await floor.get('/api/warehouse/pick-queue?state=lost')).status).toBe(400);
  });
});
