import { z } from 'zod';
import { DEMO_EMAILS, DEMO_PASSWORD, expect, test, type Role } from './fixtures';
import { packedUnit } from './support/units';

/**
 * Every main screen of every role, checked by axe at desktop and phone width: no serious or critical finding.
 * To add a screen, add a row. `{order}` is an order the demo dealer placed on account for this run, `{part}` a part
 * in stock, `{savedCheck}` the demo dealer's saved fitment check and `{unit}` the serial of a turbocharger the demo dealer
 * bought and the Floor packed, `{serviceRef}` a unit the dealer booked in for service; `guest` is nobody signed in.
 */
interface Screen {
  role: Role | 'guest';
  path: string;
  name: string;
  /** Rules switched off on this screen; say why beside the row. */
  disableRules?: string[];
  /** Parts of the page left out of the check (a third party's frame, say); say why beside the row. */
  exclude?: string[];
}

export const SCREENS: Screen[] = [
  // Counter, for everyone
  { role: 'guest', path: '/', name: 'shop home' },
  { role: 'guest', path: '/catalogue', name: 'catalogue' },
  { role: 'guest', path: '/catalogue?q=cartridge', name: 'catalogue search' },
  { role: 'guest', path: '/parts/{part}', name: 'part page' },
  { role: 'guest', path: '/frames/CHS', name: 'frame page with its exploded view' },
  { role: 'guest', path: '/fitment', name: 'fitment check' },
  { role: 'guest', path: '/sign-in', name: 'sign in' },
  { role: 'guest', path: '/sign-up', name: 'sign up' },
  { role: 'guest', path: '/forgot-password', name: 'forgot password' },
  { role: 'guest', path: '/reset-password', name: 'reset password without a link' },
  { role: 'guest', path: '/email-confirmed?error=TOKEN_EXPIRED', name: 'expired confirmation link' },
  // Retail buyer
  { role: 'retail', path: '/cart', name: 'cart' },
  // The card field is the payment provider's own frame.
  { role: 'retail', path: '/checkout', name: 'checkout', exclude: ['iframe'] },
  { role: 'retail', path: '/account', name: 'account' },
  { role: 'retail', path: '/orders', name: 'orders' },
  { role: 'retail', path: '/account/trade-application', name: 'trade application' },
  { role: 'retail', path: '/fitment/saved', name: 'saved fitment checks' },
  // Dealer
  { role: 'dealer', path: '/trade/quick-order', name: 'quick order' },
  { role: 'dealer', path: '/trade/stock-list', name: 'stock-list upload' },
  { role: 'dealer', path: '/checkout', name: 'checkout on account' },
  { role: 'dealer', path: '/orders', name: 'dealer orders' },
  { role: 'dealer', path: '/orders/{order}', name: 'order' },
  { role: 'dealer', path: '/orders/{order}/invoice', name: 'invoice' },
  { role: 'dealer', path: '/returns', name: 'returns' },
  { role: 'dealer', path: '/returns/new', name: 'new return' },
  { role: 'dealer', path: '/account', name: 'trade account' },
  { role: 'dealer', path: '/fitment/saved/{savedCheck}/logs', name: 'shaft-speed logs' },
  { role: 'dealer', path: '/notices', name: 'notices' },
  { role: 'dealer', path: '/account/statement', name: 'account statement' },
  { role: 'dealer', path: '/trade/lists', name: 'parts lists' },
  { role: 'dealer', path: '/account/units', name: 'my units' },
  { role: 'dealer', path: '/units/{unit}', name: 'unit history' },
  { role: 'dealer', path: '/service', name: 'service requests' },
  { role: 'dealer', path: '/service/new', name: 'book a unit in' },
  { role: 'dealer', path: '/service/{serviceRef}', name: 'service request' },
  { role: 'dealer', path: '/service/{serviceRef}/label', name: 'service label' },
  // Bench
  { role: 'workshop', path: '/bench', name: 'bench queue' },
  { role: 'workshop', path: '/bench?ref={serviceRef}', name: 'bench request' },
  // Floor
  { role: 'warehouse', path: '/floor', name: 'pick queue' },
  { role: 'warehouse', path: '/floor/pick?orders={order}', name: 'pick list' },
  { role: 'warehouse', path: '/floor/orders/{order}/pack', name: 'pack and dispatch' },
  { role: 'warehouse', path: '/floor/orders/{order}/slip', name: 'packing slip' },
  { role: 'warehouse', path: '/floor/goods-in', name: 'goods in' },
  { role: 'warehouse', path: '/floor/stock', name: 'stock' },
  { role: 'warehouse', path: '/floor/returns', name: 'floor returns' },
  { role: 'warehouse', path: '/floor/labels?parts={part}*2&binFrom=A-01-1&binTo=A-01-4', name: 'label sheets' },
  { role: 'warehouse', path: '/units/{unit}', name: 'unit history for staff' },
  // Office
  { role: 'admin', path: '/office', name: 'office index' },
  { role: 'admin', path: '/office/parts', name: 'office parts' },
  { role: 'admin', path: '/office/parts/{part}', name: 'edit a part' },
  { role: 'admin', path: '/office/parts/new', name: 'new part' },
  { role: 'admin', path: '/office/price-imports', name: 'price imports' },
  { role: 'admin', path: '/office/dealers', name: 'dealer accounts' },
  { role: 'admin', path: '/office/payment-alerts', name: 'payment alerts' },
  { role: 'admin', path: '/office/mail', name: 'office mail' },
  { role: 'admin', path: '/office/audit', name: 'audit log' },
  { role: 'admin', path: '/office/service-intervals', name: 'service intervals' },
  { role: 'admin', path: '/dev/inbox', name: 'development inbox' },
];

