import { z } from 'zod';
import type { APIRequestContext } from '@playwright/test';
import { expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';
import { emptyCart } from './support/cart';

const PartsSchema = z.object({ items: z.array(z.object({ partNumber: z.string(), title: z.string(), stock: z.object({ available: z.number() }) })) });

// A 1 × 1 PNG (a valid file, so the upload's content check accepts it).
const TINY_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

// The drawings are decorative and hidden from assistive technology, so they are found by their data attribute.
const drawing = (kind?: string) => (kind ? `svg[data-drawing="${kind}"]` : 'svg[data-drawing]');

/** A gasket or fitting in stock whose title has these words; titles stay stable while numbers change. */
async function stockedFitting(request: APIRequestContext, words: string) {
  const items = PartsSchema.parse(await (await request.get('/api/parts?category=gaskets-fittings&pageSize=100')).json()).items;
  const found = items.find((p) => p.title.includes(words) && p.stock.available >= 2);
  if (!found) throw new Error(`no stocked part with “${words}” in the demo catalogue`);
  return found;
}

async function addToCart(request: APIRequestContext, origin: string, partNumber: string) {
  const add = await request.post('/api/cart/lines', { data: { partNumber, quantity: 1 }, headers: { origin } });
  expect(add.ok(), `add ${partNumber}`).toBe(true);
}

const originOf = (baseURL: string | undefined) => new URL(baseURL ?? 'http://127.0.0.1:3100').origin;

test('catalogue items show a drawing of the kind of part, one each, hidden from screen readers', async ({ page, axe }) => {
  await page.goto('/catalogue?category=gauges-sensors');
  const list = page.getByRole('list', { name: 'Parts found' });
  await expect(list.getByRole('listitem').first()).toBeVisible();
  await expect(list.locator(`li > [aria-hidden="true"] > ${drawing()}`)).toHaveCount(await list.getByRole('listitem').count());
  for (const kind of ['dash-gauge', 'sensor-probe', 'plug-in-logger']) await expect(list.locator(drawing(kind)).first()).toBeVisible();
  await axe();
  await keepScreenshot(page, 'illustrations-catalogue-gauges');
});

test('the part page shows the drawing beside the title', async ({ page, axe }) => {
  const clamp = await stockedFitting(page.request, 'V-band clamp');
  await page.goto(`/parts/${encodeURIComponent(clamp.partNumber)}`);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('clamp');
  await expect(page.locator(drawing('v-band-clamp')).first()).toBeVisible();
  await axe();
});

test('cart lines show the drawing of each part', async ({ page, login, axe, baseURL }) => {
  await login('retail');
  const line = await stockedFitting(page.request, 'oil feed line');
  const coupler = await stockedFitting(page.request, 'coupler');
  for (const p of [line, coupler]) await addToCart(page.request, originOf(baseURL), p.partNumber);
  await page.goto('/cart');
  await expect(page.getByRole('listitem', { name: new RegExp(line.partNumber) }).locator(drawing('hose-line'))).toBeVisible();
  await expect(page.getByRole('listitem', { name: new RegExp(coupler.partNumber) }).locator(drawing('silicone-coupler'))).toBeVisible();
  await axe();
  await keepScreenshot(page, 'illustrations-cart');
});

test('pick-list lines show the drawing of each part', async ({ page, login, axe, baseURL }) => {
  const origin = originOf(baseURL);
  await login('dealer');
  await emptyCart(page.request, origin);
  for (const words of ['V-band clamp', 'restrictor']) await addToCart(page.request, origin, (await stockedFitting(page.request, words)).partNumber);
  const checkout = await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: 'PO-E2E-DRAW' }, headers: { origin } });
  expect(checkout.ok(), 'checkout on account').toBe(true);
  const orderNumber = z.object({ order: z.object({ number: z.string() }) }).parse(await checkout.json()).order.number;

  await login('warehouse');
  await page.goto(`/floor/pick?orders=${orderNumber}`);
  const lines = page.getByRole('region', { name: 'Lines in bin walk order' });
  await expect(lines.locator(drawing('v-band-clamp'))).toBeVisible();
  await expect(lines.locator(drawing('small-fitting'))).toBeVisible();
  await axe();
  await keepScreenshot(page, 'illustrations-pick-list');
});

test('an uploaded photo shows instead of the drawing', async ({ page, login, baseURL }) => {
  await login('admin');
  const coupler = await stockedFitting(page.request, 'coupler');
  const upload = await page.request.post(`/api/admin/parts/${encodeURIComponent(coupler.partNumber)}/photos`, {
    multipart: { photo: { name: 'coupler.png', mimeType: 'image/png', buffer: TINY_PNG } },
    headers: { origin: originOf(baseURL) },
  });
  expect(upload.status(), 'photo upload').toBe(201);
  await page.goto(`/catalogue?q=${encodeURIComponent(coupler.partNumber)}`);
  const item = page.getByRole('list', { name: 'Parts found' }).getByRole('listitem').filter({ hasText: coupler.partNumber }).first();
  await expect(item.locator('img[src^="/api/parts/photos/"]')).toHaveCount(1);
  await expect(item.locator(drawing())).toHaveCount(0);
});
