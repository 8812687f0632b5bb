import fs from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import { expect, test } from './fixtures';
import { emptyCart } from './support/cart';
import { keepScreenshot, SCREENSHOT_DIR } from './support/screens';
import { receiveStock } from './support/stock';

const PartsSchema = z.object({ items: z.array(z.object({ partNumber: z.string(), condition: z.string(), gtin: z.string(), stock: z.object({ available: z.number() }) })) });
const PickListSchema = z.object({ lines: z.array(z.object({ lineId: z.number(), partNumber: z.string(), toPick: z.number(), picked: z.number() })) });

/** A demo part on sale, new, with stock: its GTIN is what the label carries. */
async function aStockedPart(request: import('@playwright/test').APIRequestContext) {
  const parts = PartsSchema.parse(await (await request.get('/api/parts?category=gaskets-fittings&pageSize=40')).json());
  const part = parts.items.find((p) => p.condition === 'new' && p.stock.available >= 2);
  if (!part) throw new Error('no gasket in stock');
  return part;
}

test('warehouse staff print a sheet of part and bin labels from the Floor, and only the sheet prints', async ({ page, login, axe }) => {
  await login('warehouse');
  const part = await aStockedPart(page.request);
  await page.goto('/floor');
  await page.getByRole('navigation', { name: 'Floor' }).getByRole('link', { name: 'Labels' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Label sheets' })).toBeVisible();

  await page.getByLabel(/^Part numbers or GTINs/).fill(`${part.partNumber.toLowerCase()}*3\n${part.gtin}`);
  await page.getByLabel(/^Bins from/).selectOption('A-01-1');
  await page.getByLabel(/^Bins to/).selectOption('A-02-1');
  await page.getByRole('button', { name: 'Show the labels' }).click();

  // 3 + 1 part labels on one sheet, 8 bin labels (A-01-1 … A-02-1 in walk order: bay 2 runs top-down) on another.
  await expect(page.getByText(/4 part labels and 8 bin labels on 2 A4 sheets/)).toBeVisible();
  const partSheet = page.getByRole('group', { name: 'Sheet 1 of 2: part labels' });
  await expect(partSheet.getByRole('img', { name: `EAN-13 ${part.gtin}` })).toHaveCount(4);
  await expect(partSheet).toContainText(part.partNumber);
  const binSheet = page.getByRole('group', { name: 'Sheet 2 of 2: bin labels' });
  await expect(binSheet.getByRole('img', { name: /^Code 128 A-0[12]-\d$/ })).toHaveCount(8);
  await expect(page.getByRole('button', { name: 'Print' })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'floor-labels');

  // On paper: only the A4 sheets, each its own page, nothing of the form, header or Floor tabs.
  await page.emulateMedia({ media: 'print' });
  await expect(page.getByRole('button', { name: 'Show the labels' })).toBeHidden();
  await expect(page.getByRole('navigation', { name: 'Floor' })).toBeHidden();
  await expect(partSheet).toBeVisible();
  const box = await partSheet.boundingBox();
  // 210 mm at 96 px per inch.
  expect(Math.round(box?.width ?? 0)).toBe(Math.round((210 / 25.4) * 96));
  await keepScreenshot(page, 'floor-labels-print');
  const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  fs.writeFileSync(path.join(SCREENSHOT_DIR, 'floor-labels.pdf'), pdf);
  // Two sheets, two pages.
  expect(pdf.toString('latin1').match(/\/Type\s*\/Page\b/g)?.length).toBe(2);
  await page.emulateMedia({ media: 'screen' });

  await page.setViewportSize({ width: 390, height: 844 });
  await expect(page.getByLabel(/^Part numbers or GTINs/)).toBeVisible();
  await keepScreenshot(page, 'floor-labels-phone');
});

test('warehouse staff pick an order by typing a GTIN and Enter; a wrong check digit is refused and nothing is recorded', async ({
  page,
  login,
  axe,
  baseURL,
  playwright,
}) => {
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
  const part = await aStockedPart(page.request);
  await receiveStock((o) => playwright.request.newContext(o), baseURL ?? origin, [part.partNumber], 2);

  const dealer = await page.request.post('/api/auth/sign-in/email', { data: { email: 'dealer@spoolyard.test', password: 'spoolyard-demo-1' }, headers: { origin } });
  expect(dealer.ok(), 'dealer sign-in').toBe(true);
  await emptyCart(page.request, origin);
  expect((await page.request.post('/api/cart/lines', { data: { partNumber: part.partNumber, quantity: 1 }, headers: { origin } })).ok()).toBe(true);
  const checkout = await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: 'PO-E2E-GTIN' }, headers: { origin } });
  expect(checkout.ok(), 'checkout on account').toBe(true);
  const orderNumber = z.object({ order: z.object({ number: z.string() }) }).parse(await checkout.json()).order.number;

  await login('warehouse');
  await page.goto(`/floor/pick?orders=${orderNumber}`);
  const scan = page.getByLabel('Scan or type the part number');
  const lastScan = page.getByRole('status', { name: 'Last scan' });
  await expect(scan).toBeFocused();

  // The scanner types the 13 digits and Enter; one digit misread makes the check digit wrong.
  const wrong = `${part.gtin.slice(0, 12)}${(Number(part.gtin[12]) + 1) % 10}`;
  await scan.pressSequentially(wrong);
  await scan.press('Enter');
  await expect(lastScan).toContainText(`${wrong} is not a valid GTIN: its check digit is ${wrong[12]}, it should be ${part.gtin[12]}`);
  await expect(scan).toHaveValue('');
  await expect(scan).toBeFocused();
  const list = async () => PickListSchema.parse(await (await page.request.get(`/api/warehouse/orders/${orderNumber}/pick-list`)).json());
  expect((await list()).lines.every((l) => l.picked === 0)).toBe(true);
  await axe();
  await keepScreenshot(page, 'floor-pick-gtin-refused');

  await scan.pressSequentially(part.gtin);
  await scan.press('Enter');
  // A single-order pick moves on to packing once its last line is picked.
  await expect(page).toHaveURL(new RegExp(`/floor/orders/${orderNumber}/pack`));
  await expect(page.getByText(`All lines picked for ${orderNumber}`)).toBeVisible();
  expect((await list()).lines.every((l) => l.toPick === 0 && l.picked === 1)).toBe(true);

  // At the packing bench the same GTIN checks the part against the order before it goes into the carton.
  const check = page.getByLabel('Check a part going into the carton');
  await check.click();
  await check.pressSequentially(part.gtin);
  await check.press('Enter');
  await expect(page.getByRole('status', { name: 'Last check' })).toContainText(`${part.partNumber} belongs in this carton`);
  await check.pressSequentially(wrong);
  await check.press('Enter');
  await expect(page.getByRole('status', { name: 'Last check' })).toContainText('is not a valid GTIN');
  await axe();
  await keepScreenshot(page, 'floor-pack-check');
});

