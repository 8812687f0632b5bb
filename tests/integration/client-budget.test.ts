import fs from 'node:fs';
import path from 'node:path';
import { build } from 'vite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeChunks, entryScripts, firstVisitScripts, pageScripts, totalBytes } from '../support/client-chunks';

/**
 * Everything a first visit to each of the shop's first pages downloads before the network goes quiet, read from a real
 * client build (its manifest), gzip-compressed: the entry and its static imports, the page's chunk and its imports, and
 * what those load at once (the response schemas with the validation library, an illustration drawn at once). Only
 * chunks that wait for the visitor are left out, and they are named below. Sizes only, no timing (see
 * scripts/bench-pages.ts for the throttled page loads these budgets are for).
 *
 * The goal is 120 kB. The libraries every page needs before it can draw (React DOM, the router, the query cache) are
 * about 109 kB of it and the validation library the first answers are read with about 25 kB more, so the budgets
 * hold each page where it now is, to keep it from growing back; lowering them needs one of those libraries gone.
 */
const FIRST_VISIT_BUDGET_BYTES: Record<string, number> = {
  'src/app/routes/home.tsx': 169_000,
  'src/app/routes/catalogue.tsx': 175_000,
  'src/app/routes/part.tsx': 185_000,
  'src/app/routes/fitment.tsx': 196_000,
};
/** The entry alone, before any page's chunk. */
const ENTRY_BUDGET_BYTES = 120_000;
/** Chunks that load only when the visitor does something, for every page and for one page. */
const ON_DEMAND = [
  // The header's search-as-you-type combobox: when the pointer comes over the search field, or it is touched or focused.
  'src/components/ui/part-search-box.tsx',
  // The account menu: for someone signed in only.
  'src/features/auth/components/account-menu.tsx',
];
const ON_DEMAND_ON: Record<string, string[]> = {
  // The fitment check's answer (build sheet, map, candidates, a frame's exploded view) loads when the form is touched
  // or a check is run.
  'src/app/routes/fitment.tsx': ['src/features/fitment/components/fitment-results.tsx', 'src/components/illustrations/exploded-view.tsx'],
};
/** Beyond the first-page scripts, a page's own chunk and its static imports: a few requests, not a cascade of tiny ones. */
const MAX_PAGE_FILES = 7;
const TINY_BYTES = 1000;
const FIRST_PAGES = Object.keys(FIRST_VISIT_BUDGET_BYTES);

const root = path.resolve(import.meta.dirname, '../..');
const outDir = path.join(root, '.tmp', `client-budget-${process.pid}`);

beforeAll(async () => {
  // The test runner sets NODE_ENV=test, which would make this a development build of the libraries.
  const nodeEnv = process.env.NODE_ENV;
  process.env.NODE_ENV = 'production';
  try {
    await build({
      root,
      mode: 'production',
      configFile: path.join(root, 'vite.config.ts'),
      logLevel: 'error',
      build: { outDir, emptyOutDir: true, manifest: true },
    });
  } finally {
    process.env.NODE_ENV = nodeEnv;
  }
}, 180_000);
afterAll(() => fs.rmSync(outDir, { recursive: true, force: true }));

describe('the first page’s script', () => {
  it.each(FIRST_PAGES)('a first visit to %s stays within its budget, gzip', (source) => {
    const chunks = firstVisitScripts(outDir, source, [...ON_DEMAND, ...(ON_DEMAND_ON[source] ?? [])]);
    expect(chunks.length).toBeGreaterThan(0);
    expect(totalBytes(chunks), describeChunks(chunks)).toBeLessThanOrEqual(FIRST_VISIT_BUDGET_BYTES[source]!);
  });

  it(`its entry stays within ${ENTRY_BUDGET_BYTES / 1000} kB gzip`, () => {
    const chunks = entryScripts(outDir);
    expect(totalBytes(chunks), describeChunks(chunks)).toBeLessThanOrEqual(ENTRY_BUDGET_BYTES);
  });

  it('keeps the validation library out of the entry: the first requests load it beside their answers', () => {
    const entry = entryScripts(outDir).map((c) => fs.readFileSync(path.join(outDir, c.file), 'utf8')).join('\n');
    // A message only the validation library's English locale carries.
    expect(entry).not.toContain('Invalid input');
  });

  it.each(FIRST_PAGES)('a first visit to %s does not bring the header’s combobox before the visitor reaches for it', (source) => {
    const loaded = firstVisitScripts(outDir, source, [...ON_DEMAND, ...(ON_DEMAND_ON[source] ?? [])])
      .map((c) => fs.readFileSync(path.join(outDir, c.file), 'utf8'))
      .join('\n');
    // The combobox's own words for an empty list, and the accessible-overlay library's combobox and popover.
    expect(loaded).not.toContain('Keep typing: a part number');
    expect(loaded).not.toContain('react-aria-ComboBox');
    expect(loaded).not.toContain('react-aria-Popover');
  });

  it.each(FIRST_PAGES)('%s comes in a few files, not a cascade of tiny chunks', (source) => {
    const chunks = pageScripts(outDir, source);
    expect(chunks.length, describeChunks(chunks)).toBeLessThanOrEqual(MAX_PAGE_FILES);
    expect(chunks.filter((c) => c.gzipBytes < TINY_BYTES), describeChunks(chunks)).toEqual([]);
  });
});
