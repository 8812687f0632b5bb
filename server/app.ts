import fs from 'node:fs';
import path from 'node:path';
import express from 'express';
import type { Db } from './db/client';
import { apiNotFound, createErrorHandler } from './middleware/errors';
import { framesRouter } from './routes/frames';
import { partsRouter } from './routes/parts';
import { createCatalogService } from './services/catalog';
import { createSearchService } from './services/search';

export interface AppDeps {
  db: Db;
  /** Built client to serve; omitted in API-only tests. */
  clientDir?: string;
  now?: () => Date;
  log?: (err: unknown) => void;
}

export function createApp(deps: AppDeps) {
  const log = deps.log ?? ((err: unknown) => console.error(err));
  const search = createSearchService(deps.db);
  search.rebuild();
  const catalog = createCatalogService(deps.db, search);

  const app = express();
  app.disable('x-powered-by');
  app.set('query parser', 'simple');
  app.use('/api', express.json({ limit: '100kb' }));

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true });
  });
  app.use('/api/parts', partsRouter(catalog));
  app.use('/api/frames', framesRouter(catalog));
  app.use('/api', apiNotFound);

  if (deps.clientDir && fs.existsSync(path.join(deps.clientDir, 'index.html'))) {
    const clientDir = deps.clientDir;
    app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
    app.get('/{*splat}', (_req, res) => {
      res.sendFile(path.join(clientDir, 'index.html'));
    });
  }
  app.use(createErrorHandler(log));
  return { app, search, catalog };
}
