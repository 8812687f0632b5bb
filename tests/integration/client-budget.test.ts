import fs from 'node:fs';
import path from 'node:path';
import { build } from 'vite';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { describeChunks, firstPageScripts, pageScripts, totalBytes } from '../support/client-chunks';

/**
 * The script a first visit downloads before anything can render, read from a real client build: the entry, its
 * static imports and index.html's module preloads, gzip-compressed. Sizes only, no timing (see
 * scripts/bench-pages.ts for the throttled page loads these budgets are for).
 */
const FIRST_PAGE_BUDGET_BYTES = 120_000;
/** Beyond the first-page scripts, a page's own chunk and its static imports: a few requests, not a cascade of tiny ones. */
const MAX_PAGE_FILES = 7;
const TINY_BYTES = 1000;
const FIRST_PAGES = ['src/app/routes/home.tsx', 'src/app/routes/catalogue.tsx', 'src/app/routes/part.tsx', 'src/app/routes/fitment.tsx'];

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
  it(`stays within ${FIRST_PAGE_BUDGET_BYTES / 1000} kB gzip`, () => {
    const chunks = firstPageScripts(outDir);
    expect(chunks.length).toBeGreaterThan(0);
    expect(totalBytes(chunks), describeChunks(chunks)).toBeLessThanOrEqual(FIRST_PAGE_BUDGET_BYTES);
  });

  it('keeps the validation library out of it: the first requests load it beside their answers', () => {
    const entry = firstPageScripts(outDir).map((c) => fs.readFileSync(path.join(outDir, c.file), 'utf8')).join('\n');
    // A message only the validation library's English locale carries.
    expect(entry).not.toContain('Invalid input');
  });

  it.each(FIRST_PAGES)('%s comes in a few files, not a cascade of tiny chunks', (source) => {
    const chunks = pageScripts(outDir, source);
    expect(chunks.length, describeChunks(chunks)).toBeLessThanOrEqual(MAX_PAGE_FILES);
    expect(chunks.filter((c) => c.gzipBytes < TINY_BYTES), describeChunks(chunks)).toEqual([]);
  });
});
