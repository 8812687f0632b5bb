import { z } from 'zod';
import { DEMO_EMAILS, DEMO_PASSWORD, expect, test, type Role } from './fixtures';
import { keepScreenshot } from './support/screens';
import { emptyCart } from './support/cart';

const PHONE = { width: 390, height: 844 };
const PartsSchema = z.object({ items: z.array(z.object({ partNumber: z.string(), condition: z.string(), stock: z.object({ available: z.number() }) })) });
const OrderReplySchema = z.object({ order: z.object({ number: z.string() }) });

async function signInWithTheForm(page: import('@playwright/test').Page, role: Role, path = '/sign-in') {
  await page.goto(path);
  await page.getByLabel('E-mail address').fill(DEMO_EMAILS[role]);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

test.describe('each role lands in its workspace', () => {
  test('warehouse staff land on the Floor, administrators in the Office, and an asked-for page wins', async ({ page, context }) => {
    await signInWithTheForm(page, 'warehouse');
    await expect(page).toHaveURL(/\/floor$/);
    await expect(page.getByRole('heading', { level: 1, name: 'Pick queue' })).toBeVisible();
    await context.clearCookies();

    await signInWithTheForm(page, 'admin');
    await expect(page).toHaveURL(/\/office$/);
    const screens = page.getByRole('list', { name: 'Office screens' });
    for (const name of ['Dealer accounts', 'Payment alerts', 'Mail', 'Catalogue', 'Price list import']) await expect(screens.getByRole('link', { name: new RegExp(name) })).toBeVisible();
    // Counts arrive from the server beside each screen.
    await expect(screens.getByRole('link', { name: /Catalogue/ })).toContainText(/\d+ parts on sale/);
    await expect(screens.getByRole('link', { name: /Dealer accounts/ })).toContainText(/applications? waiting/);
    await keepScreenshot(page, 'office-index');
    await screens.getByRole('link', { name: /Mail/ }).click();
    await expect(page).toHaveURL(/\/office\/mail$/);
    await context.clearCookies();

    await signInWithTheForm(page, 'admin', '/sign-in?next=%2Foffice%2Fparts');
    await expect(page).toHaveURL(/\/office\/parts$/);
    await context.clearCookies();

    await signInWithTheForm(page, 'dealer');
    await expect(page).toHaveURL(/\/$/);
  });
});

test.describe('the Floor on a handheld', () => {
  test('a phone shows the Floor header and the scan field first, focused, on goods-in, stock and a pick list', async ({ page, login, baseURL }) => {
    const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
    await login('dealer');
    await emptyCart(page.request, origin);
    const parts = PartsSchema.parse(await (await page.request.get('/api/parts?limit=40')).json());
    const part = parts.items.find((p) => p.condition === 'new' && p.stock.available >= 3);
    if (!part) throw new Error('no part in stock');
    expect((await page.request.post('/api/cart/lines', { data: { partNumber: part.partNumber, quantity: 1 }, headers: { origin } })).ok()).toBe(true);
    const order = OrderReplySchema.parse(await (await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: 'PO-PHONE-1' }, headers: { origin } })).json()).order.number;

    await login('warehouse');
    await page.setViewportSize(PHONE);
    for (const [path, label] of [
      ['/floor/goods-in', 'Part number'],
      ['/floor/stock', 'Part number'],
      [`/floor/pick?orders=${order}`, 'Scan or type the part number'],
    ] as const) {
      await page.goto(path);
      const scan = page.getByLabel(label, { exact: true });
      await expect(scan).toBeFocused();
      // The Counter's search and cart stay at the Counter; the Floor header is one short row.
      await expect(page.getByRole('search', { name: /catalogue/i })).toHaveCount(0);
      await expect(page.getByRole('link', { name: /^Cart/ })).toHaveCount(0);
      await expect(page.getByLabel('Workspace: Floor')).toBeVisible();
      const box = await scan.boundingBox();
      expect(box, path).not.toBeNull();
      // Before the change the field started about 290 px down, under the shop header; now well within the first screen.
      expect(box!.y, `${path}: scan field top`).toBeLessThan(260);
      await keepScreenshot(page, `floor-phone-${path.split('?')[0]!.replace(/\W+/g, '-')}`);
    }
  });

  test('goods-in clears every field after a receipt, ready for the next carton', async ({ page, login }) => {
    await login('warehouse');
    await page.goto('/floor/goods-in');
    await page.getByLabel('Part number', { exact: true }).fill('FLG-50-0201');
    await page.getByLabel('Part number', { exact: true }).press('Enter');
    await expect(page.getByText(/Now in|Not stocked in any bin yet/)).toBeVisible();
    await expect(page.getByLabel('Bin')).not.toHaveValue('');
    await page.getByLabel('Quantity received').fill('4');
    await page.getByLabel(/^Note/).fill('carton 1 of 2');
    await page.getByRole('button', { name: 'Receive into bin' }).click();
    await expect(page.getByRole('region', { name: 'Last receipt' })).toContainText('FLG-50-0201');
    for (const field of [page.getByLabel('Part number', { exact: true }), page.getByLabel('Quantity received'), page.getByLabel(/^Note/)]) await expect(field).toHaveValue('');
    await expect(page.getByLabel('Bin')).toHaveValue('');
    await expect(page.getByLabel('Part number', { exact: true })).toBeFocused();
  });
});

