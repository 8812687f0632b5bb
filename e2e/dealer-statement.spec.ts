import fs from 'node:fs';
import { request as playwrightRequest, type APIRequestContext, type Page } from '@playwright/test';
import { formatMoney } from '../shared/format';
import type { AccountStatement } from '../shared/schemas/statement';
import { DEMO_EMAILS, DEMO_PASSWORD, expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';

async function signedIn(baseURL: string, role: 'warehouse' | 'admin'): Promise<APIRequestContext> {
  const ctx = await playwrightRequest.newContext({ baseURL, extraHTTPHeaders: { origin: new URL(baseURL).origin } });
  const res = await ctx.post('/api/auth/sign-in/email', { data: { email: DEMO_EMAILS[role], password: DEMO_PASSWORD } });
  expect(res.ok(), `sign-in as ${role}`).toBe(true);
  return ctx;
}

const PNG_HEADER = Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex');

/**
 * The second demo dealer (a $5,000.00 limit) orders an exchange unit and a gasket on account; the unit's old core
 * comes back for a credit note and the office records the gasket's invoice paid. Through the API: the screens for
 * those steps have journeys of their own.
 */
async function accountActivity(page: Page, baseURL: string, width: string, tag: string) {
  const headers = { origin: new URL(baseURL).origin };
  const order = async (partNumber: string) => {
    expect((await page.request.post('/api/cart/lines', { data: { partNumber, quantity: 1 }, headers })).ok()).toBe(true);
    const res = await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: `PO-${tag}` }, headers });
    expect(res.status(), await res.text()).toBeLessThan(300);
    return ((await res.json()) as { order: { number: string } }).order.number;
  };
  const found = (await (await page.request.get('/api/parts?q=exchange%20unit&inStock=true&category=turbochargers&pageSize=50')).json()) as {
    items: Array<{ partNumber: string; condition: string; priceCents: number }>;
  };
  const unit = found.items.filter((p) => p.condition === 'exchange').sort((a, b) => a.priceCents - b.priceCents)[width === 'desktop' ? 0 : 1]!;
  const unitOrder = await order(unit.partNumber);
  const gasketOrder = await order(width === 'desktop' ? 'FLG-50-0203' : 'FLG-50-0204');

  const warehouse = await signedIn(baseURL, 'warehouse');
  const picks = (await (await warehouse.get(`/api/warehouse/orders/${unitOrder}/pick-list`)).json()) as { lines: Array<{ lineId: number; partNumber: string; toPick: number }> };
  for (const l of picks.lines) expect((await warehouse.post(`/api/warehouse/orders/${unitOrder}/picks`, { data: { lineId: l.lineId, scannedPartNumber: l.partNumber, quantity: l.toPick } })).ok()).toBe(true);
  expect((await warehouse.post(`/api/warehouse/orders/${unitOrder}/dispatch`, { data: { carrier: 'Tern Parcel', trackingNumber: `TP-${tag}`, cartons: 1, weightKg: 9 } })).ok()).toBe(true);
  const line = ((await (await page.request.get(`/api/orders/${unitOrder}`)).json()) as { lines: Array<{ id: number }> }).lines[0]!;
  const ret = await page.request.post('/api/returns', {
    headers,
    multipart: { orderNumber: unitOrder, lineId: String(line.id), kind: 'core', quantity: '1', reason: 'Old unit back for the deposit', photos: { name: 'core.png', mimeType: 'image/png', buffer: PNG_HEADER } },
  });
  expect(ret.status(), await ret.text()).toBe(201);
  const credited = await warehouse.post(`/api/warehouse/returns/${((await ret.json()) as { id: number }).id}/receive`, { data: { decision: 'core-refund', conditionGrade: 'rebuildable' } });
  expect(credited.ok(), await credited.text()).toBe(true);
  const creditNote = ((await credited.json()) as { creditNoteNumber: string }).creditNoteNumber;

  const admin = await signedIn(baseURL, 'admin');
  const dealers = (await (await admin.get('/api/admin/dealers')).json()) as { items: Array<{ id: number; companyName: string }> };
  const dealerId = dealers.items.find((d) => d.companyName === 'Quayside Marine Engines')!.id;
  expect((await admin.post(`/api/admin/dealers/${dealerId}/invoices/${gasketOrder}/paid`, { data: { reference: `BANK-${tag}` } })).ok()).toBe(true);
  await Promise.all([warehouse.dispose(), admin.dispose()]);
  return { unitOrder, gasketOrder, creditNote };
}

const WIDTHS = [
  { name: 'desktop', viewport: { width: 1280, height: 800 } },
  { name: 'phone', viewport: { width: 390, height: 844 } },
] as const;

