import { z } from 'zod';
import { expect, test } from './fixtures';
import { emptyCart } from './support/cart';
import { keepScreenshot } from './support/screens';
import { receiveStock } from './support/stock';

const FramePartsSchema = z.object({
  code: z.string(),
  parts: z.array(z.object({ partNumber: z.string(), category: z.string(), condition: z.string(), status: z.string() })),
});
const frameParts = async (request: { get: (url: string) => Promise<{ json: () => Promise<unknown> }> }, code: string) =>
  FramePartsSchema.parse(await (await request.get(`/api/frames/${code}`)).json()).parts;

test('a frame page takes the unit apart: pointing, focusing and choosing a piece opens that piece’s parts of the frame', async ({ page, axe }) => {
  const parts = await frameParts(page.request, 'CHS');
  const housings = parts.filter((p) => p.category === 'compressor-housings').map((p) => p.partNumber);
  const cartridges = parts.filter((p) => p.category === 'cartridges').map((p) => p.partNumber);

  await page.goto('/frames/CHS');
  await expect(page.getByRole('heading', { level: 1, name: 'Chisel' })).toBeVisible();
  const drawing = page.getByRole('group', { name: 'Pieces of frame CHS, taken apart along the shaft' });
  await expect(drawing).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Clocked positions, viewed from the compressor inlet' })).toBeVisible();

  // Pointing at a piece highlights it; choosing it lists exactly the frame's compressor housings.
  const cover = drawing.getByRole('button', { name: `Compressor cover: ${housings.length} parts` });
  await cover.hover();
  await expect(cover).toHaveAttribute('data-lit', 'true');
  await cover.click();
  await expect(cover).toHaveAttribute('aria-pressed', 'true');
  const coverList = page.getByRole('list', { name: 'Compressor cover parts of frame CHS' });
  await expect(coverList.getByRole('link')).toHaveText(housings);
  await expect(page.getByRole('link', { name: `See these ${housings.length} in the catalogue` })).toHaveAttribute('href', '/catalogue?frame=CHS&category=compressor-housings');
  await axe();
  await keepScreenshot(page, 'frame-page-exploded-1280');

  // The keyboard does the same: focus lights a piece, Enter opens it.
  await page.mouse.move(0, 0);
  await cover.focus();
  await page.keyboard.press('Tab');
  const plate = drawing.getByRole('button', { name: /^Adapter \(diffuser\) plate/ });
  await expect(plate).toBeFocused();
  await expect(plate).toHaveAttribute('data-lit', 'true');
  await page.keyboard.press('Tab');
  const cartridge = drawing.getByRole('button', { name: `Cartridge: ${cartridges.length} parts` });
  await expect(cartridge).toBeFocused();
  await page.keyboard.press('Enter');
  await expect(page.getByRole('list', { name: 'Cartridge parts of frame CHS' }).getByRole('link')).toHaveText(cartridges);

  // A piece not sold on its own says so instead of opening an empty list.
  await page.keyboard.press('Tab');
  await page.keyboard.press('Tab');
  const joint = drawing.getByRole('button', { name: /^Turbine housing (bolts|clamp): not sold separately/ });
  await expect(joint).toBeFocused();
  await page.keyboard.press(' ');
  await expect(page.getByText(/Not sold on (its|their) own: the (bolts and clamp plates|clamp) come/)).toBeVisible();

  // At phone width the drawing scales and the list of pieces is the way in.
  await page.setViewportSize({ width: 390, height: 844 });
  const box = await drawing.boundingBox();
  expect(box!.width).toBeLessThanOrEqual(390);
  await page.getByRole('list', { name: 'Pieces of frame CHS' }).getByRole('button', { name: /^Turbine housing: \d+ parts/ }).click();
  await expect(page.getByRole('list', { name: 'Turbine housing parts of frame CHS' }).getByRole('link').first()).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await axe();
  await keepScreenshot(page, 'frame-page-exploded-390');
});

