import { Router } from 'express';
import type { Db } from '../db/client';
import { DealerApplicationSchema } from '../../shared/schemas/accounts';
import { HttpError, parseOr400 } from '../middleware/errors';
import { currentUser, requireUser } from '../middleware/session';

export interface AccountRouterDeps {
  db: Db;
  payments: { mode: 'test' | 'live'; publishableKey: string; testMethods?: Array<{ id: string; label: string }> };
  demoAccounts?: Array<{ role: string; email: string; password: string }>;
  onDealerApplied: (dealerAccountId: number, user: { email: string; name: string }) => void;
}

export function accountRouter(deps: AccountRouterDeps): Router {
  const router = Router();
  const sqlite = deps.db.$client;
  const openBalance = sqlite.prepare(
    `SELECT COALESCE(SUM(total_cents - refunded_cents), 0) AS n FROM orders
     WHERE dealer_account_id = ? AND payment_method = 'account' AND payment_state = 'on_account' AND status NOT IN ('cancelled', 'returned')`,
  );

  router.get('/me', (_req, res) => {
    const user = currentUser(res);
    res.json({
      user: user && {
        ...user,
        dealer: user.dealer && { ...user.dealer, openBalanceCents: (openBalance.get(user.dealer.id) as { n: number }).n },
      },
      ...(deps.demoAccounts ? { demoAccounts: deps.demoAccounts } : {}),
      payments: deps.payments,
    });
  });

  router.post('/dealer-applications', (req, res) => {
    const user = requireUser(res);
    if (user.role !== 'customer') throw new HttpError(409, 'This account cannot apply for a trade account');
    if (user.dealer) throw new HttpError(409, user.dealer.status === 'pending' ? 'Your application is already with us' : 'You already have a trade account');
    const input = parseOr400(DealerApplicationSchema, req.body);
    const id = sqlite.transaction(() => {
      const row = sqlite
        .prepare(
          `INSERT INTO dealer_accounts (company_name, contact_name, phone, tax_number, address_line1, city, postcode, delivery_zone)
           VALUES (?, ?, ?, ?, ?, ?, ?, ?) RETURNING id`,
        )
        .get(input.companyName, input.contactName, input.phone, input.taxNumber ?? null, input.addressLine1, input.city, input.postcode, input.deliveryZone) as { id: number };
      sqlite.prepare('INSERT INTO dealer_members (user_id, dealer_account_id) VALUES (?, ?)').run(user.id, row.id);
      return row.id;
    })();
    deps.onDealerApplied(id, user);
    res.status(201).json({ id, status: 'pending' });
  });
  return router;
}
