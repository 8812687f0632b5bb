import { expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';

test('a buyer searches from the home page with a typo, opens the part and reads its specs', async ({ page, axe }) => {
  await page.goto('/');
  await expect(page.getByRole('heading', { level: 1 })).toContainText('checked to fit');
  await axe();

  // "cartrige" is misspelt; the search reads it as "cartridge" and says so.
  const search = page.getByRole('combobox', { name: 'Search the catalogue' });
  await search.fill('ball bearing cartrige fuller');
  await search.press('Enter');
  await expect(page).toHaveURL(/\/catalogue\?q=ball/);
  await expect(page.getByRole('heading', { name: /Results for/ })).toBeVisible();
  const first = page.getByRole('list', { name: 'Parts found' }).getByRole('listitem').first();
  await expect(first).toContainText('FUL');
  await expect(first).toContainText('ball bearing');
  await expect(first).toContainText('did you mean');
  await axe();
  await keepScreenshot(page, 'catalogue-search-typo');

  await first.getByRole('link').first().click();
  await expect(page).toHaveURL(/\/parts\/FUL-20-/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText('cartridge, ball bearing');
  const specs = page.getByRole('table');
  await expect(specs.getByRole('row', { name: /Bearing/ })).toContainText('Ball bearing');
  await expect(specs.getByRole('row', { name: /Inducer/ })).toContainText('60 mm');
  await expect(specs.getByRole('row', { name: /Trim/ })).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Spinning wheels and oil supply' })).toBeVisible();
  await expect(page.getByRole('heading', { name: 'Goes with' })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'part-page');
});

test('a part number typed without dashes finds the part first, and filters stay in the address', async ({ page }) => {
  await page.goto('/catalogue?q=chs100201');
  await expect(page.getByRole('list', { name: 'Parts found' }).getByRole('listitem').first()).toContainText('CHS-10-0201');
  await expect(page.getByRole('list', { name: 'Parts found' }).getByRole('listitem').first()).toContainText('Exact part number');

  await page.goto('/catalogue');
  await page.getByRole('group', { name: 'Category' }).getByRole('radio', { name: /Cartridges/ }).check();
  await expect(page).toHaveURL(/category=cartridges/);
  await page.getByRole('group', { name: 'Bearing' }).getByRole('radio', { name: /Ball bearing/ }).check();
  await expect(page).toHaveURL(/bearing=ball/);
  await expect(page.getByRole('heading', { name: 'Cartridges' })).toBeVisible();
  await expect(page.getByText(/^20 parts/)).toBeVisible();
  await page.reload();
  await expect(page.getByRole('group', { name: 'Bearing' }).getByRole('radio', { name: /Ball bearing/ })).toBeChecked();
  await page.getByRole('button', { name: /Ball bearing.*remove filter/ }).click();
  await expect(page).not.toHaveURL(/bearing=ball/);
});

test('the counter pages fit a phone screen without scrolling sideways', async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  for (const path of ['/', '/catalogue?category=turbochargers', '/catalogue?q=ball%20bearing%20cartridge%20ful', '/parts/FUL-20-0203', '/fitment']) {
    await page.goto(path);
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow, path).toBeLessThanOrEqual(0);
  }
});
