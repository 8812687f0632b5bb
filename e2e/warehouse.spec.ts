import { z } from 'zod';
import { expect, test } from './fixtures';
import { keepScreenshot } from './support/screens';
import { emptyCart } from './support/cart';

const PartsSchema = z.object({ items: z.array(z.object({ partNumber: z.string(), condition: z.string(), stock: z.object({ available: z.number() }) })) });
const LineSchema = z.object({ lineId: z.number(), partNumber: z.string(), binCode: z.string().nullable(), quantity: z.number(), toPick: z.number(), picked: z.number() });
const PickListSchema = z.object({ lines: z.array(LineSchema) });
const MailSchema = z.object({ messages: z.array(z.object({ to: z.array(z.string()), subject: z.string(), text: z.string().nullable() })) });

const TRACKING = 'TP-E2E-40117';

test('warehouse staff pick an order by typing part numbers (a wrong one first), pack and dispatch it, and the dealer is mailed the tracking number', async ({
  page,
  login,
  axe,
  baseURL,
  caughtMail,
}) => {
  const origin = new URL(baseURL ?? 'http://127.0.0.1:3100').origin;

  // A dealer orders on account: two in-stock parts, one of them twice, so a typed quantity is exercised too.
  const dealer = await page.request.post('/api/auth/sign-in/email', { data: { email: 'dealer@spoolyard.test', password: 'spoolyard-demo-1' }, headers: { origin } });
  expect(dealer.ok(), 'dealer sign-in').toBe(true);
  await emptyCart(page.request, origin);
  const parts = PartsSchema.parse(await (await page.request.get('/api/parts?limit=40')).json());
  const chosen = parts.items.filter((p) => p.condition === 'new' && p.stock.available >= 3).slice(0, 2);
  expect(chosen).toHaveLength(2);
  for (const [i, p] of chosen.entries()) {
    const add = await page.request.post('/api/cart/lines', { data: { partNumber: p.partNumber, quantity: i === 0 ? 2 : 1 }, headers: { origin } });
    expect(add.ok(), `add ${p.partNumber}`).toBe(true);
  }
  const checkout = await page.request.post('/api/checkout', { data: { method: 'account', purchaseOrder: 'PO-E2E-1' }, headers: { origin } });
  expect(checkout.ok(), 'checkout on account').toBe(true);
  const orderNumber = z.object({ order: z.object({ number: z.string() }) }).parse(await checkout.json()).order.number;

  await login('warehouse');
  const pickList = async () => PickListSchema.parse(await (await page.request.get(`/api/warehouse/orders/${orderNumber}/pick-list`)).json());
  const before = await pickList();
  expect(before.lines.every((l) => l.picked === 0)).toBe(true);

  // The pick queue lists the order with its state as a word.
  await page.goto('/floor');
  await expect(page.getByRole('heading', { level: 1, name: 'Pick queue' })).toBeVisible();
  // The queue comes a page at a time, oldest first: the search finds the order on whichever page it is.
  await page.getByLabel('Order or customer').fill(orderNumber);
  const row = page.getByRole('row', { name: new RegExp(orderNumber) });
  await expect(row).toContainText('On account');
  await expect(row).toContainText('To pick');
  await axe();
  await keepScreenshot(page, 'floor-pick-queue');

  await row.getByRole('link', { name: `Open ${orderNumber}` }).click();
  await expect(page).toHaveURL(new RegExp(`/floor/pick\\?orders=${orderNumber}`));
  await expect(page.getByRole('heading', { level: 1 })).toContainText(`Pick list — ${orderNumber}`);
  const scan = page.getByLabel('Scan or type the part number');
  const lastScan = page.getByRole('status', { name: 'Last scan' });
  await expect(scan).toBeFocused();
  await axe();

  // A wrong part number is refused with the server's words, nothing is recorded, and the field is ready again.
  const first = before.lines[0];
  if (!first) throw new Error('the pick list is empty');
  await scan.pressSequentially('ZZZ-00-0001');
  await scan.press('Enter');
  await expect(lastScan).toContainText(`Scanned ZZZ-00-0001 but this line is ${first.partNumber}`);
  await expect(lastScan).toContainText('nothing was recorded');
  await expect(scan).toHaveValue('');
  await expect(scan).toBeFocused();
  expect((await pickList()).lines.every((l) => l.picked === 0)).toBe(true);
  await keepScreenshot(page, 'floor-pick-refused');

  // Then the right parts, in bin walk order; a line of two is picked with a typed count of 2.
  for (const [i, line] of before.lines.entries()) {
    await expect(page.getByLabel('Pick this now')).toContainText(line.partNumber);
    if (line.toPick > 1) {
      await page.getByLabel('Units per scan').fill(String(line.toPick));
      await scan.focus();
    }
    await scan.pressSequentially(line.partNumber.toLowerCase());
    await scan.press('Enter');
    if (i < before.lines.length - 1) {
      await expect(lastScan).toContainText(`Picked ${line.toPick} of ${line.toPick} — ${line.partNumber}`);
      await expect(scan).toBeFocused();
      if (i === 0) await keepScreenshot(page, 'floor-pick-confirmed');
    }
  }

  // The last scan moves on to packing.
  await expect(page).toHaveURL(new RegExp(`/floor/orders/${orderNumber}/pack`));
  await expect(page.getByRole('status').filter({ hasText: `All lines picked for ${orderNumber}` })).toBeVisible();
  expect((await pickList()).lines.every((l) => l.toPick === 0)).toBe(true);
  await axe();
  await keepScreenshot(page, 'floor-pack');

  await page.getByLabel('Cartons').fill('1');
  await page.getByLabel('Packed weight').fill('12.5');
  await page.getByLabel('Carrier').selectOption('Tern Parcel');
  await page.getByLabel('Tracking number').fill(TRACKING);
  await page.getByRole('button', { name: 'Dispatch' }).click();
  await expect(page.getByRole('heading', { name: `Dispatched ${orderNumber}` })).toBeVisible();
  await expect(page.getByRole('status').filter({ hasText: TRACKING })).toContainText('Tern Parcel');
  await axe();
  await keepScreenshot(page, 'floor-dispatched');

  // Stock leaves once: a second dispatch is refused.
  const again = await page.request.post(`/api/warehouse/orders/${orderNumber}/dispatch`, { data: { carrier: 'Tern Parcel', trackingNumber: TRACKING }, headers: { origin } });
  expect(again.status()).toBe(409);

  // The dealer's dispatch e-mail carries the tracking number.
  await expect
    .poll(async () => {
      const mail = MailSchema.parse(await caughtMail('dealer@spoolyard.test'));
      return mail.messages.some((m) => m.to.includes('dealer@spoolyard.test') && m.subject.includes(orderNumber) && (m.text ?? '').includes(TRACKING));
    }, { message: 'dispatch e-mail with the tracking number', timeout: 10_000 })
    .toBe(true);

  // The packing slip shows the shipment and the handling caution, ready to print.
  await page.getByRole('link', { name: 'Packing slip' }).click();
  await expect(page.getByRole('heading', { name: 'Packing slip' })).toBeVisible();
  await expect(page.getByRole('article')).toContainText(TRACKING);
  await expect(page.getByRole('complementary', { name: 'Handling and fitting' })).toContainText('licensed mechanic');
  await keepScreenshot(page, 'floor-packing-slip');
});

test('people who are not warehouse staff are told the Floor is not for them', async ({ page, login }) => {
  await login('retail');
  await page.goto('/floor');
  await expect(page.getByRole('heading', { name: 'Floor is for warehouse staff' })).toBeVisible();
});
