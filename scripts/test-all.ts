import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureChromium } from './ensure-chromium';

// `npm test`: every check in order, stopping at the first failure. The last line is `N passed, N failed` for CI.
const root = path.resolve(import.meta.dirname, '..');
const reportDir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-test-'));
const vitestJson = path.join(reportDir, 'vitest.json');
const playwrightJson = path.join(reportDir, 'playwright.json');

interface Counts {
  passed: number;
  failed: number;
}

interface Step {
  name: string;
  run: () => Promise<number>;
  /** Reads the runner's JSON report after the step; tests that ran are counted even when the step fails. */
  counts?: () => Counts | null;
}

const bin = (name: string) => {
  const local = path.join(root, 'node_modules', '.bin', name);
  return fs.existsSync(local) ? local : name;
};

function exec(command: string, args: string[], env: NodeJS.ProcessEnv = {}): Promise<number> {
  console.log(`$ ${[command, ...args].join(' ')}`);
  return new Promise((resolve) => {
    const child = spawn(bin(command), args, { cwd: root, stdio: 'inherit', env: { ...process.env, ...env } });
    child.on('error', (err) => {
      console.error(`Could not start ${command}: ${err.message}`);
      resolve(1);
    });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

function readJson(file: string): unknown {
  try {
    return JSON.parse(fs.readFileSync(file, 'utf8'));
  } catch {
    return null;
  }
}

function vitestCounts(): Counts | null {
  const r = readJson(vitestJson) as { numPassedTests?: number; numFailedTests?: number } | null;
  return r ? { passed: r.numPassedTests ?? 0, failed: r.numFailedTests ?? 0 } : null;
}

function playwrightCounts(): Counts | null {
  const r = readJson(playwrightJson) as { stats?: { expected?: number; unexpected?: number; flaky?: number } } | null;
  // A test that passed on retry ("flaky") passed.
  return r?.stats ? { passed: (r.stats.expected ?? 0) + (r.stats.flaky ?? 0), failed: r.stats.unexpected ?? 0 } : null;
}

const steps: Step[] = [
  { name: 'Lint', run: () => exec('eslint', ['.']) },
  { name: 'Typecheck', run: () => exec('tsc', ['--noEmit', '-p', 'tsconfig.json']) },
  {
    name: 'Unit and integration tests (vitest)',
    run: () => exec('vitest', ['run', '--reporter=default', '--reporter=json', `--outputFile.json=${vitestJson}`]),
    counts: vitestCounts,
  },
  { name: 'Chromium', run: async () => ensureChromium() },
  { name: 'Client build', run: () => exec('vite', ['build']) },
  {
    name: 'Browser tests (Playwright)',
    run: () => exec('playwright', ['test'], { PLAYWRIGHT_JSON_OUTPUT_NAME: playwrightJson }),
    counts: playwrightCounts,
  },
];

const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;
const started = Date.now();
const total: Counts = { passed: 0, failed: 0 };
let exitCode = 0;

for (const [i, step] of steps.entries()) {
  console.log(`\n== [${i + 1}/${steps.length}] ${step.name} ==`);
  const t0 = Date.now();
  const code = await step.run();
  const counts = step.counts?.() ?? null;
  if (counts) {
    total.passed += counts.passed;
    total.failed += counts.failed;
  }
  if (code !== 0) {
    // A failing step with no failing test in its report (lint, a crash) still counts once, so the summary never reads "0 failed".
    if (!counts || counts.failed === 0) total.failed += 1;
    console.error(`\n${step.name} failed (exit code ${code}) after ${seconds(Date.now() - t0)}; stopping.`);
    exitCode = code;
    break;
  }
  console.log(`${step.name}: ok in ${seconds(Date.now() - t0)}`);
}

fs.rmSync(reportDir, { recursive: true, force: true });
console.log(`\n${exitCode === 0 ? 'All checks passed' : 'Checks failed'} in ${seconds(Date.now() - started)}`);
console.log(`${total.passed} passed, ${total.failed} failed`);
process.exit(exitCode);
