import { Router } from 'express';
import type { Db } from '../db/client';
import { requireRole } from '../middleware/session';
import { officeSummary } from '../services/office-summary';

/** /api/admin/office — what the Office index shows beside each screen. */
export function adminOfficeRouter(db: Db): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/summary', (_req, res) => {
    res.json(officeSummary(db));
  });
  return router;
}
