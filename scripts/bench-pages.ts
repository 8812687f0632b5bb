import { fork, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import express from 'express';
import { chromium, type Browser, type BrowserContextOptions, type Page } from '@playwright/test';
import { generateCatalogue } from '../catalog-seed/generate';
import { loadCatalogue } from '../catalog-seed/load';
import { createApp } from '../server/app';
import { openDatabase } from '../server/db/client';
import { offlineDeps, testConfig } from '../tests/support/app-deps';
import { removeDatabase, type BenchEnv } from './bench-catalogues';
import { section, type SectionContext } from './bench-harness';

/*
 * First-page load of the storefront in Chromium on a slow phone profile: 150 ms round trip, 1.6 Mbit/s down,
 * 750 kbit/s up, the CPU slowed four times, nothing cached (a fresh browser context per load). LCP, FCP and CLS come
 * from the page's own PerformanceObserver (buffered), so they are what the browser itself reports.
 *
 * Each page is measured beside a reference of the same page without scripts, served by the same server: the page as
 * the app finally draws it (its DOM saved after an unthrottled load), with every script and module preload taken out.
 * The literal index.html without its script is an empty <div id="root"> that never paints, so it measures nothing;
 * the saved page is what the same HTML, stylesheet and fonts would cost if no JavaScript had to run first — the floor
 * the app's figures are compared with. Loads are interleaved (page by page, app then reference, run after run) so a
 * busy machine slows both alike; medians are reported with the ratio to the reference.
 *
 * Alone: `npx tsx scripts/bench-pages.ts [--runs 5] [--desktop] [--port 0]` (needs `npm run build`; builds the client
 * if dist/client is missing; `--client DIR` serves another build; `--compare DIR` measures a second build in the same
 * interleaved runs, which is the fair way to compare two builds on a busy machine).
 * In the full benchmark: `npm run bench -- --pages` or `--only pages`.
 */

const PROFILE = { latencyMs: 150, downBitsPerS: 1_600_000, upBitsPerS: 750_000, cpuSlowdown: 4 };
const TARGETS = { lcpMs: 2500, fcpMs: 1800, cls: 0.1 };
const PHONE: BrowserContextOptions = { viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true };
const DESKTOP: BrowserContextOptions = { viewport: { width: 1280, height: 800 } };
const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];
const REFERENCE_PREFIX = '/__bench/no-script/';

interface PageLoad {
  lcp: number;
  fcp: number;
  cls: number;
  lcpElement: string;
  /** The largest single layout shift: its size and what moved. */
  worstShift: string;
  jsBytes: number;
  jsFiles: number;
  /** When the first API request started, from navigation start (ms); -1 when the page made none. */
  firstApiStart: number;
  /** When the last API request of the load started. */
  lastApiStart: number;
}

interface PageSpec {
  name: string;
  path: string;
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  if (s.length === 0) return Number.NaN;
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
};

/** Runs in the page before any of its scripts: collects paint and layout-shift entries as they are reported. */
const OBSERVE = `(() => {
  const m = { lcp: 0, lcpElement: '', fcp: 0, shifts: [] };
  window.__pageMetrics = m;
  const describe = (el) => el ? el.tagName.toLowerCase() + (el.id ? '#' + el.id : '') + (typeof el.className === 'string' && el.className ? '.' + el.className.trim().split(/\\s+/).slice(0, 3).join('.') : '') + ' "' + (el.textContent || '').trim().slice(0, 40) + '"' : '';
  new PerformanceObserver((l) => { for (const e of l.getEntries()) { m.lcp = e.renderTime || e.startTime; m.lcpElement = describe(e.element); } }).observe({ type: 'largest-contentful-paint', buffered: true });
  new PerformanceObserver((l) => { for (const e of l.getEntries()) if (e.name === 'first-contentful-paint') m.fcp = e.startTime; }).observe({ type: 'paint', buffered: true });
  new PerformanceObserver((l) => { for (const e of l.getEntries()) if (!e.hadRecentInput) m.shifts.push([e.startTime, e.value, (e.sources || []).map((x) => describe(x.node)).join(' + ')]); }).observe({ type: 'layout-shift', buffered: true });
})();`;

/** CLS as browsers define it: the largest session window of shifts (gaps under 1 s, windows up to 5 s). */
function cumulativeLayoutShift(shifts: Array<[number, number, string]>): number {
  let best = 0;
  let current = 0;
  let windowStart = -Infinity;
  let last = -Infinity;
  for (const [t, v] of shifts) {
    if (t - last > 1000 || t - windowStart > 5000) {
      current = 0;
      windowStart = t;
    }
    current += v;
    last = t;
    best = Math.max(best, current);
  }
  return best;
}