test('on a phone the stock list keeps Fix and Drop beside each row on screen, and the form empties once the rows are in the cart', async ({ page, login }) => {
  await login('dealer');
  await page.setViewportSize(PHONE);
  await page.goto('/trade/stock-list');
  await page.getByLabel('Stock list (CSV)').setInputFiles({ name: 'phone.csv', mimeType: 'text/csv', buffer: Buffer.from(['part,qty', 'FLG-50-0201,2', 'AWL-10-020,2', ''].join('\n')) });
  await page.getByRole('button', { name: 'Upload and check' }).click();
  const fix = page.getByRole('button', { name: 'Fix row 2' });
  const drop = page.getByRole('button', { name: 'Drop row 2' });
  await fix.scrollIntoViewIfNeeded();
  await expect(fix).toBeInViewport({ ratio: 1 });
  await expect(drop).toBeInViewport({ ratio: 1 });
  expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0);
  await keepScreenshot(page, 'stock-list-phone');
  await drop.click();
  await expect(page.getByRole('button', { name: 'Keep row 2' })).toBeInViewport();
  // Once the good rows are in the cart, the form is empty again, ready for next week's list.
  await page.getByRole('button', { name: 'Add 1 valid line to cart' }).click();
  await expect(page.getByRole('status').filter({ hasText: /added to your cart/i })).toBeVisible();
  await expect(page.getByLabel('Stock list (CSV)')).toHaveValue('');
});

