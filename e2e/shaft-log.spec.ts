import fs from 'node:fs';
import { test, expect } from './fixtures';
import { keepScreenshot } from './support/screens';

// The demo dealer's logged check and its two logs are seeded at start (catalog-seed/seed-shaft-logs.ts).
const DEMO_CHECK = 'Demo: 2.0 L street car on the logger';
const BAD_LOG = [
  'time_s,engine_rpm,boost_kpa,shaft_rpm,intake_c',
  '0.0,2300,-45.0,24800,33.0',
  '0.1,23OO,-44.0,24900,33.0',
  '0.2,2310,,900000,33.1',
  '0.1,2320,-43.0,25000,33.1',
].join('\n');

test.describe('shaft-speed logs on a saved check', () => {
  test('a dealer opens a check’s logs, is told what is wrong with a bad file, uploads the sample and reads it on the map', async ({ page, login, axe }) => {
    // One long journey: three logs drawn on the map, two uploads, two accessibility checks.
    test.slow();
    await login('dealer');
    await page.goto('/fitment/saved');
    const check = page.getByRole('listitem').filter({ hasText: DEMO_CHECK });
    await check.getByRole('link', { name: /Shaft-speed logs/ }).click();

    await expect(page.getByRole('heading', { name: 'Shaft-speed logs', level: 1 })).toBeVisible();
    const logs = page.getByRole('list', { name: 'Logs on this check' });
    await expect(logs.getByRole('listitem')).toHaveCount(2);
    const map = page.getByRole('img', { name: /Compressor map/ });
    await expect(map.locator('[data-series="measured"]')).toHaveCount(1);
    await expect(map.locator('[data-series="operating-line"] [data-rpm]').first()).toBeVisible();

    // The seeded log with a boost spike: over the limit, said in words and shapes.
    await logs.getByRole('button', { name: /on the map Third-gear pull with a boost spike/i }).click();
    await expect(page.getByRole('heading', { name: 'Third-gear pull with a boost spike', level: 2 })).toBeVisible();
    await expect(page.getByText('over the limit', { exact: true })).toBeVisible();
    await expect(page.getByRole('complementary', { name: 'This log went past a limit' })).toBeVisible();
    const excursions = page.getByRole('list', { name: 'Excursions, in time order' });
    await expect(excursions).toContainText('Over the shaft-speed limit');
    await expect(excursions).toContainText('Near surge');
    await expect(map.locator('[data-state="overspeed"]').first()).toBeAttached();
    await axe();
    await keepScreenshot(page, 'shaft-log-overspeed');

    // A file with bad rows: nothing is uploaded, and each problem is named by line and column.
    await page.getByLabel('Log file (CSV)').setInputFiles({ name: 'bad-log.csv', mimeType: 'text/csv', buffer: Buffer.from(BAD_LOG) });
    await page.getByRole('button', { name: 'Upload log' }).click();
    const problems = page.getByRole('alert').filter({ hasText: 'The file was not uploaded' });
    await expect(problems).toBeFocused();
    await expect(problems).toContainText('4 problems to fix');
    const rows = problems.getByRole('row');
    await expect(rows.nth(1)).toHaveText(/^3\s*engine_rpm\s*“23OO” is not a number$/);
    await expect(rows.nth(2)).toHaveText(/^4\s*boost_kpa\s*is empty$/);
    await expect(rows.nth(3)).toHaveText(/^4\s*shaft_rpm\s*900,000 rpm is outside the plausible 0 to 400,000 rpm$/);
    await expect(rows.nth(4)).toHaveText(/^5\s*time_s\s*0\.1 s is not after the row before \(0\.2 s\)/);
    await expect(logs.getByRole('listitem')).toHaveCount(2);
    await axe();
    await keepScreenshot(page, 'shaft-log-row-errors');

    // The sample log for the check's best frame, uploaded as a logger file would be.
    const downloading = page.waitForEvent('download');
    await page.getByRole('link', { name: /Download a sample log/ }).click();
    const download = await downloading;
    expect(download.suggestedFilename()).toMatch(/^sample-shaft-log-[A-Z]{3}\.csv$/);
    const sample = fs.readFileSync(await download.path(), 'utf8');
    expect(sample.split('\n').find((l) => !l.startsWith('#'))).toBe('time_s,engine_rpm,boost_kpa,shaft_rpm,intake_c');

    await page.getByLabel('Log file (CSV)').setInputFiles({ name: 'sample.csv', mimeType: 'text/csv', buffer: Buffer.from(sample) });
    await page.getByLabel(/^Name/).fill('Sample from the shop');
    await page.getByRole('button', { name: 'Upload log' }).click();
    await expect(page.getByRole('status').filter({ hasText: 'Uploaded “Sample from the shop”' })).toBeVisible();
    await expect(logs.getByRole('listitem')).toHaveCount(3);
    await expect(page.getByRole('heading', { name: 'Sample from the shop', level: 2 })).toBeVisible();
    await expect(page).toHaveURL(/\/fitment\/saved\/\d+\/logs\?log=\d+$/);

    const figures = page.locator('dl').filter({ hasText: 'Peak shaft speed' });
    await expect(figures).toContainText(/Peak shaft speed\s*[\d,]+\s*rpm/);
    await expect(figures).toContainText('Time over speed');
    await expect(figures).toContainText(/Time near or in surge\s*\d+\.\d\s*s/);
    await expect(figures).toContainText(/Points\s*\d{3}/);
    await expect(excursions).toContainText('Near surge');
    await expect(map.locator('[data-series="measured"]')).toHaveAttribute('data-points', /^\d+$/);
    await expect(map.locator('[data-state="near-surge"]').first()).toBeAttached();
    await keepScreenshot(page, 'shaft-log-sample');

    // A phone: nothing scrolls sideways.
    await page.setViewportSize({ width: 390, height: 844 });
    await expect(map).toBeVisible();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await keepScreenshot(page, 'shaft-log-phone');

    // Tidy up, so a reused server starts the next run the same way.
    await logs.getByRole('listitem').filter({ hasText: 'Sample from the shop' }).getByRole('button', { name: /^Delete/ }).click();
    await logs.getByRole('button', { name: 'Yes, delete' }).click();
    await expect(logs.getByRole('listitem')).toHaveCount(2);
  });
});
