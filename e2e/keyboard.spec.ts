import type { Locator, Page } from '@playwright/test';
import { z } from 'zod';
import { DEMO_EMAILS, DEMO_PASSWORD, expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';

/**
 * Each role's main journey with the keyboard alone: no clicks and no fills. Focus moves with Tab (or the keys a
 * screen documents), text is typed into whatever has focus, and Enter or Space acts.
 */

/** Presses Tab (or Shift+Tab) until `target` has focus; fails if it is not reached, i.e. not in the tab order. */
async function tabTo(page: Page, target: Locator, { max = 80, back = false } = {}) {
  for (let i = 0; i < max; i++) {
    if (await target.evaluate((el) => el === document.activeElement).catch(() => false)) return;
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
  }
  await expect(target, `reached with ${back ? 'Shift+Tab' : 'Tab'}`).toBeFocused();
}

/** Presses Tab (or Shift+Tab) until focus is somewhere inside `container` (a radio group takes one tab stop). */
async function tabInto(page: Page, container: Locator, { max = 80, back = false } = {}) {
  for (let i = 0; i < max; i++) {
    if (await container.evaluate((el) => el.contains(document.activeElement)).catch(() => false)) return;
    await page.keyboard.press(back ? 'Shift+Tab' : 'Tab');
  }
  throw new Error(`focus never reached ${container.toString()} with ${back ? 'Shift+Tab' : 'Tab'}`);
}

/** Types into the focused field, replacing what was there. */
async function typeHere(page: Page, text: string) {
  await page.keyboard.press('ControlOrMeta+a');
  await page.keyboard.type(text);
}

const PartsSchema = z.object({ items: z.array(z.object({ partNumber: z.string(), condition: z.string(), stock: z.object({ available: z.number() }) })) });

async function signIn(page: Page, email: string, origin: string) {
  const res = await page.request.post('/api/auth/sign-in/email', { data: { email, password: DEMO_PASSWORD }, headers: { origin } });
  expect(res.ok(), `sign-in as ${email}`).toBe(true);
}

async function emptyCart(page: Page, origin: string) {
  const cart = z.object({ lines: z.array(z.object({ id: z.number() })) }).parse(await (await page.request.get('/api/cart')).json());
  for (const l of cart.lines) await page.request.delete(`/api/cart/lines/${l.id}`, { headers: { origin } });
}

test('a retail buyer searches, opens a part, adds it and reaches the card step with the keyboard alone', async ({ page, baseURL }) => {
  test.slow();
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
  await signIn(page, DEMO_EMAILS.retail, origin);
  await emptyCart(page, origin);
  await page.goto('/');

  // The header's search-as-you-type box (a combobox once its code has loaded, just after the page).
  const search = page.getByRole('combobox', { name: 'Search the catalogue' });
  await expect(search).toBeVisible();
  await tabTo(page, search);
  await page.keyboard.type('gasket');
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/catalogue\?q=gasket/);

  const first = page.getByRole('main').getByRole('link', { name: /gasket/i }).first();
  await expect(first).toBeVisible();
  await tabTo(page, first);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/parts\//);

  const add = page.getByRole('button', { name: 'Add to cart' });
  await tabTo(page, add);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('status').filter({ hasText: 'Added to your cart' })).toBeVisible();

  // Back up to the header's cart link (Shift+Tab), then on to checkout.
  const cartLink = page.getByRole('link', { name: /^Cart/ });
  await tabTo(page, cartLink, { back: true });
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/cart$/);
  const toCheckout = page.getByRole('link', { name: 'Go to checkout' });
  await tabTo(page, toCheckout);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/checkout$/);

  for (const [label, value] of [
    ['Name or company', 'Robin Ashdown'],
    ['Street address', '5 Gasket Row'],
    ['Town or city', 'Emberleigh'],
    ['Postcode', 'EM2 7RD'],
  ] as const) {
    await tabTo(page, page.getByLabel(label, { exact: true }));
    await typeHere(page, value);
  }
  // The card step: the test cards are one radio group; Tab enters it, the arrow keys choose, Space ticks.
  const group = page.getByRole('group', { name: /card/i });
  const cards = group.getByRole('radio');
  await tabInto(page, group, { back: true });
  await page.keyboard.press('Space');
  await expect(group.locator('input:checked')).toHaveCount(1);
  for (let i = 0; i < 6; i++) {
    if (await cards.first().isChecked()) break;
    await page.keyboard.press('ArrowUp');
  }
  await expect(cards.first()).toBeChecked();
  await expect(cards.first()).toBeFocused();
  const pay = page.getByRole('button', { name: /by card/ });
  await tabTo(page, pay);
  await expect(pay).toBeEnabled();
  await keepScreenshot(page, 'keyboard-retail-card-step');
});

