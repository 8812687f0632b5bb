import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { catalogueSection, type BenchEnv } from './bench-catalogues';
import { checkoutSection } from './bench-checkout';
import { fitmentSection } from './bench-fitment';
import { freshListSection } from './bench-fresh-lists';
import { printReport, runSections, writeReport, type BenchSection } from './bench-harness';
import { httpSection } from './bench-http';
import { markdownTable } from './bench-figures';
import { pagesSection } from './bench-pages';
import { searchSection } from './bench-search';

// Usage: npm run bench -- [--quick] [--sizes 5000,50000,200000] [--duration 5] [--rounds 2] [--only search|fresh|list|fitment|checkout|pages] [--pages] [--keep]
// --pages adds the throttled page loads in Chromium (a few minutes; also alone: npx tsx scripts/bench-pages.ts).
const { values } = parseArgs({
  options: {
    quick: { type: 'boolean', default: false },
    sizes: { type: 'string' },
    duration: { type: 'string' },
    rounds: { type: 'string' },
    pages: { type: 'boolean', default: false },
    only: { type: 'string' },
    keep: { type: 'boolean', default: false },
  },
});
// --quick: a smoke run in under a minute (one small catalogue, one-second runs, one round); the figures are rough.
const quick = values.quick;
const sizes = (values.sizes ?? (quick ? '5000' : '5000,50000,200000')).split(',').map(Number);
const httpDurationS = Number(values.duration ?? (quick ? 1 : 5));
const rounds = Number(values.rounds ?? (quick ? 1 : 2));
if (sizes.some((n) => !Number.isInteger(n) || n < 1000 || n > 500_000)) throw new Error('--sizes must be whole numbers from 1000 to 500000');
if (!Number.isInteger(httpDurationS) || httpDurationS < 1 || httpDurationS > 30) throw new Error('--duration must be 1 to 30 seconds');
if (!Number.isInteger(rounds) || rounds < 1 || rounds > 10) throw new Error('--rounds must be 1 to 10');

const root = path.resolve(import.meta.dirname, '..');
const env: BenchEnv = { root, workDir: path.join(root, '.tmp', 'bench'), sizes, httpDurationS, rounds, quick, catalogues: [] };

const sections: Array<BenchSection<BenchEnv>> = [searchSection, freshListSection, httpSection, fitmentSection, checkoutSection, ...(values.pages || values.only ? [pagesSection] : [])].filter((s) => !values.only || s.name.toLowerCase().includes(values.only.toLowerCase()));
// Only the search and fresh-list figures need the generated sizes.
if (!sections.includes(searchSection) && !sections.includes(freshListSection)) env.sizes = [];

const report = await runSections([catalogueSection, ...sections], env);
printReport(report);
const out = path.join(root, '.tmp', 'bench-results.json');
writeReport(report, out);
fs.writeFileSync(path.join(root, '.tmp', 'bench-results.md'), `${markdownTable(report.figures)}\n`);
console.log(`Results written to ${path.relative(root, out)} and .tmp/bench-results.md`);
if (!values.keep) fs.rmSync(env.workDir, { recursive: true, force: true });
process.exit(report.sections.some((s) => s.error) ? 1 : 0);
