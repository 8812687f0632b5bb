import { request as playwrightRequest, type APIRequestContext } from '@playwright/test';
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

test('a dealer returns an exchange core and sees the deposit credited once the warehouse grades it', async ({ page, login, axe, baseURL }) => {
  const origin = new URL(baseURL ?? '').origin;
  const headers = { origin };

  // Set-up through the API: the dealer orders an exchange unit on account; the warehouse picks and dispatches it.
  await login('dealer');
  const found = await page.request.get('/api/parts?q=exchange%20unit&inStock=true&category=turbochargers&pageSize=50');
  expect(found.ok()).toBe(true);
  const unit = ((await found.json()) as { items: Array<{ partNumber: string; condition: string; coreDepositCents: number }> }).items.find((p) => p.condition === 'exchange');
  if (!unit) throw new Error('the demo catalogue has no exchange unit in stock');
  expect((await page.request.post('/api/cart/lines', { data: { partNumber: unit.partNumber, quantity: 1 }, headers })).ok()).toBe(true);
  const checkout = await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: 'PO-CORE-1' }, headers });
  expect(checkout.status(), await checkout.text()).toBeLessThan(300);
  const orderNumber = ((await checkout.json()) as { order: { number: string } }).order.number;

  const warehouse = await signedIn(baseURL ?? '', 'warehouse');
  const pickList = (await (await warehouse.get(`/api/warehouse/orders/${orderNumber}/pick-list`)).json()) as { lines: Array<{ lineId: number; partNumber: string; toPick: number }> };
  for (const line of pickList.lines) {
    const pick = await warehouse.post(`/api/warehouse/orders/${orderNumber}/picks`, { data: { lineId: line.lineId, scannedPartNumber: line.partNumber, quantity: line.toPick } });
    expect(pick.ok(), await pick.text()).toBe(true);
  }
  const dispatch = await warehouse.post(`/api/warehouse/orders/${orderNumber}/dispatch`, { data: { carrier: 'Tern Parcel', trackingNumber: 'TP-1234', cartons: 1, weightKg: 9 } });
  expect(dispatch.ok(), await dispatch.text()).toBe(true);

  // In the browser: the dealer picks the dispatched line from the returns page and files the core.
  await page.goto('/returns');
  await expect(page.getByRole('heading', { name: 'Your returns' })).toBeVisible();
  await expect(page.getByText('No returns yet')).toBeVisible();
  await page.getByRole('button', { name: 'Return a part' }).click();
  await page.getByRole('radio', { name: new RegExp(orderNumber) }).check();
  await page.getByRole('link', { name: `Return this ${unit.partNumber}` }).click();
  await expect(page).toHaveURL(new RegExp(`/returns/new\\?order=${orderNumber}&line=\\d+`));
  await expect(page.getByRole('heading', { name: 'Return a part' })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'return-new');

  await page.getByRole('radio', { name: /Exchange core/ }).check();
  const deposit = new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(unit.coreDepositCents / 100);
  await expect(page.getByRole('note')).toContainText('How the core deposit comes back');
  await expect(page.getByRole('note')).toContainText(deposit);
  await expect(page.getByLabel('Reason')).not.toHaveValue('');
  await page.getByLabel(/Photos/).setInputFiles({ name: 'core.png', mimeType: 'image/png', buffer: tinyPng() });
  await expect(page.getByRole('img', { name: 'Photo to send: core.png' })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'return-new-core');
  await page.getByRole('button', { name: 'Ask to return it' }).click();

  await expect(page).toHaveURL(/\/returns$/);
  const created = page.getByRole('status').filter({ hasText: /requested/ });
  await expect(created).toBeVisible();
  const item = page.getByRole('list', { name: 'Your returns' }).getByRole('listitem').first();
  await expect(item).toContainText('Requested');
  await expect(item).toContainText('Exchange core');
  await axe();
  await keepScreenshot(page, 'returns-requested');

  // The warehouse receives the core and grades it rebuildable: the deposit comes back as a credit note.
  const open = (await (await warehouse.get('/api/warehouse/returns?status=requested')).json()) as { items: Array<{ id: number; orderNumber: string }> };
  const ret = open.items.find((r) => r.orderNumber === orderNumber);
  if (!ret) throw new Error('the warehouse does not see the return');
  const decided = await warehouse.post(`/api/warehouse/returns/${ret.id}/receive`, { data: { decision: 'core-refund', conditionGrade: 'rebuildable' } });
  expect(decided.ok(), await decided.text()).toBe(true);
  await warehouse.dispose();

  await page.reload();
  const settled = page.getByRole('list', { name: 'Your returns' }).getByRole('listitem').first();
  await expect(settled).toContainText('Credited');
  await expect(settled).toContainText(deposit);
  await expect(settled).toContainText('Core deposit refunded');
  await expect(settled).toContainText(/Credit note/);
  await axe();
  await keepScreenshot(page, 'returns-credited');
});
