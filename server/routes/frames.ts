import { Router } from 'express';
import type { CatalogService } from '../services/catalog';

export function framesRouter(catalog: CatalogService): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ items: catalog.listFrames() });
  });
  return router;
}
