import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';
import { packedUnit } from './support/units';

const WIDTHS = [
  { label: 'desktop', width: 1280, height: 900 },
  { label: 'phone', width: 390, height: 844 },
] as const;

test.describe('units by serial', () => {
  test('a buyer’s packed turbocharger has a serial on the order and in My units, and its history takes a shaft-speed log', async ({ page, login, axe, baseURL, playwright }) => {
    test.setTimeout(120_000);
    const base = baseURL ?? 'http://127.0.0.1:3100';
    const headers = { origin: new URL(base).origin };
    const { orderNumber, serial, partNumber } = await packedUnit((o) => playwright.request.newContext(o), base, 'retail');
    await login('retail');

    // The order page lists the serial on its line, as a link to the unit.
    await page.goto(`/orders/${orderNumber}`);
    await expect(page.getByRole('link', { name: serial })).toBeVisible({ timeout: 20_000 });
    for (const w of WIDTHS) {
      await page.setViewportSize(w);
      await keepScreenshot(page, `units-order-${w.label}`);
    }
    await page.setViewportSize(WIDTHS[0]);

    // My units, from the account menu.
    await page.getByRole('button', { name: /Account menu/ }).click();
    await page.getByRole('menuitem', { name: 'My units' }).click();
    await expect(page.getByRole('heading', { level: 1, name: 'My units' })).toBeVisible();
    const card = page.getByRole('listitem').filter({ has: page.getByRole('link', { name: serial, exact: true }) });
    await expect(card).toContainText(partNumber);
    await expect(card.getByRole('link', { name: `Book a service for ${serial}` })).toHaveAttribute('href', `/service/new?serial=${serial}`);
    await axe();
    for (const w of WIDTHS) {
      await page.setViewportSize(w);
      await keepScreenshot(page, `units-mine-${w.label}`);
    }
    await page.setViewportSize(WIDTHS[0]);

    // The unit's history: what it is and its sale.
    await card.getByRole('link', { name: serial, exact: true }).click();
    await expect(page.getByRole('heading', { level: 1, name: serial })).toBeVisible();
    const history = page.getByRole('region', { name: 'History' });
    await expect(history).toContainText('Sold');
    await expect(history).toContainText(orderNumber);

    // The owner sets its use: a journal or ball bearing unit on the circuit comes in more often.
    await page.getByLabel('Use', { exact: true }).selectOption('circuit');
    await page.getByRole('button', { name: 'Save the use' }).click();
    await expect(page.getByText('Saved. The next service date follows the new use.')).toBeVisible();
    await expect(page.getByText(/in circuit use/)).toBeVisible();

    // A shaft-speed log for this unit, through a saved check of the engine it is on (removed again at the end).
    const saved = await page.request.post('/api/fitments', { data: { name: 'Unit journey engine', input: { displacementL: 3.0, powerHp: 600, rpm: 7000, fuel: 'petrol', application: 'circuit' } }, headers });
    expect(saved.ok(), await saved.text()).toBe(true);
    const savedId = ((await saved.json()) as { id: number }).id;
    try {
      const unit = (await (await page.request.get(`/api/units/${serial}`)).json()) as { unit: { frameCode: string } };
      const csv = await (await page.request.get(`/api/fitments/${savedId}/shaft-logs/sample.csv?frameCode=${unit.unit.frameCode}`)).text();
      const file = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'unit-log-')), 'hot-pulls.csv');
      fs.writeFileSync(file, csv);
      await page.reload();
      await page.getByLabel('Engine (saved check)').selectOption(String(savedId));
      await page.getByLabel('Log file').setInputFiles(file);
      await page.getByLabel('Name (optional)').fill('Hot pulls');
      await page.getByRole('button', { name: 'Upload the log' }).click();
      await expect(page.getByText(/Log “Hot pulls” uploaded/)).toBeVisible();
      await expect(page.getByRole('region', { name: 'History' })).toContainText('Shaft-speed log');
      const logs = page.getByRole('region', { name: 'Logs for this unit' });
      await expect(logs).toContainText('Hot pulls');
      await axe();
      for (const w of WIDTHS) {
        await page.setViewportSize(w);
        await keepScreenshot(page, `units-history-${w.label}`);
      }
      await page.setViewportSize(WIDTHS[0]);
      // The log opens on the compressor map of the saved check.
      await logs.getByRole('link', { name: /On the map/ }).click();
      await expect(page).toHaveURL(new RegExp(`/fitment/saved/${savedId}/logs\\?log=\\d+`));
    } finally {
      expect((await page.request.delete(`/api/fitments/${savedId}`, { headers })).ok()).toBe(true);
    }
  });

  test('the administrator changes a service interval in the Office', async ({ page, login, axe }) => {
    await login('admin');
    await page.goto('/office/service-intervals');
    await expect(page.getByRole('heading', { level: 1, name: 'Service intervals' })).toBeVisible({ timeout: 20_000 });
    const field = page.getByLabel('Months between services, journal bearing, drag');
    await expect(field).toHaveValue('3');
    await axe();
    for (const w of WIDTHS) {
      await page.setViewportSize(w);
      await keepScreenshot(page, `units-office-intervals-${w.label}`);
    }
    await page.setViewportSize(WIDTHS[0]);
    await field.fill('4');
    await page.getByRole('button', { name: 'Save journal bearing, drag' }).click();
    await expect(page.getByText('Saved. Journal bearing, drag: every 4 months from now on.')).toBeVisible();
    await page.reload();
    await expect(page.getByLabel('Months between services, journal bearing, drag')).toHaveValue('4');
    // Put the demo value back for the journeys after this one.
    await page.getByLabel('Months between services, journal bearing, drag').fill('3');
    await page.getByRole('button', { name: 'Save journal bearing, drag' }).click();
    await expect(page.getByText('every 3 months from now on.')).toBeVisible();
  });
});
