import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import fs from 'node:fs';
import Database from 'better-sqlite3';
import express from 'express';
import { createApp } from '../server/app';
import { offlineDeps } from '../tests/support/app-deps';
import { openDatabase } from '../server/db/client';

// Child process of the HTTP benchmark: the servers under load, away from the load generator's event loop.
// argv: the demo catalogue's file, then any further catalogue files; replies with the ports over IPC.
const [demoFile, ...otherFiles] = process.argv.slice(2);
if (!demoFile || !process.send) {
  console.error('bench-servers: run by scripts/bench-http.ts with catalogue files as arguments');
  process.exit(2);
}

const listen = (app: express.Express) =>
  new Promise<Server>((resolve) => {
    const server = app.listen(0, '127.0.0.1', () => resolve(server));
  });
const portOf = (s: Server) => (s.address() as AddressInfo).port;

const servers: Server[] = [];
const ports: Record<string, number> = {};

const bare = express();
bare.disable('x-powered-by');
bare.get('/bare', (_req, res) => {
  res.json({ ok: true, items: [{ partNumber: 'QQQ-00-0000', priceCents: 100 }] });
});
servers.push(await listen(bare));
ports.bareJson = portOf(servers.at(-1)!);

const demoDb = openDatabase(demoFile);
const lookup = demoDb.$client.prepare('SELECT id, part_number AS partNumber, title, category, price_cents AS priceCents FROM parts WHERE id = ?');
const maxId = demoDb.$client.prepare('SELECT max(id) FROM parts').pluck().get() as number;
const bareSqlite = express();
bareSqlite.disable('x-powered-by');
bareSqlite.get('/part', (_req, res) => {
  res.json(lookup.get(1 + Math.floor(Math.random() * maxId)) ?? null);
});
servers.push(await listen(bareSqlite));
ports.bareSqlite = portOf(servers.at(-1)!);

// A bare write: JSON body in, one insert in its own transaction on a scratch file kept as the app keeps its own (WAL,
// synchronous NORMAL), a small JSON answer out. A card order is measured against two of these.
const scratchFile = `${demoFile}.scratch.db`;
for (const suffix of ['', '-wal', '-shm']) fs.rmSync(`${scratchFile}${suffix}`, { force: true });
const scratch = new Database(scratchFile);
scratch.pragma('journal_mode = WAL');
scratch.pragma('synchronous = NORMAL');
scratch.exec('CREATE TABLE writes (id INTEGER PRIMARY KEY, part_number TEXT NOT NULL, quantity INTEGER NOT NULL)');
const insert = scratch.prepare('INSERT INTO writes (part_number, quantity) VALUES (?, ?)');
const bareWrite = express();
bareWrite.disable('x-powered-by');
bareWrite.post('/write', express.json(), (req, res) => {
  const body = req.body as { partNumber?: unknown; quantity?: unknown };
  const id = insert.run(String(body.partNumber ?? ''), Number(body.quantity ?? 1)).lastInsertRowid;
  res.status(201).json({ id: Number(id) });
});
servers.push(await listen(bareWrite));
ports.bareWrite = portOf(servers.at(-1)!);

const dbs = [demoDb];
for (const [i, file] of [demoFile, ...otherFiles].entries()) {
  const db = i === 0 ? demoDb : openDatabase(file);
  if (i > 0) dbs.push(db);
  const { app } = createApp(offlineDeps(db));
  servers.push(await listen(app));
  ports[`app${i}`] = portOf(servers.at(-1)!);
}

process.send({ ports });
process.on('SIGTERM', () => {
  for (const s of servers) s.closeAllConnections();
  for (const db of dbs) db.$client.close();
  scratch.close();
  process.exit(0);
});
process.on('disconnect', () => process.exit(0));