async function measure(browser: Browser, url: string, device: BrowserContextOptions): Promise<PageLoad> {
  const context = await browser.newContext(device);
  try {
    await context.addInitScript(OBSERVE);
    const page = await context.newPage();
    const cdp = await context.newCDPSession(page);
    await cdp.send('Network.enable');
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: PROFILE.latencyMs,
      downloadThroughput: PROFILE.downBitsPerS / 8,
      uploadThroughput: PROFILE.upBitsPerS / 8,
    });
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: PROFILE.cpuSlowdown });
    await page.goto(url, { waitUntil: 'load', timeout: 60_000 });
    await settle(page);
    const raw = await page.evaluate(() => {
      const m = (window as unknown as { __pageMetrics: { lcp: number; lcpElement: string; fcp: number; shifts: Array<[number, number, string]> } }).__pageMetrics;
      const resources = performance.getEntriesByType('resource') as PerformanceResourceTiming[];
      const js = resources.filter((r) => /\.m?js(\?|$)/.test(new URL(r.name).pathname));
      const api = resources.filter((r) => new URL(r.name).pathname.startsWith('/api/')).map((r) => r.startTime);
      return { ...m, jsBytes: js.reduce((s, r) => s + r.transferSize, 0), jsFiles: js.length, api };
    });
    return {
      lcp: raw.lcp,
      fcp: raw.fcp,
      cls: cumulativeLayoutShift(raw.shifts),
      lcpElement: raw.lcpElement,
      worstShift: raw.shifts.reduce((w, x) => (x[1] > w[1] ? x : w), [0, 0, ''] as [number, number, string]).slice(1).join(' ').trim(),
      jsBytes: raw.jsBytes,
      jsFiles: raw.jsFiles,
      firstApiStart: raw.api.length ? Math.min(...raw.api) : -1,
      lastApiStart: raw.api.length ? Math.max(...raw.api) : -1,
    };
  } finally {
    await context.close();
  }
}

/**
 * Waits until the page has fetched nothing new for 1.5 s (at most 30 s): late requests, shifts and a late largest
 * paint still count. (Playwright's networkidle can wait forever on a busy machine.)
 */
async function settle(page: Page) {
  const started = Date.now();
  let count = -1;
  let quietSince = Date.now();
  while (Date.now() - started < 30_000) {
    const now = await page.evaluate(() => performance.getEntriesByType('resource').length);
    if (now !== count) {
      count = now;
      quietSince = Date.now();
    } else if (Date.now() - quietSince >= 1500) return;
    await page.waitForTimeout(250);
  }
}

/** Loads the page unthrottled and keeps its finished DOM without scripts: the no-script reference. */
async function saveReference(browser: Browser, base: string, spec: PageSpec, dir: string, device: BrowserContextOptions) {
  const context = await browser.newContext(device);
  try {
    const page = await context.newPage();
    await page.goto(`${base}${spec.path}`, { waitUntil: 'load', timeout: 60_000 });
    await settle(page);
    const html = await page.evaluate(() => {
      for (const el of document.querySelectorAll('script, link[rel="modulepreload"], link[rel="prefetch"]')) el.remove();
      return `<!doctype html>\n${document.documentElement.outerHTML}`;
    });
    fs.writeFileSync(path.join(dir, `${spec.name}.html`), html);
  } finally {
    await context.close();
  }
}

/** The server child: the app as built, and the saved references under their own prefix, on 127.0.0.1. */
async function serve(dbFile: string, clientDir: string, referenceDir: string, port: number) {
  const db = openDatabase(dbFile);
  const { app } = createApp(offlineDeps(db, { clientDir, config: testConfig({ devTools: false }) }));
  const outer = express();
  outer.disable('x-powered-by');
  outer.get(`${REFERENCE_PREFIX}:name`, (req, res) => {
    const file = path.join(referenceDir, `${path.basename(req.params.name)}.html`);
    if (!fs.existsSync(file)) return void res.status(404).end();
    res.set('Cache-Control', 'no-cache').type('html').send(fs.readFileSync(file));
  });
  outer.use(app);
  const server = outer.listen(port, '127.0.0.1', () => {
    const address = server.address();
    process.send?.({ port: typeof address === 'object' && address ? address.port : port });
  });
  const stop = () => {
    server.closeAllConnections();
    server.close();
    db.$client.close();
    process.exit(0);
  };
  process.on('SIGTERM', stop);
  process.on('disconnect', stop);
}