test('a dealer types a quick order and places it on account with the keyboard alone', async ({ page, baseURL }) => {
  test.slow();
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
  await signIn(page, DEMO_EMAILS.dealer, origin);
  await emptyCart(page, origin);
  const parts = PartsSchema.parse(await (await page.request.get('/api/parts?limit=40')).json());
  const part = parts.items.find((p) => p.condition === 'new' && p.stock.available >= 3);
  if (!part) throw new Error('no part in stock');

  await page.goto('/trade/quick-order');
  const partField = page.getByLabel('Part number, row 1');
  await tabTo(page, partField);
  await page.keyboard.type(part.partNumber);
  // Enter in a part number moves to its quantity.
  await page.keyboard.press('Enter');
  await expect(page.getByLabel('Quantity, row 1')).toBeFocused();
  await typeHere(page, '2');
  const addAll = page.getByRole('button', { name: 'Add 1 line to cart' });
  await expect(addAll).toBeEnabled();
  await tabTo(page, addAll);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('status').filter({ hasText: /added to your cart/i })).toBeVisible();

  await page.goto('/checkout');
  const po = page.getByLabel(/Purchase-order number/i);
  await tabTo(page, po);
  await typeHere(page, 'PO-KEYS-1');
  const place = page.getByRole('button', { name: /Place order on account/ });
  await tabTo(page, place);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/orders\/SY-\d+/);
  await expect(page.getByText('Thank you: order placed on account')).toBeVisible();
  await keepScreenshot(page, 'keyboard-dealer-placed');
});

test('warehouse staff pick and pack an order with the keyboard alone', async ({ page, baseURL, context }) => {
  test.slow();
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
  await signIn(page, DEMO_EMAILS.dealer, origin);
  await emptyCart(page, origin);
  const parts = PartsSchema.parse(await (await page.request.get('/api/parts?limit=40')).json());
  const part = parts.items.find((p) => p.condition === 'new' && p.stock.available >= 3);
  if (!part) throw new Error('no part in stock');
  expect((await page.request.post('/api/cart/lines', { data: { partNumber: part.partNumber, quantity: 1 }, headers: { origin } })).ok()).toBe(true);
  const checkout = await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: 'PO-KEYS-2' }, headers: { origin } });
  expect(checkout.ok()).toBe(true);
  const order = z.object({ order: z.object({ number: z.string() }) }).parse(await checkout.json()).order.number;
  await context.clearCookies();

  await signIn(page, DEMO_EMAILS.warehouse, origin);
  await page.goto('/floor');
  const open = page.getByRole('link', { name: `Open ${order}` });
  await tabTo(page, open);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(new RegExp(`/floor/pick\\?orders=${order}`));
  // The scan field has focus on arrival; the scanner (here, the keyboard) types and ends with Enter.
  await expect(page.getByLabel('Scan or type the part number')).toBeFocused();
  await page.keyboard.type(part.partNumber);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(new RegExp(`/floor/orders/${order}/pack`));

  for (const [label, value] of [
    ['Cartons', '1'],
    ['Packed weight', '3.5'],
  ] as const) {
    await tabTo(page, page.getByLabel(label));
    await typeHere(page, value);
  }
  const carrier = page.getByLabel('Carrier');
  await tabTo(page, carrier);
  // A closed select takes the first option starting with the typed letters.
  await page.keyboard.type('Tern');
  await expect(carrier).toHaveValue('Tern Parcel');
  await tabTo(page, page.getByLabel('Tracking number'));
  await typeHere(page, 'TP-KEYS-1');
  const dispatch = page.getByRole('button', { name: 'Dispatch' });
  await tabTo(page, dispatch);
  await page.keyboard.press('Enter');
  await expect(page.getByRole('heading', { name: `Dispatched ${order}` })).toBeVisible();
  await keepScreenshot(page, 'keyboard-warehouse-dispatched');
});

test('an administrator finds a part and changes its price with the keyboard alone', async ({ page, baseURL }) => {
  test.slow();
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
  await signIn(page, DEMO_EMAILS.admin, origin);
  await page.goto('/office');
  const catalogue = page.getByRole('list', { name: 'Office screens' }).getByRole('link', { name: /Catalogue/ });
  await tabTo(page, catalogue);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/office\/parts$/);

  await tabTo(page, page.getByLabel('Find a part'));
  await page.keyboard.type('FLG-50-0201');
  await page.keyboard.press('Enter');
  const edit = page.getByRole('main').getByRole('link', { name: 'FLG-50-0201', exact: true }).first();
  await expect(edit).toBeVisible();
  await tabTo(page, edit);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/office\/parts\/FLG-50-0201$/);

  const price = page.getByLabel('Price', { exact: true });
  await tabTo(page, price);
  const before = await price.inputValue();
  const next = (Number(before.replace(/[^0-9.]/g, '')) + 1).toFixed(2);
  await typeHere(page, next);
  const save = page.getByRole('button', { name: 'Save changes' });
  await tabTo(page, save);
  await page.keyboard.press('Enter');
  await expect(page.getByText(/Saved at/)).toBeVisible();
  const stored = z.object({ priceCents: z.number() }).parse(await (await page.request.get('/api/admin/parts/FLG-50-0201')).json());
  expect(stored.priceCents).toBe(Math.round(Number(next) * 100));
  await keepScreenshot(page, 'keyboard-admin-price-saved');

  // Put the price back, the same way: later journeys on this database read the demo price.
  await tabTo(page, price, { back: true });
  await typeHere(page, before.replace(/[^0-9.]/g, ''));
  await tabTo(page, save);
  await page.keyboard.press('Enter');
  await expect
    .poll(async () => z.object({ priceCents: z.number() }).parse(await (await page.request.get('/api/admin/parts/FLG-50-0201')).json()).priceCents)
    .toBe(Math.round(Number(before.replace(/[^0-9.]/g, '')) * 100));
});
