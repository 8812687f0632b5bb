import { test, expect, type Role } from './fixtures';

// Every main screen fits the device its user holds: a phone for buyers and the office, a handheld for the floor.
const SCREENS: Array<{ role: Role; width: number; paths: string[] }> = [
  { role: 'dealer', width: 390, paths: ['/cart', '/checkout', '/orders', '/trade/quick-order', '/trade/stock-list', '/account', '/returns', '/returns/new', '/fitment/saved', '/notices'] },
  { role: 'warehouse', width: 800, paths: ['/floor', '/floor/goods-in', '/floor/stock', '/floor/returns', '/floor/labels?parts=FLG-50-0201*4&binFrom=A-01-1&binTo=A-01-4'] },
  { role: 'admin', width: 390, paths: ['/office', '/office/parts', '/office/parts/CHS-10-0201', '/office/price-imports', '/office/dealers', '/office/mail', '/dev/inbox'] },
  { role: 'dealerColleague', width: 390, paths: ['/trade/lists'] },
];

for (const { role, width, paths } of SCREENS) {
  test(`${role} screens fit ${width} px without scrolling sideways`, async ({ page, login }) => {
    await login(role);
    await page.setViewportSize({ width, height: 900 });
    for (const path of paths) {
      await page.goto(path);
      await expect(page.getByRole('heading', { level: 1 }).first()).toBeVisible();
      await page.waitForLoadState('networkidle');
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow, path).toBeLessThanOrEqual(0);
    }
  });
}