test('a part page shows its own piece lit, and a recommendation links to the frame', async ({ page }) => {
  const parts = await frameParts(page.request, 'GIM');
  const housing = parts.find((p) => p.category === 'turbine-housings' && p.status === 'active')!;
  await page.goto(`/parts/${housing.partNumber}`);
  const drawing = page.getByRole('group', { name: 'Pieces of frame GIM, taken apart along the shaft' });
  // The drawing sits below the specification and loads as the visitor scrolls towards it (at once on a tall screen).
  await expect(async () => {
    await page.mouse.wheel(0, 600);
    await expect(drawing).toBeVisible({ timeout: 500 });
  }).toPass({ timeout: 10_000 });
  await expect(drawing.getByRole('button', { name: /^Turbine housing: / })).toHaveAttribute('aria-pressed', 'true');
  // The larger frames hold the turbine housing with a clamp.
  await expect(drawing.getByRole('button', { name: /^Turbine housing clamp/ })).toBeVisible();
  await page.getByRole('link', { name: 'Frame GIM', exact: true }).click();
  await expect(page).toHaveURL(/\/frames\/GIM$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Gimlet' })).toBeVisible();
});

test('a dealer orders a complete unit built with a chosen orientation; the floor sees it on the pick list and the packing slip', async ({ page, login, baseURL, playwright, axe }) => {
  const base = baseURL ?? 'http://127.0.0.1:3100';
  const origin = new URL(base).origin;
  const unit = (await frameParts(page.request, 'DRF')).find((p) => p.category === 'turbochargers' && p.condition === 'new' && p.status === 'active')!;
  await receiveStock((o) => playwright.request.newContext(o), base, [unit.partNumber], 3);

  await login('dealer');
  await emptyCart(page.request, origin);
  await page.goto(`/parts/${unit.partNumber}`);
  await expect(page.getByText("This is the frame's standard position")).toBeVisible();
  await page.getByLabel('Compressor outlet').selectOption({ label: "3 o'clock" });
  await page.getByLabel('Turbine inlet').selectOption({ label: "8 o'clock" });
  await expect(page.getByText('We build the unit in this position instead of the standard one')).toBeVisible();
  await expect(page.getByRole('figure').filter({ hasText: 'Compressor outlet' })).toContainText("3 o'clock");
  await keepScreenshot(page, 'part-page-orientation');
  await page.getByRole('button', { name: 'Add to cart' }).click();
  await expect(page.getByText('Added to your cart.')).toBeVisible();

  const chosen = "Compressor outlet 3 o'clock, turbine inlet 8 o'clock (viewed from the compressor inlet)";
  await page.goto('/cart');
  await expect(page.getByRole('listitem', { name: new RegExp(unit.partNumber) })).toContainText(chosen);
  await page.getByRole('link', { name: 'Go to checkout' }).click();
  await expect(page.getByText(chosen).first()).toBeVisible();
  await page.getByLabel('Purchase-order number').fill('PO-CLOCK-1');
  await page.getByRole('button', { name: /Place order on account/ }).click();
  await expect(page).toHaveURL(/\/orders\/SY-\d+/);
  const orderNumber = page.url().match(/SY-\d+/)![0];
  await expect(page.getByText(chosen).first()).toBeVisible();
  await page.goto(`/orders/${orderNumber}/invoice`);
  await expect(page.getByText(chosen).first()).toBeVisible();

  await login('warehouse');
  await page.goto(`/floor/pick?orders=${orderNumber}`);
  await expect(page.getByText('Build to:')).toBeVisible();
  await expect(page.getByText(chosen).first()).toBeVisible();
  await axe();
  await keepScreenshot(page, 'floor-pick-orientation');
  await page.goto(`/floor/orders/${orderNumber}/slip`);
  await expect(page.getByRole('heading', { name: 'Packing slip' })).toBeVisible();
  await expect(page.getByText(chosen).first()).toBeVisible();
  await keepScreenshot(page, 'floor-slip-orientation');
});

test('under a fitment recommendation the recommended frame is taken apart, with a way to its frame page', async ({ page, axe }) => {
  await page.goto('/fitment');
  await page.getByRole('radio', { name: /Imperial/ }).check();
  await page.getByLabel('Engine displacement').fill('2.0');
  await page.getByLabel('Power wanted').fill('300');
  await page.getByLabel('Peak-power rpm').fill('6500');
  await page.getByLabel('Fuel', { exact: true }).selectOption('petrol');
  await page.getByLabel('Application', { exact: true }).selectOption('street');
  await page.getByRole('button', { name: 'Check fitment' }).click();
  await expect(page.getByRole('heading', { name: 'Build sheet', level: 2 })).toBeVisible();

  const drawing = page.getByRole('group', { name: 'Pieces of frame DRF, taken apart along the shaft' });
  await drawing.scrollIntoViewIfNeeded();
  await drawing.getByRole('button', { name: /^Turbine housing: \d+ parts/ }).click();
  await expect(page.getByRole('list', { name: 'Turbine housing parts of frame DRF' }).getByRole('link').first()).toContainText('DRF-40-');
  await axe();
  await keepScreenshot(page, 'fitment-exploded-view');
  await page.getByRole('link', { name: 'Everything about frame DRF' }).click();
  await expect(page).toHaveURL(/\/frames\/DRF$/);
});
