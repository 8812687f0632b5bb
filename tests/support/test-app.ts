import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { generateCatalogue, type GenerateOptions } from '../../catalog-seed/generate';
import { loadCatalogue } from '../../catalog-seed/load';
import { createApp, type AppDeps } from '../../server/app';
import { openDatabase, type Db } from '../../server/db/client';

export interface TestApp {
  db: Db;
  url: string;
  dir: string;
  get: (p: string, init?: RequestInit) => Promise<{ status: number; body: unknown; headers: Headers }>;
  send: (method: string, p: string, body?: unknown, headers?: Record<string, string>) => Promise<{ status: number; body: unknown; headers: Headers }>;
  close: () => Promise<void>;
  app: ReturnType<typeof createApp>;
}

/** A fresh, migrated SQLite file with the demo catalogue, and the real app listening on 127.0.0.1. */
export function createTestDb(options: GenerateOptions = {}): { db: Db; dir: string } {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-test-'));
  const db = openDatabase(path.join(dir, 'test.db'));
  loadCatalogue(db, generateCatalogue(options));
  return { db, dir };
}

export async function startTestApp(deps: Partial<AppDeps> = {}, options: GenerateOptions = {}): Promise<TestApp> {
  const { db, dir } = deps.db ? { db: deps.db, dir: fs.mkdtempSync(path.join(os.tmpdir(), 'spoolyard-test-')) } : createTestDb(options);
  const app = createApp({ ...deps, db });
  const server: Server = await new Promise((resolve) => {
    const s = app.app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const read = async (res: Response) => {
    const text = await res.text();
    let body: unknown = text;
    try {
      body = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON */
    }
    return { status: res.status, body, headers: res.headers };
  };
  return {
    db,
    url,
    dir,
    app,
    get: async (p, init) => read(await fetch(`${url}${p}`, init)),
    send: async (method, p, body, headers = {}) =>
      read(await fetch(`${url}${p}`, { method, headers: { 'content-type': 'application/json', ...headers }, body: body === undefined ? undefined : JSON.stringify(body) })),
    close: async () => {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      db.$client.close();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
