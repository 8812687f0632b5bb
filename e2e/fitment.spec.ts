import { test, expect } from './fixtures';
import { keepScreenshot } from './support/screens';

test.describe('fitment check', () => {
  test('a buyer checks an engine, reads the verdicts, sees the operating line on the map and saves the check', async ({ page, login, axe }) => {
    await login('retail');
    await page.goto('/fitment');
    await expect(page.getByRole('heading', { name: 'Fitment check', level: 1 })).toBeVisible();

    await page.getByRole('radio', { name: /Metric/ }).check();
    await expect(page.getByText('kW', { exact: true })).toBeVisible();
    await page.getByLabel('Engine displacement').fill('2.0');
    await page.getByLabel('Power wanted').fill('224');
    await page.getByLabel('Peak-power rpm').fill('6500');
    await page.getByLabel('Fuel', { exact: true }).selectOption('petrol');
    await page.getByLabel('Application', { exact: true }).selectOption('street');
    await page.getByRole('button', { name: 'Check fitment' }).click();

    await expect(page.getByRole('heading', { name: 'What your engine needs' })).toBeVisible();
    await expect(page.getByText('Before you buy or fit')).toBeVisible();
    const frames = page.getByRole('list', { name: 'Frames, best fit first' });
    const candidates = frames.locator(':scope > li');
    await expect(candidates).toHaveCount(10);
    const best = candidates.first();
    await expect(best).toContainText('DRF');
    await expect(best).toContainText('Fits');
    await expect(frames).toContainText('Too small');
    await expect(frames).toContainText('go bigger');
    await expect(frames).toContainText('Too large');
    await expect(frames).toContainText('go smaller');

    const map = page.getByRole('img', { name: /Compressor map, DRF Drift/ });
    await expect(map).toBeVisible();
    await expect(map.locator('[data-series="surge-line"]')).toHaveCount(1);
    await expect(map.locator('[data-series="choke-line"]')).toHaveCount(1);
    const points = map.locator('[data-series="operating-line"] [data-rpm]');
    expect(await points.count()).toBeGreaterThanOrEqual(6);
    await expect(points.locator('circle')).toHaveCount(await points.count());
    const labels = map.locator('[data-series="operating-line"] text');
    await expect(labels.first()).toHaveText(/^\d{4}$/);
    await expect(labels.last()).toHaveText('6500');
    // Metric axes: flow in kg/s.
    await expect(map.getByText(/Corrected air flow \(kg\/s/)).toBeVisible();

    await axe();
    await keepScreenshot(page, 'fitment-results');

    await page.getByRole('button', { name: 'Show on the map for EDG' }).click();
    await expect(page.getByRole('img', { name: /Compressor map, EDG Edger/ })).toBeVisible();

    await page.getByRole('radio', { name: /Imperial/ }).check();
    await expect(page.getByRole('img', { name: /Compressor map, EDG/ }).getByText(/Corrected air flow \(lb\/min/)).toBeVisible();
    await expect(page.getByLabel('Power wanted')).toHaveValue('300');

    await page.getByLabel('Save this check as').fill('customer’s 2.0 L street car');
    await page.getByRole('button', { name: 'Save check' }).click();
    await expect(page.getByText('Saved as “customer’s 2.0 L street car”')).toBeVisible();

    await page.getByRole('button', { name: /^Add to cart/ }).first().click();
    await expect(page.getByRole('status').filter({ hasText: 'is in your cart' })).toContainText('with the check “customer’s 2.0 L street car” attached');

    await page.goto('/fitment/saved');
    const saved = page.getByRole('listitem').filter({ hasText: 'customer’s 2.0 L street car' });
    await expect(saved).toContainText(/2\.0 L petrol, 224 kW at 6500 rpm, street — best fit DRF Drift \(fits\)/);
    await axe();
    await saved.getByRole('link', { name: /Open/ }).click();
    await expect(page.getByRole('heading', { name: 'What your engine needs' })).toBeVisible();
    await expect(page.getByLabel('Peak-power rpm')).toHaveValue('6500');

    await page.goto('/fitment/saved');
    await page.getByRole('button', { name: /^Delete/ }).first().click();
    await page.getByRole('button', { name: 'Yes, delete' }).click();
    await expect(page.getByText('No saved checks yet')).toBeVisible();
  });

  test('a part page link preselects its frame; bad input gets a summary linking to each field', async ({ page, axe }) => {
    await page.goto('/fitment?frame=DRF');
    await expect(page.getByRole('note')).toContainText('Checking frame DRF');
    await page.getByLabel('Engine displacement').fill('');
    await page.getByLabel('Peak-power rpm').fill('99');
    await page.getByRole('button', { name: 'Check fitment' }).click();
    const summary = page.getByRole('alert').filter({ hasText: 'values need fixing' });
    await expect(summary).toBeFocused();
    await expect(summary.getByRole('link')).toHaveText(['Displacement is required', 'Peak-power rpm must be between 1,000 and 20,000 rpm']);
    await summary.getByRole('link', { name: /Peak-power rpm/ }).click();
    await expect(page.getByLabel('Peak-power rpm')).toBeFocused();
    await axe();

    await page.getByLabel('Engine displacement').fill('122');
    await page.getByLabel('Peak-power rpm').fill('6500');
    await page.getByRole('button', { name: 'Check fitment' }).click();
    await expect(page.getByRole('img', { name: /Compressor map, DRF Drift/ })).toBeVisible();
    await expect(page.getByRole('link', { name: 'Sign in to save' }).first()).toHaveAttribute('href', '/sign-in');
    await expect(page.getByRole('link', { name: /Complete turbochargers/ })).toHaveAttribute('href', '/catalogue?frame=DRF&category=turbochargers');
  });
});
