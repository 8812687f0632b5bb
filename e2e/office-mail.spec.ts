import { expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';

test('an admin reads the mail outbox, filters it by state and sends a message again', async ({ page, login, axe, baseURL }) => {
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;
  // Something to show: a reset link for the demo buyer.
  const reset = await page.request.post('/api/auth/request-password-reset', { data: { email: 'retail@spoolyard.test', redirectTo: '/reset-password' }, headers: { origin } });
  expect(reset.ok()).toBe(true);

  await login('admin');
  await page.goto('/office/mail');
  await expect(page.getByRole('heading', { name: 'Mail', level: 1 })).toBeVisible();
  const table = page.getByRole('table', { name: 'Outgoing e-mail, newest first' });
  const resetRow = table.getByRole('row', { name: /retail@spoolyard\.test/ }).filter({ hasText: 'Password reset link' }).first();
  await expect(resetRow).toBeVisible();
  // The worker sends it within a few seconds; the list follows on its own or on the filter.
  await expect(async () => {
    await page.getByRole('button', { name: /^Sent/ }).click();
    await expect(resetRow.getByText('Sent', { exact: true })).toBeVisible({ timeout: 1_000 });
  }).toPass({ timeout: 20_000 });
  await expect(resetRow).toContainText('Reset links are not kept once sent');
  await page.getByRole('button', { name: /^All/ }).click();
  await expect(page).not.toHaveURL(/state=/);
  await axe();
  await keepScreenshot(page, 'office-mail-desktop');

  // A dealer's order confirmation can go again.
  const dealer = await page.request.post('/api/auth/sign-in/email', { data: { email: 'dealer@spoolyard.test', password: 'spoolyard-demo-1' }, headers: { origin } });
  expect(dealer.ok()).toBe(true);
  expect((await page.request.post('/api/cart/lines', { data: { partNumber: 'FLG-50-0201', quantity: 1 }, headers: { origin } })).status()).toBe(201);
  const placed = await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: 'PO-MAIL-E2E' }, headers: { origin } });
  expect(placed.status()).toBe(201);
  const { order } = (await placed.json()) as { order: { number: string } };
  await login('admin');
  await page.goto('/office/mail');
  const confirmation = page.getByRole('row', { name: new RegExp(`Order ${order.number} confirmed`) });
  await expect(confirmation).toBeVisible();
  await confirmation.getByRole('button', { name: /Send again/ }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Queued again' })).toContainText(`Order ${order.number} confirmed`);

  await page.setViewportSize({ width: 390, height: 900 });
  await page.goto('/office/mail');
  await expect(page.getByRole('heading', { name: 'Mail', level: 1 })).toBeVisible();
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  expect(overflow).toBeLessThanOrEqual(0);
  await axe();
  await keepScreenshot(page, 'office-mail-phone');
});
