import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { catalogueSection, type BenchEnv } from './bench-catalogues';
import { checkoutSection } from './bench-checkout';
import { fitmentSection } from './bench-fitment';
import { printReport, runSections, writeReport, type BenchSection } from './bench-harness';
import { httpSection } from './bench-http';
import { pagesSection } from './bench-pages';
import { processesSection } from './bench-processes';
import { searchSection } from './bench-search';

// Usage: npm run bench -- [--parts 50000] [--duration 5] [--only search|throughput|fitment|checkout|process|pages] [--pages] [--keep]
// --pages adds the throttled page loads in Chromium (a few minutes; also alone: npx tsx scripts/bench-pages.ts).
const { values } = parseArgs({
  options: {
    parts: { type: 'string', default: '50000' },
    duration: { type: 'string', default: '5' },
    only: { type: 'string' },
    keep: { type: 'boolean', default: false },
    pages: { type: 'boolean', default: false },
  },
});
const largeParts = Number(values.parts);
const httpDurationS = Number(values.duration);
if (!Number.isInteger(largeParts) || largeParts < 1000 || largeParts > 500_000) throw new Error('--parts must be a whole number from 1000 to 500000');
if (!Number.isInteger(httpDurationS) || httpDurationS < 1 || httpDurationS > 30) throw new Error('--duration must be 1 to 30 seconds');

const root = path.resolve(import.meta.dirname, '..');
const env: BenchEnv = { root, workDir: path.join(root, '.tmp', 'bench'), largeParts, httpDurationS, catalogues: [] };

const sections: Array<BenchSection<BenchEnv>> = [searchSection, httpSection, fitmentSection, checkoutSection, processesSection, ...(values.pages || values.only ? [pagesSection] : [])].filter((s) => !values.only || s.name.toLowerCase().includes(values.only.toLowerCase()));

const report = await runSections([catalogueSection, ...sections], env);
printReport(report);
const out = path.join(root, '.tmp', 'bench-results.json');
writeReport(report, out);
console.log(`Results written to ${path.relative(root, out)}`);
if (!values.keep) fs.rmSync(env.workDir, { recursive: true, force: true });
process.exit(report.sections.some((s) => s.error) ? 1 : 0);
