import { Router } from 'express';
import { DealerApplicationSchema } from '../../shared/schemas/accounts';
import { parseOr400 } from '../middleware/errors';
import { currentUser, requireUser } from '../middleware/session';
import type { DealerAccountsService } from '../services/dealer-accounts';

export interface AccountRouterDeps {
  dealers: DealerAccountsService;
  payments: { mode: 'test' | 'live'; publishableKey: string; testMethods?: Array<{ id: string; label: string }> };
  demoAccounts?: Array<{ role: string; email: string; password: string }>;
}

export function accountRouter(deps: AccountRouterDeps): Router {
  const router = Router();
  const { dealers } = deps;

  router.get('/me', (_req, res) => {
    const user = currentUser(res);
    res.json({
      user: user && {
        ...user,
        dealer: user.dealer && { ...user.dealer, openBalanceCents: dealers.openBalance(user.dealer.id) },
      },
      ...(deps.demoAccounts ? { demoAccounts: deps.demoAccounts } : {}),
      payments: deps.payments,
    });
  });

  router.post('/dealer-applications', (req, res) => {
    const user = requireUser(res);
    // Someone who may not apply hears so before their form is checked.
    dealers.assertMayApply(user);
    const input = parseOr400(DealerApplicationSchema, req.body);
    res.status(201).json(dealers.apply(user, input));
  });
  return router;
}