test('a declined card order says when it was cancelled, and stops saying the parts are in the cart once the cart changed', async ({ page, baseURL }) => {
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
  const signIn = await page.request.post('/api/auth/sign-in/email', { data: { email: DEMO_EMAILS.retail, password: DEMO_PASSWORD }, headers: { origin } });
  expect(signIn.ok()).toBe(true);
  const parts = PartsSchema.parse(await (await page.request.get('/api/parts?limit=40')).json());
  const part = parts.items.find((p) => p.condition === 'new' && p.stock.available >= 3);
  if (!part) throw new Error('no part in stock');
  // Start from an empty cart, so "still there" is about this order's parts.
  const cart = z.object({ lines: z.array(z.object({ id: z.number() })) }).parse(await (await page.request.get('/api/cart')).json());
  for (const l of cart.lines) await page.request.delete(`/api/cart/lines/${l.id}`, { headers: { origin } });
  expect((await page.request.post('/api/cart/lines', { data: { partNumber: part.partNumber, quantity: 2 }, headers: { origin } })).ok()).toBe(true);
  const declined = await page.request.post('/api/checkout', {
    data: { method: 'card', paymentMethod: 'pm_card_chargeDeclined', delivery: { name: 'Robin Ashdown', line1: '5 Gasket Row', city: 'Emberleigh', postcode: 'EM2 7RD' } },
    headers: { origin },
  });
  expect(declined.ok()).toBe(false);
  const orders = z.object({ items: z.array(z.object({ number: z.string(), status: z.string() })) }).parse(await (await page.request.get('/api/orders')).json());
  const cancelled = orders.items.find((o) => o.status === 'cancelled');
  if (!cancelled) throw new Error('no cancelled order');

  await page.goto(`/orders/${cancelled.number}`);
  const banner = page.getByRole('status').filter({ hasText: 'Payment not completed' });
  await expect(banner).toContainText('this order was cancelled on');
  await expect(banner).toContainText('Your card was declined');
  await expect(banner).toContainText(/No (payment|money) was taken/);
  await expect(banner).toContainText('are still there');
  await expect(banner.getByRole('link', { name: 'Go to your cart' })).toBeVisible();
  await keepScreenshot(page, 'order-cancelled-parts-in-cart');

  // The buyer empties the cart: the banner no longer claims the parts are there.
  const now = z.object({ lines: z.array(z.object({ id: z.number() })) }).parse(await (await page.request.get('/api/cart')).json());
  for (const l of now.lines) expect((await page.request.delete(`/api/cart/lines/${l.id}`, { headers: { origin } })).ok()).toBe(true);
  await page.reload();
  await expect(banner).toContainText('your cart has changed since');
  await expect(banner).not.toContainText('still there');
  await expect(banner.getByRole('link', { name: 'Go to your cart' })).toHaveCount(0);
  await keepScreenshot(page, 'order-cancelled-cart-changed');
});

test('the fitment check says "in your cart" where the buyer is looking, on a phone', async ({ page }) => {
  await page.setViewportSize(PHONE);
  await page.goto('/fitment');
  await page.getByLabel('Engine displacement').fill('2.0');
  await page.getByLabel('Power wanted').fill('220');
  await page.getByLabel('Peak-power rpm').fill('6500');
  await page.getByLabel('Fuel', { exact: true }).selectOption('petrol');
  await page.getByLabel('Application', { exact: true }).selectOption('street');
  await page.getByRole('button', { name: 'Check fitment' }).click();
  const add = page.getByRole('button', { name: 'Add the whole build to the cart' });
  await add.click();
  const done = page.getByRole('status').filter({ hasText: 'The build is in your cart' });
  await expect(done).toBeInViewport({ ratio: 1 });
  await keepScreenshot(page, 'fitment-added-phone');
});

test('an expired confirmation link explains itself and sends a new one', async ({ page, axe }) => {
  await page.goto('/email-confirmed?next=%2Fcheckout&error=TOKEN_EXPIRED');
  await expect(page.getByRole('heading', { level: 1, name: 'This confirmation link has expired' })).toBeVisible();
  await expect(page.getByText('Confirmation links work for 24 hours')).toBeVisible();
  await expect(page.getByText('TOKEN_EXPIRED')).toHaveCount(0);
  await page.getByLabel('E-mail address').fill('nobody-waiting@example.test');
  await page.getByRole('button', { name: 'Send a new link' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Check your e-mail' })).toContainText('nobody-waiting@example.test');
  await expect(page.getByLabel('E-mail address')).toHaveValue('');
  await axe();
  await keepScreenshot(page, 'confirm-link-expired');

  await page.goto('/email-confirmed?error=INVALID_TOKEN');
  await expect(page.getByRole('heading', { level: 1, name: 'This confirmation link does not work' })).toBeVisible();
});
