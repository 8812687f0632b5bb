import { DEMO_PASSWORD, expect, test } from './fixtures';
import { confirmationLink } from './support/mail';
import { keepScreenshot } from './support/screens';

test.describe('accounts and roles', () => {
  test('a new buyer signs up, confirms the address from the mail, lands signed in and sees the account page', async ({ page, axe }) => {
    const email = `buyer-${Date.now()}@example.test`;
    await page.goto('/sign-up');
    await page.getByRole('button', { name: 'Create account' }).click();
    // An empty submit lists every problem at the top, each linking to its field.
    const summary = page.getByRole('alert').filter({ hasText: 'Please check the form' });
    await expect(summary.getByRole('link', { name: /Your name/ })).toBeVisible();
    await expect(summary).toBeFocused();

    await page.getByLabel('Your name').fill('Rowan Ellery');
    await page.getByLabel('E-mail address').fill(email);
    await page.getByLabel('Password').fill('rowan-ellery-garage-1');
    await page.getByRole('button', { name: 'Create account' }).click();

    // The answer is the same whether or not the address has an account; the mailed link finishes the sign-up.
    await expect(page.getByRole('heading', { name: 'Check your e-mail' })).toBeVisible();
    await expect(page.getByRole('status')).toContainText(`We have sent a message to ${email}.`);
    await keepScreenshot(page, 'accounts-check-your-email');
    await page.goto(await confirmationLink(page.request, email));

    await expect(page).toHaveURL(/\/account$/);
    await expect(page.getByRole('heading', { name: 'Your account' })).toBeVisible();
    const you = page.getByRole('region', { name: 'You' });
    await expect(you.getByText(email)).toBeVisible();
    await expect(you.getByText('Retail buyer')).toBeVisible();
    await expect(page.getByRole('link', { name: 'Apply for a trade account' })).toBeVisible();
    await expect(page.getByRole('button', { name: /Account menu for Rowan Ellery/ })).toBeVisible();
    await axe();
    await keepScreenshot(page, 'accounts-new-buyer-account');

    await page.getByRole('button', { name: /Account menu/ }).click();
    await expect(page.getByRole('menuitem', { name: 'Orders' })).toBeVisible();
    // Trade tools are for dealers only.
    await expect(page.getByRole('menuitem', { name: 'Quick order' })).toHaveCount(0);
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();
  });

  test('sign-in explains a wrong password, lists demo accounts in development and returns to ?next', async ({ page, axe }) => {
    await page.goto('/sign-in?next=%2Faccount');
    await expect(page.getByRole('heading', { name: 'Sign in', level: 1 })).toBeVisible();
    await expect(page.getByRole('table', { name: /Demo accounts/ })).toBeVisible();
    await axe();
    await keepScreenshot(page, 'accounts-sign-in');

    await page.getByLabel('E-mail address').fill('retail@spoolyard.test');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await expect(page.getByRole('alert')).toContainText('do not match an account');
    await axe();
    await keepScreenshot(page, 'accounts-sign-in-wrong-password');

    await page.getByRole('button', { name: 'Use dealer@spoolyard.test' }).click();
    await expect(page.getByLabel('Password')).toHaveValue(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await expect(page).toHaveURL(/\/account$/);
    const trade = page.getByRole('region', { name: 'Trade account' });
    await expect(trade.getByText('Tillbrook Boost Works')).toBeVisible();
    await expect(trade.getByText('Preferred trade — 15 % off retail')).toBeVisible();
    await expect(trade.getByText('$25,000.00').first()).toBeVisible();
    await expect(trade.getByText('Net 30 days from invoice')).toBeVisible();
  });

  test('other roles see "not allowed" in the Office', async ({ page, login }) => {
    await login('dealer');
    await page.goto('/office/dealers');
    await expect(page.getByRole('heading', { name: 'Not allowed' })).toBeVisible();
    await expect(page.getByRole('table')).toHaveCount(0);
    await expect(page.getByRole('navigation', { name: 'Workspaces' })).toHaveCount(0);
  });

  test('the admin approves the pending applicant in the Office, and the applicant becomes a dealer', async ({ page, context, login, axe, baseURL }) => {
    await login('admin');
    await page.goto('/office/dealers');
    await expect(page.getByRole('heading', { name: 'Dealer accounts' })).toBeVisible();
    await expect(page.getByLabel('Workspace: Office')).toBeVisible();
    const row = page.getByRole('row').filter({ hasText: 'Penhallow Performance' });
    await expect(row.getByText('Pending')).toBeVisible();
    await axe();
    await keepScreenshot(page, 'accounts-office-dealers');

    await row.getByRole('button', { name: /Review/ }).click();
    const approve = page.getByRole('form', { name: 'Approve Penhallow Performance' });
    await approve.getByRole('button', { name: 'Approve Penhallow Performance' }).click();
    await expect(approve.getByRole('alert')).toContainText('choose a trade tier');
    await approve.getByLabel('Trade tier').selectOption('partner');
    await approve.getByLabel('Credit limit').fill('7,500');
    await approve.getByLabel('Payment terms').selectOption('45');
    await axe();
    await keepScreenshot(page, 'accounts-office-approve-form');
    await approve.getByRole('button', { name: 'Approve Penhallow Performance' }).click();

    await expect(page.getByRole('status').filter({ hasText: 'Penhallow Performance approved' })).toContainText('credit limit $7,500.00, net 45 days');
    await expect(row.getByText('Approved')).toBeVisible();
    await expect(row.getByText('Partner workshop')).toBeVisible();
    await keepScreenshot(page, 'accounts-office-approved');

    await page.goto('/dev/inbox');
    await page.getByRole('button', { name: /Dealer account approved for Penhallow Performance/ }).click();
    await expect(page.getByRole('heading', { name: 'Dealer account approved for Penhallow Performance' })).toBeVisible();
    await page.getByRole('tab', { name: 'Text part' }).click();
    await expect(page.getByRole('tabpanel')).toContainText('7,500.00');
    await expect(page.locator('iframe[sandbox=""]')).toHaveCount(0);
    await page.getByRole('tab', { name: 'HTML part' }).click();
    await expect(page.locator('iframe[sandbox=""]')).toHaveCount(1);
    await keepScreenshot(page, 'accounts-dev-inbox');

    await context.clearCookies();
    const signIn = await page.request.post('/api/auth/sign-in/email', {
      data: { email: 'applicant@spoolyard.test', password: DEMO_PASSWORD },
      headers: { origin: new URL(baseURL ?? 'http://127.0.0.1:3100').origin },
    });
    expect(signIn.ok()).toBe(true);
    await page.goto('/account');
    const trade = page.getByRole('region', { name: 'Trade account' });
    await expect(trade.getByText('Partner workshop — 20 % off retail')).toBeVisible();
    await expect(trade.getByText('Net 45 days from invoice')).toBeVisible();
    await expect(page.getByRole('region', { name: 'You' }).getByText('Dealer')).toBeVisible();
    await axe();
    await keepScreenshot(page, 'accounts-approved-dealer-account');
  });
});