test('goods-in takes a bin label and a GTIN as scanned, and prints labels for what was just received', async ({ page, login, axe }) => {
  await login('warehouse');
  const part = await aStockedPart(page.request);
  await page.goto('/floor/goods-in');
  const field = page.getByLabel('Part number', { exact: true });
  await expect(field).toBeFocused();
  // A bin's label first: it chooses the bin and leaves the field for the part.
  await field.pressSequentially('b031');
  await field.press('Enter');
  await expect(page.getByText('Bin B-03-1 chosen: now scan the part.')).toBeVisible();
  await expect(page.getByLabel(/^Bin/)).toHaveValue('B-03-1');
  await expect(field).toHaveValue('');
  // A GTIN with a misread digit is refused in words; the right one names the part.
  const wrong = `${part.gtin.slice(0, 12)}${(Number(part.gtin[12]) + 1) % 10}`;
  await field.pressSequentially(wrong);
  await field.press('Enter');
  await expect(page.getByText(`${wrong} is not a valid GTIN`).first()).toBeVisible();
  await field.fill('');
  await field.pressSequentially(part.gtin);
  await field.press('Enter');
  await expect(field).toHaveValue(part.partNumber);
  await expect(page.getByText(`GTIN ${part.gtin} is ${part.partNumber}.`)).toBeVisible();
  await expect(page.getByLabel(/^Bin/)).toHaveValue('B-03-1');
  await page.getByLabel('Quantity received').fill('2');
  await page.getByRole('button', { name: 'Receive into bin' }).click();
  const printLink = page.getByRole('link', { name: /^Print labels for GI-\d+ \(2\)$/ });
  await expect(printLink).toBeVisible();
  await axe();
  await keepScreenshot(page, 'floor-goods-in-labels');
  await page.setViewportSize({ width: 390, height: 844 });
  await keepScreenshot(page, 'floor-goods-in-labels-phone');
  await page.setViewportSize({ width: 1280, height: 900 });

  await printLink.click();
  await expect(page).toHaveURL(/\/floor\/labels\?receipts=GI-\d+/);
  const sheet = page.getByRole('group', { name: 'Sheet 1 of 1: part labels' });
  await expect(sheet.getByRole('img', { name: `EAN-13 ${part.gtin}` })).toHaveCount(2);
  await expect(sheet).toContainText('Bin B-03-1');
  await expect(page.getByLabel(/^Goods-in receipts/)).toHaveValue(/^GI-\d+$/);
});

test('the part page shows the GTIN with its EAN-13, and the Office editor shows it read-only', async ({ page, login }) => {
  const part = await aStockedPart(page.request);
  await page.goto(`/parts/${part.partNumber}`);
  const barcode = page.getByRole('img', { name: `EAN-13 barcode of GTIN ${part.gtin}` });
  await expect(barcode).toBeVisible();
  await expect.poll(() => barcode.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
  await expect(page.getByText(`GTIN ${part.gtin}`)).toBeVisible();
  await keepScreenshot(page, 'part-gtin');
  await page.setViewportSize({ width: 390, height: 844 });
  await keepScreenshot(page, 'part-gtin-phone');

  await login('admin');
  await page.setViewportSize({ width: 1280, height: 900 });
  await page.goto(`/office/parts/${part.partNumber}`);
  const gtin = page.getByLabel('GTIN');
  await expect(gtin).toHaveValue(part.gtin);
  await expect(gtin).toHaveAttribute('readonly', '');
  await keepScreenshot(page, 'office-part-gtin');
});

test('the returns desk says what a scanned part or bin label is instead of opening nothing', async ({ page, login }) => {
  await login('warehouse');
  const part = await aStockedPart(page.request);
  await page.goto('/floor/returns');
  const field = page.getByLabel('Return label');
  await field.pressSequentially(part.gtin);
  await field.press('Enter');
  await expect(page.getByText(`That is ${part.partNumber}'s part label, not a return label: scan a return number such as RT-5001`)).toBeVisible();
  await field.fill('');
  await field.pressSequentially('A-01-1');
  await field.press('Enter');
  await expect(page.getByText("That is bin A-01-1's label, not a return label")).toBeVisible();
});
