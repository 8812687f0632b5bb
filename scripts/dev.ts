import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

// `npm run dev`: the API under tsx watch and Vite's dev server (which proxies /api to it), stopped together.
const root = path.resolve(import.meta.dirname, '..');
const apiPort = process.env.PORT ?? '3000';
const vitePort = process.env.VITE_PORT ?? '5173';
const bin = (name: string) => path.join(root, 'node_modules', '.bin', name);

const children: ChildProcess[] = [];
let stopping = false;

function start(name: string, command: string, args: string[]): ChildProcess {
  const child = spawn(command, args, {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, PORT: apiPort, VITE_PORT: vitePort },
  });
  child.on('error', (err) => {
    console.error(`${name} could not start: ${err.message}`);
    stop(1);
  });
  child.on('exit', (code, signal) => {
    if (!stopping) {
      console.error(`${name} stopped (${signal ?? `exit code ${code}`}); stopping the other one`);
      stop(code || 1);
    } else if (children.every((c) => c.exitCode !== null || c.signalCode !== null)) {
      process.exit(exitCode);
    }
  });
  children.push(child);
  return child;
}

let exitCode = 0;
function stop(code: number) {
  if (stopping) return;
  stopping = true;
  exitCode = code;
  for (const child of children) if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
  if (children.every((c) => c.exitCode !== null || c.signalCode !== null)) process.exit(exitCode);
  // A child that ignores SIGTERM must not keep the terminal.
  setTimeout(() => {
    for (const child of children) if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
    process.exit(exitCode);
  }, 5000).unref();
}

process.on('SIGINT', () => stop(0));
process.on('SIGTERM', () => stop(0));

start('API server', bin('tsx'), ['watch', '--clear-screen=false', 'scripts/start.ts']);
start('Vite', bin('vite'), ['--port', vitePort, '--strictPort', '--host', '127.0.0.1']);
console.log(`\nSpoolyard dev: app http://127.0.0.1:${vitePort}/ (Vite, /api proxied) · API http://127.0.0.1:${apiPort}/api/health\nCtrl-C stops both.\n`);
