import { Router } from 'express';
import type { Db } from '../db/client';
import { DealerDecisionSchema, InvoicePaymentSchema } from '../../shared/schemas/accounts';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireRole } from '../middleware/session';

export interface DealerDecisionEvent {
  dealerAccountId: number;
  decision: 'approve' | 'decline';
}

export function adminDealersRouter(deps: { db: Db; onDecision: (e: DealerDecisionEvent) => void }): Router {
  const router = Router();
  const sqlite = deps.db.$client;
  router.use(requireRole('admin'));

  router.get('/', (_req, res) => {
    const items = sqlite
      .prepare(
        `SELECT d.id, d.company_name AS companyName, d.contact_name AS contactName, u.email, d.phone, d.city, d.status, d.tier,
                d.credit_limit_cents AS creditLimitCents, d.payment_terms_days AS paymentTermsDays, d.created_at AS createdAt,
                (SELECT COALESCE(SUM(o.total_cents - o.refunded_cents), 0) FROM orders o WHERE o.dealer_account_id = d.id AND o.payment_method = 'account'
                   AND o.payment_state = 'on_account' AND o.status NOT IN ('cancelled', 'returned')) AS openBalanceCents
         FROM dealer_accounts d JOIN dealer_members m ON m.dealer_account_id = d.id JOIN user u ON u.id = m.user_id
         GROUP BY d.id ORDER BY CASE d.status WHEN 'pending' THEN 0 ELSE 1 END, d.id DESC`,
      )
      .all();
    res.json({ items });
  });

  /** Open on-account invoices of a dealer, with their due dates from the payment terms. */
  router.get('/:id/invoices', (req, res) => {
    const id = Number(req.params.id);
    if (!sqlite.prepare('SELECT 1 FROM dealer_accounts WHERE id = ?').get(id)) throw new HttpError(404, 'No such dealer account');
    const items = sqlite
      .prepare(
        `SELECT o.number, o.created_at AS createdAt, o.purchase_order AS purchaseOrder, o.total_cents AS totalCents, o.refunded_cents AS creditedCents,
                o.total_cents - o.refunded_cents AS openCents, o.payment_terms_days AS termsDays,
                strftime('%Y-%m-%d', o.created_at, '+' || COALESCE(o.payment_terms_days, 30) || ' days') AS dueDate,
                (SELECT group_concat(c.number, ', ') FROM credit_notes c WHERE c.order_id = o.id) AS creditNotes
         FROM orders o WHERE o.dealer_account_id = ? AND o.payment_method = 'account' AND o.payment_state = 'on_account'
           AND o.status NOT IN ('cancelled', 'returned') ORDER BY o.id`,
      )
      .all(id);
    res.json({ items });
  });

  router.post('/:id/invoices/:number/paid', (req, res) => {
    const id = Number(req.params.id);
    const { reference } = parseOr400(InvoicePaymentSchema, req.body);
    const order = sqlite
      .prepare("SELECT id, payment_state AS state FROM orders WHERE number = ? AND dealer_account_id = ? AND payment_method = 'account'")
      .get(String(req.params.number).slice(0, 20), id) as { id: number; state: string } | undefined;
    if (!order) throw new HttpError(404, 'No such invoice on this account');
    if (order.state !== 'on_account') throw new HttpError(409, 'This invoice is already paid');
    sqlite.transaction(() => {
      sqlite.prepare("UPDATE orders SET payment_state = 'paid', updated_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?").run(order.id);
      sqlite.prepare("INSERT INTO order_events (order_id, status, note) VALUES (?, 'invoice_paid', ?)").run(order.id, `Payment received, reference ${reference}`);
    })();
    res.json({ number: req.params.number, paymentState: 'paid' });
  });

  router.post('/:id/decision', (req, res) => {
    const id = Number(req.params.id);
    const input = parseOr400(DealerDecisionSchema, req.body);
    const dealer = sqlite.prepare('SELECT id, status FROM dealer_accounts WHERE id = ?').get(id) as { id: number; status: string } | undefined;
    if (!dealer) throw new HttpError(404, 'No such dealer account');
    sqlite.transaction(() => {
      if (input.decision === 'approve') {
        sqlite
          .prepare(
            "UPDATE dealer_accounts SET status = 'approved', tier = ?, credit_limit_cents = ?, payment_terms_days = ?, decline_reason = NULL, decided_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?",
          )
          .run(input.tier, input.creditLimitCents, input.paymentTermsDays, id);
        sqlite.prepare("UPDATE user SET role = 'dealer' WHERE id IN (SELECT user_id FROM dealer_members WHERE dealer_account_id = ?) AND role = 'customer'").run(id);
      } else {
        if (dealer.status === 'approved') throw new HttpError(409, 'An approved account is not declined; change its terms instead');
        sqlite
          .prepare("UPDATE dealer_accounts SET status = 'declined', decline_reason = ?, decided_at = strftime('%Y-%m-%dT%H:%M:%fZ','now') WHERE id = ?")
          .run(input.reason, id);
      }
    })();
    deps.onDecision({ dealerAccountId: id, decision: input.decision });
    res.json({ id, status: input.decision === 'approve' ? 'approved' : 'declined' });
  });
  return router;
}
