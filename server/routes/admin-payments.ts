import { Router } from 'express';
import { HttpError } from '../middleware/errors';
import { requireRole } from '../middleware/session';
import type { OrderService } from '../services/orders';

/** Payment alerts for staff: payments that arrived for orders no longer awaiting one, and their automatic refunds. */
export function adminPaymentsRouter(orders: OrderService): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', (_req, res) => {
    res.json({ items: orders.listPaymentAlerts() });
  });

  router.post('/:id/retry-refund', async (req, res) => {
    const id = Number(req.params.id);
    if (!Number.isInteger(id) || id <= 0) throw new HttpError(404, 'No such payment alert');
    const alert = await orders.retryAlertRefund(id);
    if (!alert) throw new HttpError(404, 'No such payment alert');
    res.json(alert);
  });
  return router;
}
