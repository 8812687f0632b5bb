import { Router } from 'express';
import { z } from 'zod';
import { MailOutboxQuerySchema } from '../../shared/schemas/mail-outbox';
import { parseOr400 } from '../middleware/errors';
import { requireRole } from '../middleware/session';
import type { MailOutbox } from '../services/mail-outbox';

const IdSchema = z.coerce.number().int().positive();

/** The Office's view of the mail outbox: what went, what waits, what failed and why, and sending one again. */
export function adminMailRouter(outbox: MailOutbox): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', (req, res) => {
    res.json(outbox.list(parseOr400(MailOutboxQuerySchema, req.query)));
  });

  router.post('/:id/resend', (req, res) => {
    outbox.resend(parseOr400(IdSchema, req.params.id));
    res.json({ ok: true });
  });
  return router;
}