function startServer(root: string, dbFile: string, clientDir: string, referenceDir: string, port: number): Promise<{ port: number; child: ChildProcess }> {
  const child = fork(import.meta.filename, ['--serve', dbFile, clientDir, referenceDir, String(port)], {
    cwd: root,
    execArgv: ['--import', 'tsx'],
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error('the page benchmark server did not start within 120 s')), 120_000);
    child.once('message', (m: { port: number }) => {
      clearTimeout(timer);
      resolve({ port: m.port, child });
    });
    child.once('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`the page benchmark server exited (${code})`));
    });
  });
}

function stopProcess(child: ChildProcess) {
  if (child.exitCode === null && child.signalCode === null && child.pid) process.kill(child.pid, 'SIGTERM');
}

export interface PagesOptions {
  root: string;
  workDir: string;
  runs: number;
  port: number;
  desktop: boolean;
  /** The built client to serve; dist/client by default. */
  clientDir?: string;
  /** Another build (say, before a change) measured in the same runs, interleaved, from a second server. */
  compareDir?: string;
}

export async function runPageBench(ctx: SectionContext, options: PagesOptions) {
  const { root, workDir, runs } = options;
  const clientDir = options.clientDir ?? path.join(root, 'dist', 'client');
  if (!options.clientDir && !fs.existsSync(path.join(clientDir, 'index.html'))) {
    ctx.log('dist/client is missing; building the client first');
    const build = spawnSync(path.join(root, 'node_modules', '.bin', 'vite'), ['build'], { cwd: root, stdio: 'inherit' });
    if (build.status !== 0) throw new Error('the client build failed');
  }
  const referenceDir = path.join(workDir, 'no-script');
  fs.mkdirSync(referenceDir, { recursive: true });
  const dbFile = path.join(workDir, 'pages.db');
  removeDatabase(dbFile);
  const db = openDatabase(dbFile);
  loadCatalogue(db, generateCatalogue());
  db.$client.close();

  const device = options.desktop ? DESKTOP : PHONE;
  const { port, child } = await startServer(root, dbFile, clientDir, referenceDir, options.port);
  const base = `http://127.0.0.1:${port}`;
  const other = options.compareDir ? await startServer(root, dbFile, options.compareDir, referenceDir, 0) : null;
  const otherBase = other ? `http://127.0.0.1:${other.port}` : null;
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS, headless: true });
  try {
    const list = (await (await fetch(`${base}/api/parts?category=turbochargers`)).json()) as { items: Array<{ partNumber: string }> };
    const partNumber = list.items[0]?.partNumber;
    if (!partNumber) throw new Error('the demo catalogue has no turbocharger to open');
    const pages: PageSpec[] = [
      { name: 'home', path: '/' },
      { name: 'catalogue', path: '/catalogue' },
      { name: 'part', path: `/parts/${encodeURIComponent(partNumber)}` },
      { name: 'fitment', path: '/fitment' },
    ];
    for (const p of pages) await saveReference(browser, base, p, referenceDir, device);

    const results = new Map<string, { app: PageLoad[]; ref: PageLoad[]; other: PageLoad[] }>(pages.map((p) => [p.name, { app: [], ref: [], other: [] }]));
    for (let run = 1; run <= runs; run++) {
      for (const p of pages) {
        const r = results.get(p.name)!;
        const load = await measure(browser, `${base}${p.path}`, device);
        if (load.jsFiles === 0) throw new Error(`${p.name} loaded no scripts: is ${clientDir} a built client the server can send?`);
        r.app.push(load);
        r.ref.push(await measure(browser, `${base}${REFERENCE_PREFIX}${p.name}`, device));
        if (otherBase) r.other.push(await measure(browser, `${otherBase}${p.path}`, device));
      }
      ctx.log(`run ${run} of ${runs} done`);
    }

    const ms = (x: number) => `${Math.round(x)}`;
    const ratio = (a: number, b: number) => (b > 0 ? `${(a / b).toFixed(2)}×` : '–');
    const lines = [
      `Throttled first load (${PROFILE.latencyMs} ms RTT, ${PROFILE.downBitsPerS / 1e6} Mbit/s down, ${PROFILE.upBitsPerS / 1e3} kbit/s up, ${PROFILE.cpuSlowdown}× CPU, cold cache, ${options.desktop ? 'desktop 1280×800' : 'phone 390×844'}), medians of ${runs} runs; "no-script" is the finished page saved without scripts, served by the same server.`,
      '',
      '| page | LCP ms | no-script | ratio | FCP ms | no-script | ratio | CLS | no-script | JS kB sent | JS files | first API request at ms |',
      '|---|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|---:|',
    ];
    for (const p of pages) {
      const { app, ref } = results.get(p.name)!;
      const m = (xs: PageLoad[], k: keyof PageLoad) => median(xs.map((x) => x[k] as number));
      const [lcp, rlcp, fcp, rfcp, cls, rcls] = [m(app, 'lcp'), m(ref, 'lcp'), m(app, 'fcp'), m(ref, 'fcp'), m(app, 'cls'), m(ref, 'cls')];
      lines.push(
        `| ${p.name} | ${ms(lcp)} | ${ms(rlcp)} | ${ratio(lcp, rlcp)} | ${ms(fcp)} | ${ms(rfcp)} | ${ratio(fcp, rfcp)} | ${cls.toFixed(3)} | ${rcls.toFixed(3)} | ${(m(app, 'jsBytes') / 1024).toFixed(1)} | ${m(app, 'jsFiles')} | ${ms(m(app, 'firstApiStart'))} |`,
      );
      ctx.record(`${p.name}: LCP`, lcp, 'ms', { target: { op: '<=', value: TARGETS.lcpMs }, detail: `no-script ${ms(rlcp)} ms` });
      ctx.record(`${p.name}: FCP`, fcp, 'ms', { target: { op: '<=', value: TARGETS.fcpMs }, detail: `no-script ${ms(rfcp)} ms` });
      ctx.record(`${p.name}: CLS`, cls, '', { target: { op: '<=', value: TARGETS.cls } });
      ctx.table(`${p.name}: runs`, ['run', 'LCP ms', 'FCP ms', 'CLS', 'ref LCP', 'ref FCP', 'LCP element', 'largest shift'], app.map((a, i) => [String(i + 1), a.lcp, a.fcp, a.cls.toFixed(3), ref[i]!.lcp, ref[i]!.fcp, a.lcpElement, a.worstShift.slice(0, 90)]));
    }
    if (other) {
      lines.push('', `Compared in the same runs: ${options.compareDir}`, '', '| page | LCP ms | ratio to no-script | FCP ms | ratio | CLS | JS kB sent | JS files | first API request at ms |', '|---|---:|---:|---:|---:|---:|---:|---:|---:|');
      for (const p of pages) {
        const { other: o, ref } = results.get(p.name)!;
        const m = (xs: PageLoad[], k: keyof PageLoad) => median(xs.map((x) => x[k] as number));
        lines.push(
          `| ${p.name} | ${ms(m(o, 'lcp'))} | ${ratio(m(o, 'lcp'), m(ref, 'lcp'))} | ${ms(m(o, 'fcp'))} | ${ratio(m(o, 'fcp'), m(ref, 'fcp'))} | ${m(o, 'cls').toFixed(3)} | ${(m(o, 'jsBytes') / 1024).toFixed(1)} | ${m(o, 'jsFiles')} | ${ms(m(o, 'firstApiStart'))} |`,
        );
      }
    }
    console.log(`\n${lines.join('\n')}\n`);
  } finally {
    await browser.close();
    stopProcess(child);
    if (other) stopProcess(other.child);
  }
}

