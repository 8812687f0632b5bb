import { Router } from 'express';
import { requireUser } from '../middleware/session';
import type { NoticesService } from '../services/notices';

/** The signed-in buyer's on-site notices: a page of them, the unread count for the header, and marking them read. */
export function noticesRouter(notices: NoticesService): Router {
  const router = Router();
  router.get('/', (req, res) => {
    res.json(notices.list(requireUser(res), Number(req.query.page) || 1));
  });
  router.get('/unread', (_req, res) => {
    res.json(notices.unread(requireUser(res)));
  });
  router.post('/read-all', (_req, res) => {
    res.json(notices.markAllRead(requireUser(res)));
  });
  router.post('/:id/read', (req, res) => {
    res.json(notices.markRead(requireUser(res), Number(req.params.id) || 0));
  });
  return router;
}
