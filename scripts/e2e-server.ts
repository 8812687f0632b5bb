import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

// The server the browser tests run against: a fresh database seeded with the demo catalogue on every run.
const root = path.resolve(import.meta.dirname, '..');
const port = process.env.E2E_PORT ?? '3100';
const dbDir = path.join(root, '.tmp', `e2e-${port}`);
const dbFile = path.join(dbDir, 'spoolyard-e2e.db');
const tsx = path.join(root, 'node_modules', '.bin', 'tsx');
const vite = path.join(root, 'node_modules', '.bin', 'vite');

for (const suffix of ['', '-wal', '-shm']) fs.rmSync(`${dbFile}${suffix}`, { force: true });
fs.mkdirSync(dbDir, { recursive: true });

if (!fs.existsSync(path.join(root, 'dist', 'client', 'index.html'))) {
  console.log('dist/client is missing; building the client first');
  const build = spawnSync(vite, ['build'], { cwd: root, stdio: 'inherit' });
  if (build.status !== 0) process.exit(build.status ?? 1);
}

// The fakes get ports of their own, derived from the app's, so several runs can share the machine.
const offset = Number(port) + 10_000;
const child = spawn(tsx, ['scripts/start.ts'], {
  cwd: root,
  stdio: 'inherit',
  env: {
    ...process.env,
    DATABASE_FILE: dbFile,
    UPLOADS_DIR: path.join(dbDir, 'uploads'),
    PORT: port,
    HOST: '127.0.0.1',
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    NODE_ENV: 'test',
    SEED_DEMO: 'true',
    SIGNIN_LIMIT_PER_MINUTE: '200',
    ORDER_PAD_LIMIT_PER_MINUTE: '1000',
    PAYMENTS_API_PORT: String(offset + 11),
    MAIL_PORT: String(offset + 25),
    MAIL_INBOX_URL: `http://127.0.0.1:${offset + 80}`,
  },
});

for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (child.exitCode === null) child.kill(signal);
  });
}
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 0 : 1)));
