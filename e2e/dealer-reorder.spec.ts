import { test, expect } from './fixtures';
import { keepScreenshot } from './support/screens';

// Row 2 is superseded (replaced by AWL-10-0203), row 3 is a typo the buyer fixes, row 4 has a bad quantity and is dropped.
const STOCK_LIST = ['part,qty', 'FLG-50-0201,6', 'AWL-10-0103,1', 'AWL-10-020,2', 'AWL-50-0201,2.5', ''].join('\n');

test('a dealer uploads a stock list, fixes a bad row and checks out on account with a PO number', async ({ page, login, axe, baseURL }) => {
  // The longest journey (upload, fix, cart, checkout, invoice, reorder): more time on a busy two-core machine.
  test.slow();
  await login('dealer');
  // The journey counts the lines it adds: start from an empty cart, whatever earlier journeys on this database left.
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
  const emptyCart = async () => {
    const cart = (await (await page.request.get('/api/cart')).json()) as { lines: Array<{ id: number }> };
    for (const line of cart.lines) expect((await page.request.delete(`/api/cart/lines/${line.id}`, { headers: { origin } })).ok()).toBe(true);
  };
  await emptyCart();
  await page.goto('/trade/stock-list');
  await expect(page.getByRole('heading', { name: 'Upload a stock list' })).toBeVisible();
  await page.getByLabel('Stock list (CSV)').setInputFiles({ name: 'weekly-stock.csv', mimeType: 'text/csv', buffer: Buffer.from(STOCK_LIST) });
  await page.getByRole('button', { name: 'Upload and check' }).click();

  const preview = page.getByRole('table', { name: 'Rows in the uploaded stock list' });
  await expect(preview).toBeVisible();
  await expect(preview.getByText('Replaced')).toBeVisible();
  await expect(preview.getByText('No part AWL-10-020')).toBeVisible();
  await expect(preview.getByText('is not a whole number')).toBeVisible();
  await expect(page.getByRole('button', { name: 'Add 2 valid lines to cart' })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'dealer-stock-list-preview');

  // Fix the typo in row 3 and check it again.
  await page.getByRole('button', { name: 'Fix row 3' }).click();
  await page.locator('#row-3-part').fill('AWL-10-0202');
  await page.getByRole('button', { name: 'Check again' }).click();
  await expect(page.getByRole('button', { name: 'Add 3 valid lines to cart' })).toBeVisible();
  await page.getByRole('button', { name: 'Drop row 4' }).click();
  await keepScreenshot(page, 'dealer-stock-list-fixed');
  await page.getByRole('button', { name: 'Add 3 valid lines to cart' }).click();
  await expect(page.getByRole('status').filter({ hasText: '3 lines added to your cart' })).toBeVisible();

  await page.goto('/cart');
  await expect(page.getByRole('link', { name: 'AWL-10-0203' })).toBeVisible();
  await expect(page.getByText('Preferred trade −15%').first()).toBeVisible();
  await axe();
  await keepScreenshot(page, 'dealer-cart');

  await page.getByRole('link', { name: 'Go to checkout' }).click();
  await expect(page.getByLabel('On account')).toBeChecked();
  await expect(page.getByRole('region', { name: 'Credit check' })).toContainText('Within your credit limit');
  await page.getByLabel('Purchase-order number').fill('TBW-2207');
  await axe();
  await keepScreenshot(page, 'dealer-checkout');
  await page.getByRole('button', { name: /Place order on account/ }).click();

  await expect(page).toHaveURL(/\/orders\/SY-\d+/);
  await expect(page.getByText('Thank you: order placed on account')).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Order details' }).getByText('TBW-2207', { exact: true })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'dealer-order');
  const orderNumber = page.url().match(/SY-\d+/)![0];

  await page.goto(`/orders/${orderNumber}/invoice`);
  await expect(page.getByRole('heading', { name: 'Invoice' })).toBeVisible();
  await expect(page.getByRole('article').getByText('TBW-2207', { exact: true })).toBeVisible();
  await expect(page.getByText('30 days net')).toBeVisible();
  await keepScreenshot(page, 'dealer-invoice');

  await page.goto('/orders');
  await page.getByRole('button', { name: `Reorder ${orderNumber}` }).click();
  await expect(page.getByRole('status').filter({ hasText: '3 lines added to your cart' })).toBeVisible();
  await keepScreenshot(page, 'dealer-orders');

  // Leave the dealer's cart empty for the journeys that follow.
  await emptyCart();
});
