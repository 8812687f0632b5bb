import { request as playwrightRequest, type APIRequestContext, type Page } from '@playwright/test';
import { deflateSync } from 'node:zlib';
import { DEMO_EMAILS, DEMO_PASSWORD, expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';

/** A 2×2 PNG built by hand, so the spec needs no image file. */
function tinyPng(): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (buf: Buffer) => {
    let c = 0xffffffff;
    for (const b of buf) c = (crcTable[(c ^ b) & 0xff] ?? 0) ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const sum = Buffer.alloc(4);
    sum.writeUInt32BE(crc(body));
    return Buffer.concat([len, body, sum]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(2, 0);
  ihdr.writeUInt32BE(2, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour
  const rows = Buffer.from([0, 200, 60, 40, 200, 60, 40, 0, 200, 60, 40, 200, 60, 40]);
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(rows)), chunk('IEND', Buffer.alloc(0))]);
}

async function signedIn(baseURL: string, role: 'warehouse'): Promise<APIRequestContext> {
  const origin = new URL(baseURL).origin;
  const ctx = await playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { origin } });
  const res = await ctx.post('/api/auth/sign-in/email', { data: { email: DEMO_EMAILS[role], password: DEMO_PASSWORD } });
  expect(res.ok(), `sign-in as ${role}`).toBe(true);
  return ctx;
}

const money = (cents: number) => new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(cents / 100);

/**
 * Through the API: the dealer orders two of an exchange unit on account; the warehouse finds only one on the shelf,
 * so one is dispatched and the other stays on back-order.
 */
async function partlyShippedCoreOrder(page: Page, baseURL: string, tracking: string) {
  const headers = { origin: new URL(baseURL).origin };
  // Start from an empty cart: the order must hold only the exchange unit, whatever an earlier journey left.
  const cart = (await (await page.request.get('/api/cart')).json()) as { lines: Array<{ id: number }> };
  for (const line of cart.lines) expect((await page.request.delete(`/api/cart/lines/${line.id}`, { headers })).ok()).toBe(true);
  const found = await page.request.get('/api/parts?q=exchange%20unit&inStock=true&category=turbochargers&pageSize=50');
  expect(found.ok()).toBe(true);
  const items = ((await found.json()) as { items: Array<{ partNumber: string; condition: string; coreDepositCents: number; stock: { available: number } }> }).items;
  const unit = items.find((p) => p.condition === 'exchange' && p.stock.available >= 2);
  if (!unit) throw new Error('the demo catalogue has no exchange unit with two in stock');
  expect((await page.request.post('/api/cart/lines', { data: { partNumber: unit.partNumber, quantity: 2 }, headers })).ok()).toBe(true);
  const checkout = await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: `PO-${tracking}` }, headers });
  expect(checkout.status(), await checkout.text()).toBeLessThan(300);
  const orderNumber = ((await checkout.json()) as { order: { number: string } }).order.number;

  const warehouse = await signedIn(baseURL, 'warehouse');
  const pickList = (await (await warehouse.get(`/api/warehouse/orders/${orderNumber}/pick-list`)).json()) as { lines: Array<{ lineId: number; partNumber: string }> };
  const line = pickList.lines[0]!;
  const pick = await warehouse.post(`/api/warehouse/orders/${orderNumber}/picks`, { data: { lineId: line.lineId, scannedPartNumber: line.partNumber, quantity: 1, short: true } });
  expect(pick.ok(), await pick.text()).toBe(true);
  const dispatch = await warehouse.post(`/api/warehouse/orders/${orderNumber}/dispatch`, { data: { carrier: 'Tern Parcel', trackingNumber: tracking, cartons: 1, weightKg: 9 } });
  expect(dispatch.ok(), await dispatch.text()).toBe(true);
  await warehouse.dispose();
  return { orderNumber, unit };
}

