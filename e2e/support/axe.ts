import AxeBuilder from '@axe-core/playwright';
import { expect, type Page } from '@playwright/test';

export interface AxeOptions {
  /** CSS selector to limit the check to. */
  include?: string;
  exclude?: string[];
  /** Rules switched off for this check; say why beside the call. */
  disableRules?: string[];
}

const BLOCKING = new Set(['serious', 'critical']);

/** Runs axe (WCAG 2.1 A and AA rules) on the page and fails on any serious or critical violation. */
export async function expectNoSeriousA11yViolations(page: Page, options: AxeOptions = {}): Promise<void> {
  let builder = new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa']);
  if (options.include) builder = builder.include(options.include);
  for (const selector of options.exclude ?? []) builder = builder.exclude(selector);
  if (options.disableRules?.length) builder = builder.disableRules(options.disableRules);
  const results = await builder.analyze();
  const blocking = results.violations.filter((v) => v.impact && BLOCKING.has(v.impact));
  const report = blocking
    .map((v) => `${v.impact}: ${v.id} — ${v.help}\n${v.nodes.slice(0, 5).map((n) => `    ${n.target.join(' ')}`).join('\n')}`)
    .join('\n');
  expect(blocking, `Accessibility violations on ${page.url()}:\n${report}`).toEqual([]);
}
