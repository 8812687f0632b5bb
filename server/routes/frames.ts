import { Router } from 'express';
import type { CatalogService } from '../services/catalog';
import { HttpError } from '../middleware/errors';

export function framesRouter(catalog: CatalogService): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ items: catalog.listFrames() });
  });
  router.get('/:code', (req, res) => {
    const frame = /^[A-Za-z]{3}$/.test(req.params.code) ? catalog.getFrame(req.params.code) : null;
    if (!frame) throw new HttpError(404, `No frame ${req.params.code}`);
    res.json(frame);
  });
  return router;
}
