import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import { pathToFileURL } from 'node:url';

/** Debian's Chromium: Playwright drives it instead of downloading a browser of its own. */
export const CHROMIUM_PATH = '/usr/bin/chromium';
export const INSTALL_COMMAND = 'sudo apt-get install -y chromium';

function run(command: string, args: string[]): number {
  console.log(`$ ${command} ${args.join(' ')}`);
  const result = spawnSync(command, args, { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  if (result.error) {
    console.error(`Could not run ${command}: ${result.error.message}`);
    return 1;
  }
  return result.status ?? 1;
}

/**
 * Makes sure Chromium is installed; returns an exit code (0 when it is there).
 * Only root installs it; anyone else gets the one command to run, since sudo would prompt mid-run.
 */
export function ensureChromium(): number {
  if (fs.existsSync(CHROMIUM_PATH)) return 0;
  if (process.getuid?.() !== 0) {
    console.error(`Chromium is not installed at ${CHROMIUM_PATH}; the browser tests need it. Install it with:\n\n  ${INSTALL_COMMAND}\n`);
    return 1;
  }
  console.log(`Chromium is missing at ${CHROMIUM_PATH}; installing it with apt-get.`);
  const code = run('apt-get', ['update']) || run('apt-get', ['install', '-y', 'chromium']);
  if (code !== 0) return code;
  if (!fs.existsSync(CHROMIUM_PATH)) {
    console.error(`apt-get finished but ${CHROMIUM_PATH} is still missing.`);
    return 1;
  }
  return 0;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  process.exit(ensureChromium());
}