for (const w of WIDTHS) {
  test.describe(`at ${w.name} width`, () => {
    test.use({ viewport: w.viewport });

    test('a dealer reads their statement with ageing, payments and credit notes, prints it and downloads the CSV; checkout refuses an order over the limit up front', async ({ page, login, axe, baseURL }) => {
      await login('dealer2');
      // Unique to this run, so a retry on the same server finds its own lines.
      const tag = `${w.name}-${Date.now() % 1_000_000}`;
      const { unitOrder, gasketOrder, creditNote } = await accountActivity(page, baseURL ?? '', w.name, tag);
      const s = (await (await page.request.get('/api/account/statement')).json()) as AccountStatement;

      await page.goto('/account');
      await page.getByRole('link', { name: 'Account statement' }).click();
      await expect(page.getByRole('heading', { name: 'Account statement', level: 1 })).toBeVisible();
      const summary = page.getByRole('definition').filter({ hasText: formatMoney(s.totals.balanceCents) });
      await expect(summary.first()).toBeVisible();
      await expect(page.getByRole('table', { name: /Open balance by days past the due date/ })).toContainText(formatMoney(s.totals.openInvoicesCents));
      await expect(page.getByRole('table', { name: 'Open invoices, oldest first' }).getByRole('row', { name: new RegExp(unitOrder) })).toContainText(`PO-${tag}`);
      await expect(page.getByRole('table', { name: 'Open invoices, oldest first' })).not.toContainText(gasketOrder);
      const activity = page.getByRole('table', { name: /running balance/ });
      await expect(activity.getByRole('row', { name: new RegExp(`BANK-${tag}`) })).toContainText('Payment');
      await expect(activity).toContainText(formatMoney(s.totals.balanceCents));
      await expect(page.getByRole('table', { name: 'Credit notes on this account' }).getByRole('row', { name: new RegExp(creditNote) })).toContainText(unitOrder);
      await axe();
      await keepScreenshot(page, `account-statement-${w.name}`);

      // The download is the same ledger, closing on the same balance.
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
      expect(download.suggestedFilename()).toMatch(/^statement-\d{4}-\d{2}-\d{2}\.csv$/);
      const csv = fs.readFileSync((await download.path())!, 'utf8');
      expect(csv.split('\r\n')[0]).toBe('date,type,reference,order,detail,debit_usd,credit_usd,balance_usd');
      expect(csv).toContain(`Credit note,${creditNote},${unitOrder}`);
      expect(csv).toContain(`Payment,BANK-${tag},${gasketOrder}`);
      expect(csv.trimEnd().split('\r\n').at(-1)).toMatch(new RegExp(`,${(s.totals.balanceCents / 100).toFixed(2)}$`));

      // On paper: no site header, no buttons; the statement itself in full.
      await page.emulateMedia({ media: 'print' });
      await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
      await expect(page.getByRole('banner').first()).toBeHidden();
      await expect(page.getByRole('heading', { name: 'Account statement', level: 1 })).toBeVisible();
      await keepScreenshot(page, `account-statement-print-${w.name}`);
      await page.emulateMedia({ media: 'screen' });

      // An order that would pass the limit: the button is off before anyone clicks, and says by how much.
      const big = (await (await page.request.get('/api/parts?q=turbocharger&category=turbochargers&inStock=true&pageSize=50')).json()) as { items: Array<{ partNumber: string; priceCents: number }> };
      const pricey = big.items.sort((a, b) => b.priceCents - a.priceCents)[0]!;
      expect((await page.request.post('/api/cart/lines', { data: { partNumber: pricey.partNumber, quantity: 3, allowBackorder: true }, headers: { origin: new URL(baseURL ?? '').origin } })).ok()).toBe(true);
      await page.goto('/checkout');
      const credit = page.getByRole('region', { name: 'Credit check' });
      await expect(credit).toContainText('Credit limit');
      await expect(credit).toContainText('$5,000.00');
      await expect(credit).toContainText(/Over your credit limit by \$\d{1,3}(,\d{3})*\.\d{2}\./);
      const place = page.getByRole('button', { name: /Place order on account/ });
      await expect(place).toBeDisabled();
      await expect(place).toHaveAccessibleDescription(/Over your credit limit by \$\d{1,3}(,\d{3})*\.\d{2}/);
      await expect(page.getByText('Placing this order on account is off')).toBeVisible();
      await axe();
      await keepScreenshot(page, `checkout-over-limit-${w.name}`);
      // Paying by card stays open.
      await page.getByRole('radio', { name: /Card/ }).check();
      await expect(page.getByRole('button', { name: /by card/ })).toBeVisible();
      await page.goto('/cart');
      await page.getByRole('button', { name: new RegExp(`Remove ${pricey.partNumber}`) }).click();
    });
  });
}
