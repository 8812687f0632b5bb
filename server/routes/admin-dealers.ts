import { Router } from 'express';
import { DealerDecisionSchema, DealersQuerySchema, InvoicePaymentSchema } from '../../shared/schemas/accounts';
import { parseOr400 } from '../middleware/errors';
import { requireRole } from '../middleware/session';
import type { DealerAccountsService } from '../services/dealer-accounts';

export function adminDealersRouter(dealers: DealerAccountsService): Router {
  const router = Router();
  router.use(requireRole('admin'));

  router.get('/', (req, res) => {
    res.json(dealers.list(parseOr400(DealersQuerySchema, req.query, 'Some paging options are not valid')));
  });

  router.get('/:id/invoices', (req, res) => {
    res.json({ items: dealers.openInvoices(Number(req.params.id)) });
  });

  router.post('/:id/invoices/:number/paid', (req, res) => {
    const { reference } = parseOr400(InvoicePaymentSchema, req.body);
    res.json(dealers.recordInvoicePaid(Number(req.params.id), String(req.params.number).slice(0, 20), reference));
  });

  router.post('/:id/decision', (req, res) => {
    const input = parseOr400(DealerDecisionSchema, req.body);
    res.json(dealers.decide(Number(req.params.id), input));
  });
  return router;
}