export const pagesSection = section<BenchEnv>('Pages', (ctx, env) =>
  runPageBench(ctx, { root: env.root, workDir: path.join(env.workDir, 'pages'), runs: 5, port: 0, desktop: false }),
);

const invokedDirectly = path.resolve(process.argv[1] ?? '') === import.meta.filename;
if (invokedDirectly && process.argv[2] === '--serve') {
  const [dbFile, clientDir, referenceDir, port] = process.argv.slice(3);
  await serve(dbFile!, clientDir!, referenceDir!, Number(port));
} else if (invokedDirectly) {
  const { printReport, runSections } = await import('./bench-harness');
  const { values } = parseArgs({
    options: { runs: { type: 'string', default: '5' }, port: { type: 'string', default: '0' }, desktop: { type: 'boolean', default: false }, keep: { type: 'boolean', default: false }, client: { type: 'string' }, compare: { type: 'string' } },
  });
  const runs = Number(values.runs);
  if (!Number.isInteger(runs) || runs < 1 || runs > 50) throw new Error('--runs must be 1 to 50');
  const root = path.resolve(import.meta.dirname, '..');
  const workDir = path.join(root, '.tmp', 'bench-pages');
  const report = await runSections([section('Pages', (ctx) => runPageBench(ctx, { root, workDir, runs, port: Number(values.port), desktop: values.desktop, clientDir: values.client && path.resolve(values.client), compareDir: values.compare && path.resolve(values.compare) }))], null);
  printReport(report);
  if (!values.keep) fs.rmSync(workDir, { recursive: true, force: true });
  process.exit(report.sections.some((s) => s.error) ? 1 : 0);
}
