import path from 'node:path';
import type { Page } from '@playwright/test';

/** Review screenshots live here (git-ignored), apart from Playwright's own failure output. */
export const SCREENSHOT_DIR = path.resolve(import.meta.dirname, '..', 'screenshots');

/** Saves a full-page screenshot to e2e/screenshots/<name>.png for review; returns the file path. */
export async function keepScreenshot(page: Page, name: string): Promise<string> {
  const safe = name.replace(/[^a-z0-9-]+/gi, '-').replace(/^-+|-+$/g, '').toLowerCase() || 'screen';
  const file = path.join(SCREENSHOT_DIR, `${safe}.png`);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
