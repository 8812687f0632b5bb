import { spawn, type ChildProcess } from 'node:child_process';
import net, { type AddressInfo } from 'node:net';
import path from 'node:path';

/** A port nothing listens on now, on 127.0.0.1. */
export async function freePort(): Promise<number> {
  const probe = net.createServer();
  await new Promise<void>((resolve) => probe.listen(0, '127.0.0.1', () => resolve()));
  const { port } = probe.address() as AddressInfo;
  await new Promise<void>((resolve) => probe.close(() => resolve()));
  return port;
}

export interface ServerProcess {
  url: string;
  child: ChildProcess;
  /** Everything the process has printed so far. */
  output: () => string;
  /** SIGTERM, resolved with the exit code once it has ended. */
  stop: () => Promise<number | null>;
}

/**
 * The real server as `npm start` runs it (`server/index.ts` under tsx) on a free port, with only the given
 * environment; resolves once it says it is running.
 */
export async function startServerProcess(root: string, env: Record<string, string>, timeoutMs = 120_000): Promise<ServerProcess> {
  const port = await freePort();
  const child = spawn(path.join(root, 'node_modules/.bin/tsx'), ['server/index.ts'], { cwd: root, env: { PATH: process.env.PATH, ...env, PORT: String(port) } });
  let output = '';
  await new Promise<void>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not start within ${timeoutMs / 1000} s:\n${output}`)), timeoutMs);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('is running at')) {
        clearTimeout(timer);
        resolve();
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    child.once('exit', (code) => reject(new Error(`the server exited (${code}):\n${output}`)));
  });
  const stop = () =>
    new Promise<number | null>((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve(child.exitCode);
      child.once('exit', (code) => resolve(code));
      child.kill('SIGTERM');
    });
  return { url: `http://127.0.0.1:${port}`, child, output: () => output, stop };
}
