import { Router, type Request, type Response } from 'express';
import { DealerApplicationSchema } from '../../shared/schemas/accounts';
import { StatementQuerySchema } from '../../shared/schemas/statement';
import { statementCsv } from '../../shared/statement-csv';
import { HttpError, parseOr400 } from '../middleware/errors';
import { currentUser, requireUser } from '../middleware/session';
import type { DealerAccountsService } from '../services/dealer-accounts';
import type { DealerStatements } from '../services/dealer-statement';

export interface AccountRouterDeps {
  dealers: DealerAccountsService;
  statements: DealerStatements;
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

  /** The signed-in dealer's own statement; a buyer without an approved trade account has none. */
  const ownStatement = (req: Request, res: Response) => {
    const user = requireUser(res);
    if (!user.dealer || user.dealer.status !== 'approved') throw new HttpError(403, 'Statements are for approved trade accounts');
    return deps.statements.statement(user.dealer.id, parseOr400(StatementQuerySchema, req.query).from);
  };
  router.get('/statement', (req, res) => {
    res.json(ownStatement(req, res));
  });
  router.get('/statement.csv', (req, res) => {
    const s = ownStatement(req, res);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="statement-${s.asOf}.csv"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(statementCsv(s));
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
