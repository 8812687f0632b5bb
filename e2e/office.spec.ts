import { expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';

test('an admin imports a price list with a bad row, fixes it inline, applies it, and the part page shows the new price', async ({ page, login, axe }) => {
  await login('admin');
  await page.goto('/office/price-imports');
  await expect(page.getByRole('heading', { name: 'Price list import' })).toBeVisible();
  await expect(page.getByText('part_number', { exact: true })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'office-price-import-upload');

  // Two good rows changing real demo prices, one row whose price is not an amount.
  const csv = ['part_number,price', 'FLG-50-0201,15.75', 'AWL-50-0201,7.25', 'AWL-50-0202,abc'].join('\n');
  await page.getByLabel('CSV file').setInputFiles({ name: 'spring-prices.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
  await page.getByRole('button', { name: 'Upload and preview' }).click();

  await expect(page.getByRole('heading', { name: /Preview: spring-prices\.csv/ })).toBeVisible();
  await expect(page.getByText('Price changed', { exact: true }).locator('..')).toContainText('2');
  await expect(page.getByText('In error', { exact: true }).locator('..')).toContainText('1');
  const errorRow = page.getByRole('row', { name: /AWL-50-0202/ });
  await expect(errorRow).toContainText('abc');
  await expect(errorRow).toContainText(/not an amount/);
  const apply = page.getByRole('button', { name: /^Apply/ });
  await expect(apply).toBeDisabled();
  await expect(page.getByText(/Apply is off while 1 row is in error/)).toBeVisible();
  await axe();
  await keepScreenshot(page, 'office-price-import-preview-error');

  await page.getByRole('button', { name: 'Fix row 4' }).click();
  const fix = page.getByRole('form', { name: 'Fix row 4' });
  await fix.getByLabel('price').fill('39.50');
  await fix.getByRole('button', { name: 'Save row' }).click();
  await expect(page.getByText('In error', { exact: true }).locator('..')).toContainText('0');
  await expect(page.getByText('Price changed', { exact: true }).locator('..')).toContainText('3');
  await page.getByRole('button', { name: /All listed/ }).click();
  await expect(page.getByRole('row', { name: /FLG-50-0201/ })).toContainText('$13.99');
  await expect(page.getByRole('row', { name: /FLG-50-0201/ })).toContainText('$15.75');
  await expect(apply).toBeEnabled();
  await apply.click();
  await page.getByRole('dialog', { name: 'Apply this price list?' }).getByRole('button', { name: 'Apply 3 changes' }).click();

  await expect(page.getByRole('status').filter({ hasText: 'Price list applied' })).toContainText('3 prices changed');
  await axe();
  await keepScreenshot(page, 'office-price-import-applied');

  await page.goto('/parts/FLG-50-0201');
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await expect(page.getByText('$15.75', { exact: true }).first()).toBeVisible();
});

test('an admin finds a part in the office catalogue and opens its edit form; a dealer is refused', async ({ page, login, axe, browser, baseURL }) => {
  await login('admin');
  await page.goto('/office/parts');
  await page.getByLabel('Find a part').fill('CHS-10-0201-XCH');
  await page.getByRole('button', { name: 'Search', exact: true }).last().click();
  await expect(page).toHaveURL(/q=CHS-10-0201-XCH/);
  await expect(page.getByRole('table').getByRole('link', { name: 'CHS-10-0201-XCH', exact: true })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'office-parts');

  await page.getByRole('table').getByRole('link', { name: 'CHS-10-0201-XCH', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1 })).toContainText('exchange unit');
  await expect(page.getByLabel('Turbine A/R')).toHaveValue('0.48');
  // Gauge fields do not apply to a turbocharger.
  await expect(page.getByLabel('Gauge type')).toHaveCount(0);
  // Trim from the wheels, 100·(42/56)² = 56.25 → 56.3 (the trade's definition of trim).
  await expect(page.getByText('From the wheel sizes:')).toContainText('56.3');
  await page.getByLabel('Price').fill('12.345');
  await page.getByRole('button', { name: 'Save changes' }).click();
  const summary = page.getByRole('alert').filter({ hasText: 'Please check the form' });
  await expect(summary.getByRole('link', { name: /Price: price must be whole cents/ })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'office-part-edit');

  const dealer = await browser.newContext({ baseURL });
  const dealerPage = await dealer.newPage();
  const res = await dealerPage.request.post('/api/auth/sign-in/email', {
    data: { email: 'dealer@spoolyard.test', password: 'spoolyard-demo-1' },
    headers: { origin: new URL(baseURL ?? '').origin },
  });
  expect(res.ok()).toBe(true);
  await dealerPage.goto('/office/parts');
  await expect(dealerPage.getByRole('heading', { name: /Not allowed/ })).toBeVisible();
  await dealer.close();
});
