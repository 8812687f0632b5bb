import fs from 'node:fs';
import path from 'node:path';
import { build } from 'vite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeChunks, entryScripts, firstVisitScripts, pageScripts, readManifest, totalBytes } from '../support/client-chunks';

/**
 * Everything a first visit to each of the shop's first pages downloads before the network goes quiet, read from a real
 * client build (its manifest), gzip-compressed: the entry and its static imports, the page's chunk and its imports, and
 * what those load at once (an illustration drawn at once, say). Only chunks that wait for the visitor are left out,
 * and they are named below. Sizes only, no timing (see scripts/bench-pages.ts for the throttled page loads these
 * budgets are for).
 *
 * The goal is 120 kB. The libraries every page needs before it can draw (React DOM, the router in its declarative
 * mode, the query cache) are about 92 kB of it; the first answers are read without the validation library
 * (src/lib/api-client.ts apiRead, tests/integration/first-reads.test.ts), which comes with the forms and with the
 * answers to what a visitor does. All four meet the goal; the part page's exploded view (4 kB), below the
 * specification, loads as its place comes near the screen. The budgets keep a little room over what each page is now.
 */
const FIRST_VISIT_BUDGET_BYTES: Record<string, number> = {
  'src/app/routes/home.tsx': 109_000,
  'src/app/routes/catalogue.tsx': 117_000,
  'src/app/routes/part.tsx': 120_000,
  'src/app/routes/fitment.tsx': 116_000,
};
/** The entry alone, before any page's chunk. */
const ENTRY_BUDGET_BYTES = 104_500;
/** Chunks that load only when the visitor does something, for every page and for one page. */
const ON_DEMAND = [
  // The header's search-as-you-type combobox: when the pointer comes over the search field, or it is touched or focused.
  'src/components/ui/part-search-box.tsx',
  // The account menu, and the notices bell: for someone signed in only.
  'src/features/auth/components/account-menu.tsx',
  'src/features/notices/components/notices-bell.tsx',
  // The schemas of the answers to what a visitor does (add to the cart or a list, run or save a fitment check), with
  // the validation library: they load with that request.
  'src/lib/action-schemas.ts',
];
const ON_DEMAND_ON: Record<string, string[]> = {
  // Saving a part to a list: for approved dealers only. The frame's exploded view, below the specification: when its
  // place comes near the screen (src/components/ui/near-view.tsx).
  'src/app/routes/part.tsx': ['src/features/lists/components/add-to-list.tsx', 'src/components/illustrations/exploded-view.tsx'],
  // The fitment check's answer (build sheet, map, candidates, a frame's exploded view) loads when the form is touched
  // or a check is run.
  // The form itself, with the form library and the validation library, when the visitor reaches for the stand-in of the
  // same fields (pointer over it, touched or focused).
  'src/app/routes/fitment.tsx': [
    'src/features/fitment/components/fitment-results.tsx',
    'src/components/illustrations/exploded-view.tsx',
    'src/features/fitment/components/fitment-form.tsx',
  ],
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

describe('the first page’s fonts', () => {
  it('are asked for from the head (the Latin files of the three weights used), so text does not re-wrap under a drawn list', () => {
    const html = fs.readFileSync(path.join(outDir, 'index.html'), 'utf8');
    const preloads = [...html.matchAll(/<link rel="preload" href="\/assets\/(source-sans-3-latin-(\d00)-normal-[\w-]+\.woff2)" as="font" type="font\/woff2" crossorigin/g)];
    expect(preloads.map((m) => m[2])).toEqual(['400', '600', '700']);
    for (const m of preloads) expect(fs.existsSync(path.join(outDir, 'assets', m[1]!))).toBe(true);
  });
});

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

  it.each(FIRST_PAGES)('a first visit to %s does not bring the validation library: its first answers are read without it', (source) => {
    const loaded = firstVisitScripts(outDir, source, [...ON_DEMAND, ...(ON_DEMAND_ON[source] ?? [])])
      .map((c) => fs.readFileSync(path.join(outDir, c.file), 'utf8'))
      .join('\n');
    // A message only the validation library's English locale carries, and one of its own error classes' names.
    expect(loaded).not.toContain('Invalid input');
    expect(loaded).not.toContain('ZodError');
  });

  it('has no two chunks that import each other (one would run before the other is ready)', () => {
    const manifest = readManifest(outDir);
    const cycles: string[] = [];
    const state = new Map<string, 'open' | 'done'>();
    const visit = (key: string, trail: string[]) => {
      state.set(key, 'open');
      for (const dep of manifest[key]?.imports ?? []) {
        if (state.get(dep) === 'open') cycles.push([...trail, key, dep].join(' -> '));
        else if (!state.has(dep)) visit(dep, [...trail, key]);
      }
      state.set(key, 'done');
    };
    for (const key of Object.keys(manifest)) if (!state.has(key)) visit(key, []);
    expect(cycles).toEqual([]);
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
