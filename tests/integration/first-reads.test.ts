import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import { CATEGORY_SLUGS } from '../../shared/catalog';
import { MeSchema } from '../../shared/schemas/accounts';
import { UnreadNoticesSchema } from '../../shared/schemas/notices';
import { CartViewSchema } from '../../shared/schemas/orders';
import { FrameDetailSchema, FramesResponseSchema, PART_SORTS, PartDetailSchema, PartsListResponseSchema } from '../../shared/schemas/parts';
import { FitmentFrameMapsResponseSchema } from '../../shared/schemas/saved-fitments';
import { createCustomer, createDealer } from '../support/factories';
import { clientOf, signIn, type Client } from '../support/session';
import { startTestApp, type TestApp } from '../support/test-app';

/**
 * The reads the shop's first pages and header make are taken by the client without the validation library
 * (src/lib/api-client.ts apiRead): the answer is used as the schema's type. That is only safe if parsing the real
 * answer changes nothing, no default filled in, no transform, no key dropped. These tests parse real answers of each
 * of those endpoints, for guests, customers, dealers and staff, and demand the parsed value be the answer itself.
 */
let t: TestApp;
let guest: Client;
let customer: Client;
let dealer: Client;
let admin: Client;
let warehouse: Client;

beforeAll(async () => {
  t = await startTestApp({ accounts: true });
  guest = clientOf(t);
  customer = (await createCustomer(t)).client;
  dealer = (await createDealer(t, { tier: 'preferred' })).client;
  admin = await signIn(t, 'admin@spoolyard.test');
  warehouse = await signIn(t, 'warehouse@spoolyard.test');
});
afterAll(async () => {
  await t.close();
});

async function parsesToItself(client: Client, path: string, schema: z.ZodType) {
  const reply = await client.get(path);
  expect(reply.status, path).toBe(200);
  expect(schema.parse(reply.body), path).toStrictEqual(reply.body);
  return reply.body;
}

const partNumbers = () => t.db.$client.prepare('SELECT part_number AS n FROM parts ORDER BY id').all() as Array<{ n: string }>;

describe('answers the first pages read without parsing are what their schemas make of them', () => {
  it('who is signed in: nobody, a customer, a dealer, a warehouse hand and an administrator', async () => {
    for (const client of [guest, customer, dealer, warehouse, admin]) await parsesToItself(client, '/api/account/me', MeSchema);
    // A dealer's answer carries the trade account.
    const me = MeSchema.parse((await dealer.get('/api/account/me')).body);
    expect(me.user?.dealer?.tier).toBe('preferred');
  });

  it('the cart: empty and full, for a guest, a customer and a dealer', async () => {
    for (const client of [guest, customer, dealer]) await parsesToItself(client, '/api/cart', CartViewSchema);
    const numbers = partNumbers().map((p) => p.n);
    // Complete units, housings, a gasket: lines with core deposits, warnings and notices, as far as the catalogue has them.
    const superseded = t.db.$client.prepare("SELECT part_number AS n FROM parts WHERE status = 'superseded' LIMIT 1").get() as { n: string } | undefined;
    for (const client of [guest, customer, dealer]) {
      for (const n of [numbers[0]!, numbers[7]!, numbers[40]!, 'FUL-30-0201', 'FLG-50-0201', ...(superseded ? [superseded.n] : [])]) {
        const added = await client.send('POST', '/api/cart/lines', { partNumber: n, quantity: 2 });
        expect([201, 200, 409]).toContain(added.status);
      }
      const full = (await parsesToItself(client, '/api/cart', CartViewSchema)) as z.infer<typeof CartViewSchema>;
      expect(full.lines.length).toBeGreaterThan(2);
    }
  });

  it('the parts list, with every sort, category and filter the catalogue offers, for a guest and a dealer', async () => {
    const queries = [
      '',
      '?page=2',
      '?q=ball%20bearing',
      '?q=CHS',
      '?inStock=true',
      '?inStock=false&minHp=200&maxHp=600',
      '?frame=CHS&bearing=ball',
      ...PART_SORTS.map((s) => `?sort=${s}`),
      ...CATEGORY_SLUGS.map((c) => `?category=${c}`),
    ];
    for (const client of [guest, dealer])
      for (const q of queries) {
        const body = (await parsesToItself(client, `/api/parts${q}`, PartsListResponseSchema)) as { items: unknown[] };
        if (q === '' || q.startsWith('?category')) expect(body.items.length, q).toBeGreaterThan(0);
      }
  });

  it('every part’s page, for a guest, and a sample of them for a dealer', async () => {
    const numbers = partNumbers().map((p) => p.n);
    expect(numbers.length).toBeGreaterThan(100);
    for (const n of numbers) await parsesToItself(guest, `/api/parts/${encodeURIComponent(n)}`, PartDetailSchema);
    for (const n of numbers.filter((_, i) => i % 10 === 0)) await parsesToItself(dealer, `/api/parts/${encodeURIComponent(n)}`, PartDetailSchema);
  });

  it('the frames, each frame’s page, and every frame’s compressor map for the fitment check', async () => {
    const frames = (await parsesToItself(guest, '/api/frames', FramesResponseSchema)) as { items: Array<{ code: string }> };
    expect(frames.items.length).toBeGreaterThan(3);
    for (const f of frames.items) await parsesToItself(guest, `/api/frames/${f.code}`, FrameDetailSchema);
    await parsesToItself(dealer, `/api/frames/${frames.items[0]!.code}`, FrameDetailSchema);
    const maps = (await parsesToItself(guest, '/api/fitment/frames', FitmentFrameMapsResponseSchema)) as { items: unknown[] };
    expect(maps.items.length).toBe(frames.items.length);
    // The map's schema has defaults (reference conditions): the server sends them, so parsing has nothing to fill in.
    expect(JSON.stringify(maps)).toContain('"referenceTemperatureK"');
  });

  it('the header’s count of unread notices', async () => {
    for (const client of [customer, dealer]) await parsesToItself(client, '/api/notices/unread', UnreadNoticesSchema);
  });

  it('the server still refuses catalogue filters its schema refuses', async () => {
    for (const q of ['sort=cheapest', 'minHp=abc', 'page=0', 'category=nope', 'frame=chs1', 'inStock=yes', 'minHp=500&maxHp=100']) {
      expect((await guest.get(`/api/parts?${q}`)).status, q).toBe(400);
    }
  });
});
