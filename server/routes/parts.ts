import { Router } from 'express';
import { PartsQuerySchema } from '../../shared/schemas/parts';
import { notFound, parseOr400 } from '../middleware/errors';
import type { CatalogService } from '../services/catalog';

export function partsRouter(catalog: CatalogService): Router {
  const router = Router();
  router.get('/', (req, res) => {
    const query = parseOr400(PartsQuerySchema, req.query, 'Some search options are not valid');
    const list = catalog.listPartsJson(query);
    res.set('ETag', list.etag);
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    res.type('application/json').send(list.json);
  });
  router.get('/:partNumber', (req, res) => {
    const part = catalog.getPart(String(req.params.partNumber).slice(0, 60));
    if (!part) throw notFound(`No part with the number ${String(req.params.partNumber).slice(0, 60)}`);
    res.json(part);
  });
  return router;
}