for (const screen of [
  { name: 'desktop', viewport: { width: 1280, height: 800 } },
  { name: 'phone', viewport: { width: 390, height: 844 } },
]) {
  test.describe(`on a ${screen.name}`, () => {
    test.use({ viewport: screen.viewport });

    test('a dealer returns the dispatched core of a partly shipped order, prints its label, and the Floor scans it and settles only the deposit', async ({ page, login, axe, baseURL }) => {
      test.setTimeout(180_000);
      const tracking = `TP-${screen.name.toUpperCase()}-${Date.now() % 100000}`;
      await login('dealer');
      const { orderNumber, unit } = await partlyShippedCoreOrder(page, baseURL ?? '', tracking);

      // The order page: the carrier's tracking page is a link, and the dispatched line has its own Return button.
      await page.goto(`/orders/${orderNumber}`);
      await expect(page.getByRole('heading', { name: `Order ${orderNumber}` })).toBeVisible();
      await expect(page.getByText('1 of 2 dispatched')).toBeVisible();
      const trackingLink = page.getByRole('link', { name: new RegExp(tracking) });
      await expect(trackingLink).toHaveAttribute('href', `https://www.ternparcel.example/track?parcel=${tracking}`);
      await expect(trackingLink).toHaveAttribute('target', '_blank');
      await axe();
      await keepScreenshot(page, `order-return-button-${screen.name}`);
      await page.getByRole('link', { name: `Return ${unit.partNumber}` }).click();

      await expect(page.getByRole('heading', { name: 'Return a part' })).toBeVisible();
      await expect(page.getByText('1 of 2')).toBeVisible();
      await expect(page.getByLabel('Quantity')).toHaveAccessibleDescription(/Up to 1/);
      await page.getByRole('radio', { name: /Exchange core/ }).check();
      await expect(page.getByRole('note')).toContainText(money(unit.coreDepositCents));
      await page.getByLabel(/Photos/).setInputFiles({ name: 'core.png', mimeType: 'image/png', buffer: tinyPng() });
      await page.getByRole('button', { name: 'Ask to return it' }).click();

      // Authorised at once: the banner leads to the label.
      const banner = page.getByRole('status').filter({ hasText: /is authorised/ });
      await expect(banner).toBeVisible();
      const reference = /RT-\d+/.exec((await banner.textContent()) ?? '')?.[0];
      if (!reference) throw new Error('no return reference in the banner');
      const item = page.getByRole('listitem', { name: `Return ${reference}` });
      await expect(item).toContainText('Authorised');
      await axe();
      await keepScreenshot(page, `returns-authorised-${screen.name}`);
      await banner.getByRole('link', { name: 'Print the return label' }).click();

      await expect(page.getByRole('heading', { name: `Return label ${reference}` })).toBeVisible();
      const label = page.getByRole('article', { name: `Return label ${reference}` });
      const barcode = label.getByRole('img', { name: `Barcode of return ${reference}` });
      await expect(barcode).toBeVisible();
      expect(await barcode.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
      await expect(label).toContainText(unit.partNumber);
      await expect(label).toContainText(orderNumber);
      await axe();
      await keepScreenshot(page, `return-label-${screen.name}`);
      // On paper only the label is left: no header, no buttons, no packing notes.
      await page.emulateMedia({ media: 'print' });
      await expect(page.getByRole('button', { name: 'Print the label' })).toBeHidden();
      await expect(page.getByRole('banner')).toBeHidden();
      await expect(barcode).toBeVisible();
      await keepScreenshot(page, `return-label-print-${screen.name}`);
      await page.emulateMedia({ media: 'screen' });

      // The Floor: the label's code typed as a keyboard-wedge scanner types it, then Enter.
      await login('warehouse');
      await page.goto('/floor/returns');
      const scan = page.getByLabel('Return label');
      await expect(scan).toBeFocused();
      await page.keyboard.type(reference);
      await page.keyboard.press('Enter');
      await expect(page.getByRole('heading', { name: `Return ${reference}` })).toBeVisible();
      await expect(page.getByText('The customer keeps the exchange unit')).toBeVisible();
      const decisions = page.getByRole('group', { name: 'Decision' }).getByRole('radio');
      await expect(decisions).toHaveCount(3);
      await expect(page.getByRole('radio', { name: /Refund the deposit/ })).toBeVisible();
      await expect(page.getByRole('radio', { name: /Refund part of the deposit/ })).toBeVisible();
      await expect(page.getByRole('radio', { name: 'Reject the core' })).toBeVisible();
      await expect(page.getByRole('radio', { name: /Full refund/ })).toHaveCount(0);
      await expect(page.getByLabel('Restock it')).toHaveCount(0);
      await axe();
      await keepScreenshot(page, `floor-core-decision-${screen.name}`);

      await page.getByLabel('Condition').selectOption('damaged');
      await page.getByRole('radio', { name: /Refund part of the deposit/ }).check();
      const part = Math.round(unit.coreDepositCents / 2);
      await page.getByLabel('Deposit to refund').fill((part / 100).toFixed(2));
      await page.getByRole('button', { name: 'Refund the deposit and close' }).click();
      await expect(page.getByText('say why it is less than the most').first()).toBeVisible();
      await page.getByLabel('Why less').fill('Cracked turbine housing flange');
      await page.getByRole('button', { name: 'Refund the deposit and close' }).click();
      await expect(page.getByRole('status').filter({ hasText: /Credit note CN-\d+ for/ })).toBeVisible();
      await keepScreenshot(page, `floor-core-decided-${screen.name}`);

      // Back as the dealer: the bell counts the news; the notice leads to the decision.
      await login('dealer');
      await page.goto('/returns');
      const bell = page.getByRole('link', { name: /^Notices, \d+ unread$/ });
      await expect(bell).toBeVisible();
      await bell.click();
      await expect(page.getByRole('heading', { name: 'Notices' })).toBeVisible();
      await expect(page.getByRole('listitem', { name: `Unread: Return ${reference} decided` })).toContainText(money(part));
      await expect(page.getByRole('listitem', { name: `Unread: ${orderNumber} is on its way` })).toContainText(tracking);
      await axe();
      await keepScreenshot(page, `notices-${screen.name}`);
      await page.getByRole('button', { name: 'Mark all read' }).click();
      await expect(page.getByRole('link', { name: 'Notices, none unread' })).toBeVisible();
      await expect(page.getByText('All read.')).toBeVisible();

      // The account menu leads to the returns, where the settled core says why it was less.
      await page.getByRole('button', { name: /Account menu for/ }).click();
      await page.getByRole('menuitem', { name: 'Returns' }).click();
      await expect(page).toHaveURL(/\/returns$/);
      const settled = page.getByRole('listitem', { name: `Return ${reference}` });
      await expect(settled).toContainText('Credited');
      await expect(settled).toContainText('Why less: Cracked turbine housing flange');
      await expect(settled.getByRole('link', { name: /Print return label/ })).toHaveCount(0);
      await axe();
      await keepScreenshot(page, `returns-credited-${screen.name}`);
    });
  });
}
