import type { Page } from '@playwright/test';
import { formatMoney } from '../shared/format';
import { expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';

const priceOf = async (page: Page, partNumber: string) => ((await (await page.request.get(`/api/parts/${partNumber}`)).json()) as { priceCents: number }).priceCents;
const dollars = (cents: number) => (cents / 100).toFixed(2);

/** Each width takes parts of its own, so the two journeys do not meet. */
const WIDTHS = [
  { name: 'desktop', viewport: { width: 1280, height: 800 }, hundredfold: 'BUR-50-0202', penny: 'CHS-50-0202', exchange: 'DRF-10-0206-XCH', gentle: 'FUL-50-0201' },
  { name: 'phone', viewport: { width: 390, height: 844 }, hundredfold: 'BUR-50-0203', penny: 'CHS-50-0203', exchange: 'DRF-10-0205-XCH', gentle: 'FUL-50-0202' },
] as const;

for (const w of WIDTHS) {
  test.describe(`at ${w.name} width`, () => {
    test.use({ viewport: w.viewport });

    test('an admin sees absurd prices flagged, acknowledges them, confirms the counts, and finds the import in the history and the audit log', async ({ page, login, axe }) => {
      await login('admin');
      const [big, , exch, gentle] = await Promise.all([w.hundredfold, w.penny, w.exchange, w.gentle].map((n) => priceOf(page, n)));
      const file = `winter-prices-${w.name}.csv`;
      const csv = [
        'part_number,price,core_deposit',
        `${w.hundredfold},${dollars(big! * 100)},`,
        `${w.penny},0.01,`,
        `${w.exchange},${dollars(exch!)},${dollars(exch! + 10_000)}`,
        `${w.gentle},${dollars(Math.round(gentle! * 1.04))},`,
      ].join('\n');

      await page.goto('/office/price-imports');
      await page.getByLabel('CSV file').setInputFiles({ name: file, mimeType: 'text/csv', buffer: Buffer.from(csv) });
      await page.getByRole('button', { name: 'Upload and preview' }).click();
      await expect(page.getByRole('heading', { name: new RegExp(`Preview: ${file.replace('.', '\\.')}`) })).toBeVisible();
      await expect(page.getByText('Flagged', { exact: true }).locator('..')).toContainText('3');

      const hundredRow = page.getByRole('row', { name: new RegExp(w.hundredfold) });
      await expect(hundredRow).toContainText('price +9,900 % (more than ±30 %)');
      await expect(hundredRow).toContainText(formatMoney(big! * 100));
      await expect(page.getByRole('row', { name: new RegExp(w.penny) })).toContainText('price $0.01 is under $1.00');
      await expect(page.getByRole('row', { name: new RegExp(w.exchange) })).toContainText(`core deposit ${formatMoney(exch! + 10_000)} is more than the price ${formatMoney(exch!)}`);
      const apply = page.getByRole('button', { name: /^Apply 4 changes/ });
      await expect(apply).toBeDisabled();
      await expect(page.getByText('Apply is off while 3 flagged rows wait for a look')).toBeVisible();
      await axe();
      await keepScreenshot(page, `price-import-flagged-${w.name}`);

      // One row by its own checkbox.
      // The box shows the acknowledgement the server kept, so it turns checked after the round trip, not on the click.
      const acknowledge = page.getByRole('checkbox', { name: new RegExp(`Acknowledge row 2 \\(${w.hundredfold}\\)`) });
      await acknowledge.click();
      await expect(acknowledge).toBeChecked();
      await expect(page.getByText('2 flagged rows wait for a look.')).toBeVisible();

      // A tighter share flags the gentle 4 % change too; back to 30 % it is clear again.
      const share = page.getByLabel('Flag a price that moves more than');
      await share.fill('3');
      await page.getByRole('button', { name: 'Flag again' }).click();
      await expect(page.getByText('Flagged', { exact: true }).locator('..')).toContainText('4');
      await share.fill('30');
      await page.getByRole('button', { name: 'Flag again' }).click();
      await expect(page.getByText('Flagged', { exact: true }).locator('..')).toContainText('3');
      await expect(page.getByRole('checkbox', { name: new RegExp(`Acknowledge row 2 `) })).toBeChecked();

      await page.getByRole('button', { name: 'Acknowledge all 3 flagged rows' }).click();
      await expect(page.getByText('All 3 flagged rows acknowledged.')).toBeVisible();
      await expect(apply).toBeEnabled();
      await apply.click();
      const dialog = page.getByRole('dialog', { name: 'Apply this price list?' });
      await expect(dialog).toContainText('4 prices change');
      await expect(dialog).toContainText('0 new parts are added');
      await expect(dialog).toContainText('3 flagged rows, acknowledged');
      await axe();
      await keepScreenshot(page, `price-import-confirm-${w.name}`);
      // Going back changes nothing.
      await dialog.getByRole('button', { name: 'Go back' }).click();
      await expect(dialog).toBeHidden();
      expect(await priceOf(page, w.hundredfold)).toBe(big);
      await apply.click();
      await page.getByRole('dialog').getByRole('button', { name: 'Apply 4 changes' }).click();
      await expect(page.getByRole('status').filter({ hasText: 'Price list applied' })).toContainText('by Alex Varga-Moor');
      expect(await priceOf(page, w.hundredfold)).toBe(big! * 100);

      await page.getByRole('link', { name: 'Import history' }).click();
      const listed = page.getByRole('row', { name: new RegExp(file.replace('.', '\\.')) });
      await expect(listed).toContainText('Alex Varga-Moor');
      await expect(listed.getByRole('cell').nth(4)).toHaveText('4');
      await expect(listed.getByRole('cell').nth(6)).toContainText('3');
      await axe();
      await keepScreenshot(page, `price-import-history-${w.name}`);
      await listed.getByRole('link', { name: /View changes/ }).click();
      await expect(page.getByRole('heading', { name: new RegExp(`Applied: ${file.replace('.', '\\.')}`) })).toBeVisible();
      await expect(page.getByRole('row', { name: new RegExp(w.hundredfold) })).toContainText(formatMoney(big!));
      await expect(page.getByRole('row', { name: new RegExp(w.hundredfold) })).toContainText('Acknowledged');

      await page.goto('/office/audit');
      await page.getByLabel('Part number').fill(w.hundredfold);
      await page.getByRole('button', { name: 'Show entries' }).click();
      await expect(page).toHaveURL(new RegExp(`part=${w.hundredfold}`));
      const entry = page.getByRole('row', { name: new RegExp(w.hundredfold) });
      await expect(entry).toContainText('Price list');
      await expect(entry).toContainText(file);
      await expect(entry).toContainText(`${formatMoney(big!)}`);
      await expect(entry).toContainText(`${formatMoney(big! * 100)}`);
      await expect(page.getByText('1 entry', { exact: true })).toBeVisible();
      await axe();
      await keepScreenshot(page, `audit-log-${w.name}`);
    });
  });
}
