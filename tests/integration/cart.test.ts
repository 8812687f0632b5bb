import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CartViewSchema } from '../../shared/schemas/orders';
import { createCustomer, createDealer } from '../support/factories';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('cart', () => {
  it('keeps a guest cart by cookie and merges it into the user’s cart at sign-in', async () => {
    const add = await fetch(`${t.url}/api/cart/lines`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ partNumber: 'FLG-50-0201', quantity: 2 }) });
    expect(add.status).toBe(201);
    const cookie = add.headers.getSetCookie().find((c) => c.startsWith('sy_cart='))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const guestCookie = cookie.split(';')[0]!;
    const asGuest = CartViewSchema.parse(await (await fetch(`${t.url}/api/cart`, { headers: { cookie: guestCookie } })).json());
    expect(asGuest.lines.map((l) => [l.partNumber, l.quantity])).toEqual([['FLG-50-0201', 2]]);

    const { client: user } = await createCustomer(t);
    await user.send('POST', '/api/cart/lines', { partNumber: 'FLG-50-0201', quantity: 1 });
    // The first request carrying both the session and the guest cookie merges the carts.
    const merged = await fetch(`${t.url}/api/cart`, { headers: { cookie: `${user.cookie()}; ${guestCookie}` } });
    const view = CartViewSchema.parse(await merged.json());
    expect(view.lines.find((l) => l.partNumber === 'FLG-50-0201')?.quantity).toBe(3);
    expect(merged.headers.getSetCookie().some((c) => c.startsWith('sy_cart=;'))).toBe(true);
    const guestAfter = CartViewSchema.parse(await (await fetch(`${t.url}/api/cart`, { headers: { cookie: guestCookie } })).json());
    expect(guestAfter.lines).toEqual([]);
  });

  it('warns when housings, cartridges or gaskets do not match the frame or flange of another line', async () => {
    const { client: user } = await createDealer(t);
    const add = async (partNumber: string) => CartViewSchema.parse((await user.send('POST', '/api/cart/lines', { partNumber, quantity: 1 })).body);
    expect((await add('CHS-20-0201')).warnings).toEqual([]);
    const housing = await add('FUL-30-0201');
    expect(housing.warnings.map((w) => w.message).join(' ')).toMatch(/FUL-30-0201 is for frame FUL.*CHS-20-0201.*frame CHS/);
    const sameFrame = await add('CHS-40-0201');
    expect(sameFrame.warnings.some((w) => w.message.startsWith('CHS-40-0201'))).toBe(false);
    // A 2-bolt gasket against the 4-bolt turbine flange of the CHS housing.
    const gasket = await add('FLG-50-0201');
    expect(gasket.warnings.some((w) => /FLG-50-0201 is for a 2-bolt oval 38 flange/.test(w.message))).toBe(true);
  });

  it('replaces a superseded number with its successor and says so; refuses unknown parts with a suggestion', async () => {
    const { client: user } = await createCustomer(t);
    const [old] = t.db.$client.prepare("SELECT part_number AS n, superseded_by AS s FROM parts WHERE status = 'superseded' AND category = 'gaskets-fittings' LIMIT 1").all() as Array<{ n: string; s: string }>;
    const res = await user.send('POST', '/api/cart/lines', { partNumber: old!.n, quantity: 1 });
    const view = CartViewSchema.parse(res.body);
    expect(view.lines.some((l) => l.partNumber === old!.s)).toBe(true);
    expect(view.notices.join(' ')).toContain(`${old!.n} is superseded`);
    const unknown = await user.send('POST', '/api/cart/lines', { partNumber: 'AWL-50-0291', quantity: 1 });
    expect(unknown.status).toBe(404);
    expect((unknown.body as { error: { message: string } }).error.message).toMatch(/Did you mean AWL-50-02/);
    expect((await user.send('POST', '/api/cart/lines', { partNumber: 'FLG-50-0201', quantity: 1.5 })).status).toBe(400);
    expect((await user.send('POST', '/api/cart/lines', { partNumber: 'FLG-50-0201', quantity: 1, allowBackorder: true })).status).toBe(403);
  });
});
