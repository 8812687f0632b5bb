import { test, expect } from './fixtures';
import { keepScreenshot } from './support/screens';

// A cross-reference of the demo catalogue (catalog-seed/generate.ts: an invented interchange list) and its part.
const CROSS_REFERENCE = 'IX 354-3110';
const ITS_PART = 'AWL-10-0202';

const VIEWS = [
  { name: 'desktop', width: 1280, height: 800 },
  { name: 'phone', width: 390, height: 844 },
] as const;

for (const view of VIEWS) {
  test(`header search suggests parts as a number is typed; the keyboard picks one and lands on it (${view.name})`, async ({ page, axe }) => {
    await page.setViewportSize({ width: view.width, height: view.height });
    await page.goto('/');
    const box = page.getByRole('combobox', { name: 'Search the catalogue' });
    await box.click();
    await box.pressSequentially('ful-20-02', { delay: 40 });
    const options = page.getByRole('listbox').getByRole('option');
    await expect(options.first()).toContainText('FUL-20-02');
    await expect(box).toHaveAttribute('aria-expanded', 'true');
    await keepScreenshot(page, `search-as-you-type-header-${view.name}`);

    // Escape closes the list and keeps what was typed. (While the list is open the page behind it is hidden from
    // assistive technology, as the combobox pattern does, so the page is checked with the list closed.)
    await box.press('Escape');
    await expect(page.getByRole('listbox')).toHaveCount(0);
    await expect(box).toHaveValue('ful-20-02');
    await axe();

    // Down opens the list on the first suggestion, down again moves to the second; Enter takes it to its page.
    await box.press('ArrowDown');
    await expect(options.first()).toBeVisible();
    await box.press('ArrowDown');
    const active = page.locator(`[id="${await box.getAttribute('aria-activedescendant')}"]`);
    const second = ((await active.locator('.part-no').textContent()) ?? '').trim();
    expect(second).toBe(((await options.nth(1).locator('.part-no').textContent()) ?? '').trim());
    expect(second).toMatch(/^FUL-20-02/);
    await box.press('Enter');
    await expect(page).toHaveURL(new RegExp(`/parts/${second}$`));
    await expect(page.getByText(second).first()).toBeVisible();

    // Enter with nothing picked searches the catalogue for what was typed.
    await box.fill('turbine housing');
    await box.press('Enter');
    await expect(page).toHaveURL(/\/catalogue\?q=turbine%20housing/);
  });

  test(`the quick-order pad suggests a cross-reference's part and accepts the cross-reference itself (${view.name})`, async ({ page, login, axe }) => {
    await page.setViewportSize({ width: view.width, height: view.height });
    await login('dealer');
    await page.goto('/trade/quick-order');
    const row1 = page.getByRole('combobox', { name: 'Part number, row 1' });
    await row1.click();
    await row1.pressSequentially(CROSS_REFERENCE.toLowerCase(), { delay: 30 });
    const option = page.getByRole('listbox').getByRole('option').first();
    await expect(option).toContainText(ITS_PART);
    await expect(option).toContainText(`Cross-reference ${CROSS_REFERENCE}`);
    await keepScreenshot(page, `search-as-you-type-quick-order-${view.name}`);
    await row1.press('ArrowDown');
    await row1.press('Enter');
    await expect(row1).toHaveValue(ITS_PART);
    await expect(page.getByRole('textbox', { name: 'Quantity, row 1' })).toBeFocused();
    await page.getByRole('textbox', { name: 'Quantity, row 1' }).press('Enter');

    // Row 2: the cross-reference as typed, not picked: the check accepts it as its part.
    const row2 = page.getByRole('combobox', { name: 'Part number, row 2' });
    await expect(row2).toBeFocused();
    await row2.fill(CROSS_REFERENCE);
    await row2.press('Escape');
    await expect(page.getByText(`${CROSS_REFERENCE} is ${ITS_PART}.`)).toBeVisible();
    await axe();
    await keepScreenshot(page, `search-as-you-type-quick-order-cross-reference-${view.name}`);
    await page.getByRole('button', { name: 'Add 2 lines to cart' }).click();
    await expect(page.getByRole('status').filter({ hasText: '2 lines added to your cart' })).toBeVisible();
  });
}

for (const view of VIEWS) {
  test(`the header field takes typing before its suggestions have loaded and keeps it, in place, when they arrive (${view.name})`, async ({ page, axe }) => {
    await page.setViewportSize({ width: view.width, height: view.height });
    // The combobox's code is held back until released, as on a slow connection.
    const asked: string[] = [];
    let release = () => {};
    const released = new Promise<void>((resolve) => (release = resolve));
    await page.route('**/assets/part-search-box-*.js', async (route) => {
      asked.push(route.request().url());
      await released;
      await route.continue();
    });
    await page.goto('/');
    await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
    const box = page.getByRole('combobox', { name: 'Search the catalogue' });
    const before = await box.boundingBox();
    // A first page loads none of it until someone reaches for the field.
    expect(asked).toEqual([]);
    await axe();
    await keepScreenshot(page, `header-search-stand-in-${view.name}`);

    await box.click();
    await page.keyboard.type('ful-2');
    await expect(box).toHaveValue('ful-2');
    expect(asked).toHaveLength(1);

    release();
    // The combobox has taken the field's place: focused, with what was typed and the caret after it, in the same box.
    await expect(box).toHaveAttribute('data-rac', '');
    await expect(box).toBeFocused();
    await expect(box).toHaveValue('ful-2');
    expect(await box.evaluate((el: HTMLInputElement) => [el.selectionStart, el.selectionEnd])).toEqual([5, 5]);
    expect(await box.boundingBox()).toEqual(before);
    await keepScreenshot(page, `header-search-arrived-${view.name}`);

    // Typing carries on in it, and the suggestions come.
    await page.keyboard.type('0-02');
    await expect(box).toHaveValue('ful-20-02');
    await expect(page.getByRole('listbox').getByRole('option').first()).toContainText('FUL-20-02');
  });
}
