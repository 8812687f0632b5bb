import { defineConfig, devices } from '@playwright/test';

const port = Number(process.env.E2E_PORT ?? 3100);
const baseURL = `http://127.0.0.1:${port}`;
const ci = Boolean(process.env.CI);

export default defineConfig({
  testDir: 'e2e',
  testMatch: '**/*.spec.ts',
  outputDir: 'test-results',
  fullyParallel: false,
  // Two cores: one for the server, one for the browser.
  workers: 1,
  retries: ci ? 1 : 0,
  forbidOnly: ci,
  // Journeys run a server, a browser and axe on two cores: a minute each leaves room for a busy machine.
  timeout: 60_000,
  expect: { timeout: 5_000 },
  reporter: [['list'], ['json', { outputFile: process.env.PLAYWRIGHT_JSON_OUTPUT_NAME ?? 'test-results/report.json' }]],
  use: {
    ...devices['Desktop Chrome'],
    baseURL,
    headless: true,
    screenshot: 'only-on-failure',
    trace: 'retain-on-failure',
    launchOptions: {
      // Debian's Chromium rather than a browser Playwright downloads.
      executablePath: '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    },
  },
  projects: [{ name: 'chromium' }],
  webServer: {
    // Through node_modules/.bin so it also works when Playwright is started without npm.
    command: 'node_modules/.bin/tsx scripts/e2e-server.ts',
    url: `${baseURL}/api/health`,
    env: { E2E_PORT: String(port) },
    reuseExistingServer: !ci,
    // Allows for a client build when dist/client is missing.
    timeout: 180_000,
    stdout: 'pipe',
    stderr: 'pipe',
    gracefulShutdown: { signal: 'SIGTERM', timeout: 5_000 },
  },
});
