import type { Page } from '@playwright/test';
import { test, expect } from './fixtures';
import { confirmationLink } from './support/mail';
import { keepScreenshot } from './support/screens';

// An in-stock new turbocharger from the demo catalogue (AWL frame).
const PART = 'AWL-10-0201';

async function signUpFresh(page: Page, baseURL: string | undefined, label: string): Promise<string> {
  const email = `${label}-${Date.now()}-${Math.floor(Math.random() * 1e6)}@spoolyard.test`;
  const res = await page.request.post('/api/auth/sign-up/email', {
    data: { name: 'Dana Whitcombe', email, password: 'long-enough-password-1' },
    headers: { origin: new URL(baseURL ?? 'http://127.0.0.1:3100').origin },
  });
  expect(res.ok(), 'sign-up').toBe(true);
  // The mailed link confirms the address and signs the browser in.
  await page.goto(await confirmationLink(page.request, email));
  return email;
}

async function addPartFromItsPage(page: Page) {
  // These checkout specs start from the part page; retail-journey.spec.ts starts from the fitment check.
  await page.goto(`/parts/${PART}`);
  await expect(page.getByRole('heading', { level: 1 })).toBeVisible();
  await page.getByRole('button', { name: 'Add to cart' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'Added to your cart' })).toBeVisible();
}

async function fillDelivery(page: Page) {
  await page.getByLabel('Name or company').fill('Dana Whitcombe');
  await page.getByLabel('Street address').fill('22 Boiler Yard');
  await page.getByLabel('Town or city').fill('Emberleigh');
  await page.getByLabel('Postcode').fill('EM2 7RD');
}

async function mailTo(caughtMail: (to: string) => Promise<unknown>, email: string, subjectPart: string) {
  let found: { subject: string; text: string } | undefined;
  await expect
    .poll(
      async () => {
        const body = (await caughtMail(email)) as { messages: Array<{ subject: string; text: string }> };
        found = body.messages.find((m) => m.subject.includes(subjectPart));
        return Boolean(found);
      },
      { timeout: 10_000 },
    )
    .toBe(true);
  return found!;
}

test('a new retail buyer adds a part, pays by test card and sees the order paid', async ({ page, baseURL, axe, caughtMail }) => {
  const email = await signUpFresh(page, baseURL, 'retail-card');
  await addPartFromItsPage(page);

  await page.goto('/cart');
  await expect(page.getByRole('heading', { name: 'Your cart' })).toBeVisible();
  await expect(page.getByRole('link', { name: PART })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'checkout-cart-retail');

  await page.getByRole('link', { name: 'Go to checkout' }).click();
  await expect(page.getByRole('heading', { name: 'Checkout' })).toBeVisible();
  // Submitting empty shows the summary at the top, linking to each field.
  await page.getByRole('button', { name: /by card/ }).click();
  const summary = page.getByRole('alert').filter({ hasText: 'Please fix these' });
  await expect(summary).toBeVisible();
  await expect(summary.getByRole('link', { name: 'choose a card' })).toBeVisible();
  await expect(summary.getByRole('link', { name: 'street address is required' })).toBeVisible();

  await fillDelivery(page);
  await page.getByLabel('Test card ending 4242 - payment succeeds').check();
  await axe();
  await keepScreenshot(page, 'checkout-form-retail');
  await page.getByRole('button', { name: /by card/ }).click();

  await expect(page).toHaveURL(/\/orders\/SY-\d+/);
  const orderNumber = page.url().match(/SY-\d+/)![0];
  await expect(page.getByText('Thank you: payment received')).toBeVisible({ timeout: 10_000 });
  await expect(page.getByRole('list', { name: 'Order timeline' }).getByText('Paid', { exact: true })).toBeVisible();
  await axe();
  await keepScreenshot(page, 'checkout-order-paid');

  const mail = await mailTo(caughtMail, email, `Order ${orderNumber} confirmed`);
  expect(mail.text).toContain(PART);

  await page.goto(`/orders/${orderNumber}/invoice`);
  await expect(page.getByRole('heading', { name: 'Receipt' })).toBeVisible();
  await expect(page.getByRole('article').getByText('Unit 7, Foundry Row, Quenchfold', { exact: true })).toBeVisible();
  await keepScreenshot(page, 'checkout-receipt');
});

test('a declined card says so plainly, keeps the cart and leaves no paid order', async ({ page, baseURL, axe }) => {
  await signUpFresh(page, baseURL, 'retail-decline');
  await addPartFromItsPage(page);
  await page.goto('/checkout');
  await fillDelivery(page);
  await page.getByLabel('Test card ending 0002 - declined').check();
  await page.getByRole('button', { name: /by card/ }).click();

  const alert = page.getByRole('alert').filter({ hasText: 'Payment declined' });
  await expect(alert).toBeVisible();
  await expect(alert).toContainText('Your card was declined');
  await expect(alert).toContainText('No payment was taken');
  await expect(page).toHaveURL(/\/checkout$/);
  // The cart is as it was: the part is still in the order summary.
  await expect(page.getByRole('complementary', { name: 'Order summary' }).getByText(PART)).toBeVisible();
  await axe();
  await keepScreenshot(page, 'checkout-declined');

  const orders = (await (await page.request.get('/api/orders')).json()) as { items: Array<{ status: string }> };
  expect(orders.items.length).toBeGreaterThan(0);
  expect(orders.items.every((o) => o.status === 'cancelled')).toBe(true);
  const cart = (await (await page.request.get('/api/cart')).json()) as { lines: Array<{ partNumber: string }> };
  expect(cart.lines.map((l) => l.partNumber)).toEqual([PART]);
});

test('a card that needs authentication is completed in the test authentication step', async ({ page, baseURL }) => {
  await signUpFresh(page, baseURL, 'retail-3ds');
  await addPartFromItsPage(page);
  await page.goto('/checkout');
  await fillDelivery(page);
  await page.getByLabel(/needs 3-D Secure authentication/).check();
  await page.getByRole('button', { name: /by card/ }).click();
  await expect(page.getByRole('heading', { name: 'Your card needs authentication' })).toBeVisible();
  await keepScreenshot(page, 'checkout-authenticate');
  await page.getByRole('button', { name: 'Complete authentication' }).click();
  await expect(page).toHaveURL(/\/orders\/SY-\d+/);
  await expect(page.getByText('Thank you: payment received')).toBeVisible({ timeout: 10_000 });
});