const WIDTHS = [
  { label: 'desktop', width: 1280, height: 800 },
  { label: 'phone', width: 390, height: 844 },
] as const;

const PartsSchema = z.object({ items: z.array(z.object({ partNumber: z.string(), condition: z.string(), stock: z.object({ available: z.number() }) })) });
const SavedSchema = z.object({ items: z.array(z.object({ id: z.number() })) });

let values: Record<string, string> | undefined;

/** The run's own order, part, saved check and unit, made once through the API the screens use. */
test.beforeAll(async ({ playwright, baseURL }) => {
  const base = baseURL ?? 'http://127.0.0.1:3100';
  const headers = { origin: new URL(base).origin };
  const as = async (role: Role) => {
    const ctx = await playwright.request.newContext({ baseURL: base });
    const res = await ctx.post('/api/auth/sign-in/email', { data: { email: DEMO_EMAILS[role], password: DEMO_PASSWORD }, headers });
    expect(res.ok(), `sign-in as ${role}`).toBe(true);
    return ctx;
  };
  const { serial: unit } = await packedUnit((o) => playwright.request.newContext(o), base, 'dealer');
  const dealer = await as('dealer');
  const parts = PartsSchema.parse(await (await dealer.get('/api/parts?limit=40')).json());
  const part = parts.items.find((p) => p.condition === 'new' && p.stock.available >= 3);
  if (!part) throw new Error('no part in stock');
  expect((await dealer.post('/api/cart/lines', { data: { partNumber: part.partNumber, quantity: 1 }, headers })).ok()).toBe(true);
  const checkout = await dealer.post('/api/checkout', { data: { method: 'account', purchaseOrder: 'PO-A11Y-1' }, headers });
  expect(checkout.ok(), 'checkout on account').toBe(true);
  const order = z.object({ order: z.object({ number: z.string() }) }).parse(await checkout.json()).order.number;
  // Carts with a line, so the cart and checkout screens show their forms rather than the empty state.
  expect((await dealer.post('/api/cart/lines', { data: { partNumber: part.partNumber, quantity: 1 }, headers })).ok()).toBe(true);
  const saved = SavedSchema.parse(await (await dealer.get('/api/fitments')).json());
  const savedCheck = saved.items[0]?.id;
  if (savedCheck === undefined) throw new Error('the demo dealer has no saved check');
  // A unit booked in for service, for the service and Bench screens.
  const booked = await dealer.post('/api/service', {
    multipart: { noSerial: 'true', frameCode: 'BUR', bearing: 'ball', symptoms: 'season-check', application: 'street', returnName: 'Accessibility run', returnLine1: '1 Check Lane', returnCity: 'Quenchfold', returnPostcode: 'QF1 1AA' },
    headers,
  });
  expect(booked.ok(), 'book a unit in').toBe(true);
  const serviceRef = z.object({ reference: z.string() }).parse(await booked.json()).reference;
  await dealer.dispose();
  const retail = await as('retail');
  expect((await retail.post('/api/cart/lines', { data: { partNumber: part.partNumber, quantity: 1 }, headers })).ok()).toBe(true);
  await retail.dispose();
  values = { order, part: part.partNumber, savedCheck: String(savedCheck), unit, serviceRef };
});

const fill = (path: string) => path.replace(/\{(\w+)\}/g, (_, key: string) => values?.[key] ?? `{${key}}`);

for (const screen of SCREENS) {
  // One page per screen: loaded and checked at desktop width, then narrowed to phone width (as a window is resized or a
  // tablet turned) and checked again. Layout follows the width through CSS and the media-query hooks alone.
  test(`${screen.name} (${screen.role}, ${screen.path}) has no serious accessibility finding at desktop and phone width`, async ({ page, login, axe }) => {
    const [first, ...others] = WIDTHS;
    await page.setViewportSize({ width: first.width, height: first.height });
    if (screen.role !== 'guest') await login(screen.role);
    await page.goto(fill(screen.path));
    // A busy machine can take a while to show the first page's code.
    await expect(page.getByRole('heading', { level: 1 }).first()).toBeVisible({ timeout: 20_000 });
    await page.waitForLoadState('networkidle');
    for (const size of [first, ...others]) {
      await test.step(`at ${size.label} width`, async () => {
        if (size !== first) {
          await page.setViewportSize({ width: size.width, height: size.height });
          // Two frames: the resize's media-query updates render before axe reads the page.
          await page.evaluate(() => new Promise<void>((done) => requestAnimationFrame(() => requestAnimationFrame(() => done()))));
          await expect(page.getByRole('heading', { level: 1 }).first()).toBeVisible();
        }
        await axe({ exclude: screen.exclude, disableRules: screen.disableRules });
      });
    }
  });
}
