import { z } from 'zod';
import { expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';
import { receiveStock } from './support/stock';

const PartsSchema = z.object({ items: z.array(z.object({ partNumber: z.string(), condition: z.string(), stock: z.object({ available: z.number() }) })) });
const available = async (request: import('@playwright/test').APIRequestContext, partNumber: string) =>
  z.object({ stock: z.object({ available: z.number() }) }).parse(await (await request.get(`/api/parts/${partNumber}`)).json()).stock.available;

/** Both widths the shop is looked at in: a full screen and a phone. */
async function shots(page: import('@playwright/test').Page, name: string) {
  await page.setViewportSize({ width: 390, height: 844 });
  await keepScreenshot(page, `${name}-390`);
  await page.setViewportSize({ width: 1280, height: 900 });
  await keepScreenshot(page, `${name}-1280`);
}

test('a dealer books a unit in; the Bench receives it by scan, inspects, quotes, rebuilds from stock and ships it back with an invoice', async ({ page, login, axe, playwright, baseURL }) => {
  test.setTimeout(180_000);
  const base = baseURL ?? 'http://127.0.0.1:3100';
  await page.setViewportSize({ width: 1280, height: 900 });
  // A gasket the rebuild consumes, stocked up first so the journey does not depend on earlier ones.
  const parts = PartsSchema.parse(await (await page.request.get('/api/parts?category=gaskets-fittings&pageSize=20')).json());
  const kit = parts.items.find((p) => p.condition === 'new');
  if (!kit) throw new Error('no gasket in the demo catalogue');
  await receiveStock((o) => playwright.request.newContext(o), base, [kit.partNumber], 5);

  // The dealer books the unit in: no serial of ours, so it is registered and given one.
  await login('dealer');
  await page.goto('/service/new');
  await expect(page.getByRole('heading', { level: 1, name: 'Book a unit in for service' })).toBeVisible({ timeout: 20_000 });
  await page.getByRole('button', { name: 'Book it in' }).click();
  await expect(page.getByRole('alert').first()).toBeVisible();
  await page.getByLabel(/No serial, or not bought from us/).check();
  await page.getByLabel('Frame').selectOption('CHS');
  await page.getByLabel('Bearing').selectOption('journal');
  await page.getByLabel('How it is used').selectOption('circuit');
  await page.getByLabel('Blue smoke or oil in the intake or exhaust').check();
  await page.getByLabel('In your words').fill('Smokes on overrun after a track day');
  await axe();
  await shots(page, 'bench-01-booking');
  await page.getByRole('button', { name: 'Book it in' }).click();
  const heading = page.getByRole('heading', { level: 1, name: /Service request SR-\d+/ });
  await expect(heading).toBeVisible({ timeout: 15_000 });
  const reference = ((await heading.textContent()) ?? '').match(/SR-\d+/)?.[0] ?? '';
  expect(reference).toMatch(/^SR-\d+$/);
  await axe();
  await shots(page, 'bench-02-booked');

  await page.getByRole('link', { name: 'Print the label' }).click();
  await expect(page.getByRole('img', { name: `Barcode of service request ${reference}` })).toBeVisible();
  await expect(page.getByText('Drain the oil and cap the oil feed')).toBeVisible();
  await axe();
  await shots(page, 'bench-03-label');

  // The Bench receives it by scanning the label, as a keyboard-wedge scanner types it.
  await login('workshop');
  await page.goto('/bench');
  const scan = page.getByLabel('Scan request or serial');
  await expect(scan).toBeFocused({ timeout: 20_000 });
  await scan.fill('RT-5001');
  await scan.press('Enter');
  await expect(page.getByRole('status', { name: 'Last scan' })).toContainText('is not a request or a serial');
  await scan.fill(reference.toLowerCase().replace('-', ' '));
  await scan.press('Enter');
  await expect(page.getByRole('status', { name: 'Last scan' })).toContainText(`${reference} received`);
  await axe();
  await shots(page, 'bench-04-received');

  await page.getByLabel('Shaft play, axial').fill('0.12');
  await page.getByLabel('Shaft play, radial').fill('0.30');
  await expect(page.getByText(/Limit 0.08 mm for this frame and bearing — OVER THE LIMIT/)).toBeVisible();
  await page.getByLabel('Compressor wheel damage').selectOption('light');
  await page.getByLabel('Oil on the compressor side').check();
  await page.getByRole('button', { name: 'Record the inspection' }).click();

  await expect(page.getByRole('heading', { name: 'Quote', exact: true })).toBeVisible();
  await page.getByRole('button', { name: 'Send the quote' }).click();
  await expect(page.getByText('a quote needs at least one part line')).toBeVisible();
  await page.getByRole('button', { name: 'Add a part line' }).click();
  await page.getByLabel('Part number, line 1').fill(kit.partNumber);
  await page.getByLabel('Qty').fill('2');
  await page.getByLabel('Labour').fill('1.5');
  await axe();
  await shots(page, 'bench-05-quote');
  await page.getByRole('button', { name: 'Send the quote' }).click();
  await expect(page.getByText('Waiting for the customer to approve or decline')).toBeVisible();

  // The dealer approves on account.
  await login('dealer');
  await page.goto(`/service/${reference}`);
  await expect(page.getByRole('heading', { name: 'Your decision' })).toBeVisible({ timeout: 20_000 });
  await page.getByLabel('Purchase-order number').fill('PO-BENCH-E2E');
  await axe();
  await shots(page, 'bench-06-decide');
  await page.getByRole('button', { name: /^Approve and put on account/ }).click();
  await expect(page.getByText('Approved — being rebuilt').first()).toBeVisible();

  // The workshop rebuilds it: the gaskets leave stock; balance and test are recorded.
  const before = await available(page.request, kit.partNumber);
  await login('workshop');
  await page.goto(`/bench?queue=approved&ref=${reference}`);
  await expect(page.getByRole('heading', { name: 'Rebuild, balance and test' })).toBeVisible({ timeout: 20_000 });
  await expect(page.getByRole('complementary', { name: 'Working safely' })).toContainText('never touch them while they spin');
  await page.getByLabel('Before, compressor plane').fill('0.9');
  await page.getByLabel('Before, turbine plane').fill('0.7');
  await page.getByLabel('After, compressor plane').fill('0.004');
  await page.getByLabel('After, turbine plane').fill('0.005');
  await page.getByLabel('Oil pressure at test').fill('280');
  await page.getByLabel('End float after rebuild').fill('0.04');
  await axe();
  await shots(page, 'bench-07-rebuild');
  await page.getByRole('button', { name: 'Record the rebuild and take the parts from stock' }).click();
  await expect(page.getByRole('heading', { name: /Ship back/ })).toBeVisible();
  expect(await available(page.request, kit.partNumber)).toBe(before - 2);

  await page.getByLabel('Carrier').selectOption('Tern Parcel');
  await page.getByLabel('Tracking number').fill('TP-BENCH-E2E');
  await page.getByRole('button', { name: 'Ship and invoice' }).click();
  await expect(page.getByRole('link', { name: /Invoice SV-\d+/ })).toBeVisible();
  await shots(page, 'bench-08-shipped');

  // The dealer sees it on its way, with the tracking link and the invoice.
  await login('dealer');
  await page.goto(`/service/${reference}`);
  await expect(page.getByRole('link', { name: 'Track the parcel' })).toHaveAttribute('href', /TP-BENCH-E2E/, { timeout: 20_000 });
  await page.getByRole('link', { name: /Invoice SV-\d+/ }).click();
  await expect(page.getByRole('heading', { name: /Service invoice SV-\d+/ })).toBeVisible();
  await expect(page.getByText(/On account: due/)).toBeVisible();
  await axe();
  await shots(page, 'bench-09-invoice');
  await page.goto('/service');
  await expect(page.getByRole('link', { name: reference })).toBeVisible({ timeout: 20_000 });
  await shots(page, 'bench-10-list');
});
