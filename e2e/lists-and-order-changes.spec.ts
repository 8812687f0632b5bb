import type { APIRequestContext, Page } from '@playwright/test';
import { DEMO_EMAILS, DEMO_PASSWORD, expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';
import { receiveStock } from './support/stock';

// The machine is shared: screens wait for their data a little longer than the default.
const see = expect.configure({ timeout: 15_000 });

const VIEWS = [
  { name: 'desktop', width: 1280, height: 800 },
  { name: 'phone', width: 390, height: 844 },
] as const;

const DELIVERY = { name: 'Robin Ashdown', line1: '5 Test Row', city: 'Quenchfold', postcode: 'QF2 4AB' };

/** Puts lines in the signed-in user's cart and checks out through the API; answers the order number once it is settled. */
async function placeOrder(page: Page, lines: Array<{ partNumber: string; quantity: number }>, method: 'account' | 'card') {
  const o = { headers: { origin: new URL(page.url()).origin } };
  for (const l of lines) expect((await page.request.post('/api/cart/lines', { data: l, ...o })).status()).toBe(201);
  const body = method === 'account' ? { method, purchaseOrder: `LIST-${Date.now() % 100_000}` } : { method, paymentMethod: 'pm_card_visa', delivery: DELIVERY };
  const res = await page.request.post('/api/checkout', { data: body, ...o });
  expect(res.status(), await res.text()).toBe(201);
  const number = ((await res.json()) as { order: { number: string } }).order.number;
  await expect.poll(async () => ((await (await page.request.get(`/api/orders/${number}`)).json()) as { status: string }).status).toMatch(/^(paid|on_account)$/);
  return number;
}

/** A warehouse session of its own that picks one unit of the first line, so picking has started. */
async function startPicking(request: APIRequestContext, baseURL: string, number: string) {
  const origin = new URL(baseURL).origin;
  expect((await request.post('/api/auth/sign-in/email', { data: { email: DEMO_EMAILS.warehouse, password: DEMO_PASSWORD }, headers: { origin } })).ok()).toBe(true);
  const list = (await (await request.get(`/api/warehouse/orders/${number}/pick-list`)).json()) as { lines: Array<{ lineId: number; partNumber: string }> };
  const line = list.lines[0]!;
  const res = await request.post(`/api/warehouse/orders/${number}/picks`, { data: { lineId: line.lineId, scannedPartNumber: line.partNumber, quantity: 1 }, headers: { origin } });
  expect(res.status(), await res.text()).toBe(200);
}

async function emptyCart(page: Page) {
  const origin = new URL(page.url()).origin;
  const cart = (await (await page.request.get('/api/cart')).json()) as { lines: Array<{ id: number }> };
  for (const line of cart.lines) expect((await page.request.delete(`/api/cart/lines/${line.id}`, { headers: { origin } })).ok()).toBe(true);
}

// The journeys order these: stock them up, whatever earlier journeys on this database bought.
test.beforeEach(async ({ playwright, baseURL }) => {
  await receiveStock((o) => playwright.request.newContext(o), baseURL ?? 'http://127.0.0.1:3100', ['AWL-10-0202', 'AWL-10-0203', 'FLG-50-0201']);
});

for (const view of VIEWS) {
  test.describe(`at ${view.name} width`, () => {
    test.use({ viewport: { width: view.width, height: view.height } });

    test('a dealer builds a list from a part page and a past order; a colleague at the same account sees it and orders part of it', async ({ page, login, axe }) => {
      test.slow();
      const listName = `Van stock ${view.name}`;
      await login('dealer');
      await page.goto('/');
      const past = await placeOrder(
        page,
        [
          { partNumber: 'AWL-10-0202', quantity: 2 },
          { partNumber: 'AWL-10-0203', quantity: 1 },
        ],
        'account',
      );

      await page.goto('/parts/FLG-50-0201');
      await page.getByRole('button', { name: 'Save to a list' }).click();
      const panel = page.getByRole('form', { name: 'Save to a list' });
      await panel.getByLabel('List', { exact: true }).selectOption({ label: 'New list…' });
      await panel.getByLabel('New list name').fill(listName);
      await panel.getByLabel('Quantity').fill('4');
      await panel.getByRole('button', { name: 'Add to list' }).click();
      await see(panel.getByText(`Saved to “${listName}”`)).toBeVisible();
      await axe();
      await keepScreenshot(page, `lists-part-page-${view.name}`);

      await page.goto(`/orders/${past}`);
      await page.getByRole('button', { name: 'Save the order to a list' }).click();
      const orderPanel = page.getByRole('form', { name: 'Save the order to a list' });
      await orderPanel.getByLabel('List', { exact: true }).selectOption({ label: `${listName} (1 line)` });
      await orderPanel.getByRole('button', { name: 'Add to list' }).click();
      await see(orderPanel.getByText('2 lines added; the list now has 3.')).toBeVisible();
      await keepScreenshot(page, `lists-from-order-${view.name}`);

      // A colleague at the same trade account signs in and finds the list.
      await page.context().clearCookies();
      await login('dealerColleague');
      await page.goto('/trade/lists');
      await see(page.getByRole('link', { name: listName })).toBeVisible();
      await keepScreenshot(page, `lists-index-${view.name}`);
      await page.getByRole('link', { name: listName }).click();
      await see(page.getByRole('heading', { name: listName })).toBeVisible();
      await see(page.getByText('started by Morgan Tillbrook')).toBeVisible();
      const lines = page.getByRole('list', { name: `Lines of ${listName}` });
      await see(lines.getByRole('listitem')).toHaveCount(3);
      await see(page.getByLabel('Quantity on the list for FLG-50-0201')).toHaveValue('4');
      await axe();
      await keepScreenshot(page, `lists-colleague-${view.name}`);

      // Part of it: not the gaskets, and one of the two of AWL-10-0202.
      await page.getByLabel('Order FLG-50-0201').uncheck();
      await page.getByLabel('Quantity to order of AWL-10-0202').fill('1');
      await see(page.getByText('2 of 3 lines')).toBeVisible();
      await keepScreenshot(page, `lists-choose-lines-${view.name}`);
      await page.getByRole('button', { name: 'Add chosen lines to the cart' }).click();
      await see(page).toHaveURL(/\/cart$/);
      await see(page.getByRole('link', { name: 'AWL-10-0202' })).toBeVisible();
      await see(page.getByRole('link', { name: 'AWL-10-0203' })).toBeVisible();
      await see(page.getByRole('link', { name: 'FLG-50-0201' })).toHaveCount(0);
      await keepScreenshot(page, `lists-cart-${view.name}`);
      await emptyCart(page);
    });

    test('a buyer lowers a quantity and takes a line off before picking, sees the refund, then cancels', async ({ page, login, axe, caughtMail }) => {
      test.slow();
      await login('retail');
      await page.goto('/');
      const number = await placeOrder(
        page,
        [
          { partNumber: 'AWL-10-0202', quantity: 3 },
          { partNumber: 'FLG-50-0201', quantity: 2 },
        ],
        'card',
      );
      await page.goto(`/orders/${number}`);
      await see(page.getByRole('heading', { name: 'Change or cancel' })).toBeVisible();
      await keepScreenshot(page, `order-change-offer-${view.name}`);
      await page.getByRole('button', { name: 'Change quantities' }).click();
      await page.getByLabel('New quantity of AWL-10-0202').fill('1');
      await page.getByRole('button', { name: 'Take FLG-50-0201 off the order' }).click();
      await axe();
      await keepScreenshot(page, `order-change-form-${view.name}`);
      await page.getByRole('button', { name: 'Save changes' }).click();
      await see(page.getByRole('status').filter({ hasText: 'Order changed' })).toContainText(/\$[\d,.]+ is refunded to your card/);
      const history = page.getByRole('region', { name: 'Your changes' });
      await see(history).toContainText('AWL-10-0202: 3 → 1');
      await see(history).toContainText('FLG-50-0201: taken off (was 2)');
      await see(history).toContainText('refunded to your card');
      await see(page.getByRole('region', { name: 'Lines', exact: true }).getByText('FLG-50-0201')).toHaveCount(0);
      await axe();
      await keepScreenshot(page, `order-changed-${view.name}`);
      await expect
        .poll(async () => ((await caughtMail(DEMO_EMAILS.retail)) as { messages: Array<{ subject: string }> }).messages.some((m) => m.subject === `Order ${number} is changed`))
        .toBe(true);

      await page.getByRole('button', { name: 'Cancel order' }).click();
      await see(page.getByText(`Cancel order ${number}?`)).toBeVisible();
      await keepScreenshot(page, `order-cancel-confirm-${view.name}`);
      await page.getByRole('button', { name: 'Yes, cancel the order' }).click();
      await see(page.getByRole('status').filter({ hasText: 'Order cancelled' })).toContainText('refunded to your card');
      await see(page.getByRole('button', { name: 'Change quantities' })).toHaveCount(0);
      await see(page.getByText('Payment not completed')).toHaveCount(0);
      await keepScreenshot(page, `order-cancelled-${view.name}`);
    });

    test('a dealer lowers a quantity on an account order and the invoice is amended', async ({ page, login, axe }) => {
      await login('dealer');
      await page.goto('/');
      const number = await placeOrder(page, [{ partNumber: 'FLG-50-0201', quantity: 6 }], 'account');
      await page.goto(`/orders/${number}`);
      await see(page.getByText('The invoice is amended to match.')).toBeVisible();
      await page.getByRole('button', { name: 'Change quantities' }).click();
      await page.getByLabel('New quantity of FLG-50-0201').fill('2');
      await page.getByRole('button', { name: 'Save changes' }).click();
      await see(page.getByRole('status').filter({ hasText: 'Order changed' })).toContainText(/The invoice is amended to \$[\d,.]+ \(\$[\d,.]+ less\)/);
      await see(page.getByRole('region', { name: 'Your changes' })).toContainText('FLG-50-0201: 6 → 2');
      await page.getByRole('link', { name: 'Printable invoice' }).click();
      await see(page.getByText(/Amended at your request on .*: originally \$[\d,.]+, now \$[\d,.]+\./)).toBeVisible();
      await axe();
      await keepScreenshot(page, `order-amended-invoice-${view.name}`);
    });

    test('once the warehouse starts picking, the order page says why it can no longer be changed', async ({ page, login, playwright, baseURL }) => {
      await login('dealer');
      await page.goto('/');
      const number = await placeOrder(page, [{ partNumber: 'AWL-10-0203', quantity: 2 }], 'account');
      const floor = await playwright.request.newContext({ baseURL: baseURL! });
      await startPicking(floor, baseURL!, number);
      await floor.dispose();
      await page.goto(`/orders/${number}`);
      await see(page.getByText('Why this order cannot be changed')).toBeVisible();
      await see(page.getByText(/has started picking order .* can no longer be changed or cancelled/)).toBeVisible();
      await see(page.getByRole('button', { name: 'Cancel order' })).toHaveCount(0);
      await keepScreenshot(page, `order-picking-refused-${view.name}`);
    });
  });
}
