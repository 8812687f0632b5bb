import { Router } from 'express';
import { PartsQuerySchema, SuggestQuerySchema } from '../../shared/schemas/parts';
import { notFound, parseOr400 } from '../middleware/errors';
import type { CatalogService } from '../services/catalog';
import { ean13Svg } from '../services/barcodes';

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
    res.type('application/json').vary('Accept-Encoding');
    // Small answers are not worth compressing (as the compression middleware's threshold); large ones go out as the
    // bytes compressed once for the cached answer.
    // Brotli whenever it is accepted at all (browsers list gzip first, at the same weight); else gzip; else plain.
    const encoding = list.json.length < 1024 ? 'identity' : req.acceptsEncodings('br') ? 'br' : req.acceptsEncodings('gzip') ? 'gzip' : 'identity';
    if (encoding === 'br' || encoding === 'gzip') res.set('Content-Encoding', encoding).send(list.encoded(encoding));
    else res.send(list.json);
  });
  // Search as you type: a few matches, from the in-memory index alone (no database read).
  router.get('/suggest', (req, res) => {
    const { q } = parseOr400(SuggestQuerySchema, req.query, 'Type something to search for');
    res.json(catalog.suggestParts(q));
  });
  // The part's GTIN drawn as EAN-13 (the part page shows it small); a part's GTIN never changes, so it keeps a day.
  router.get('/:partNumber/gtin.svg', async (req, res) => {
    const part = catalog.getPart(String(req.params.partNumber).slice(0, 60));
    if (!part) throw notFound(`No part with the number ${String(req.params.partNumber).slice(0, 60)}`);
    res.type('image/svg+xml').set('Cache-Control', 'public, max-age=86400').send(await ean13Svg(part.gtin));
  });
  router.get('/:partNumber', (req, res) => {
    const part = catalog.getPart(String(req.params.partNumber).slice(0, 60));
    if (!part) throw notFound(`No part with the number ${String(req.params.partNumber).slice(0, 60)}`);
    res.json(part);
  });
  return router;
}
