import { Router } from 'express';
import { z } from 'zod';
import { CaughtMailListSchema } from '../../shared/schemas/dev-mail';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireRole, requireUser } from '../middleware/session';
import type { OrderService } from '../services/orders';

/**
 * Development only (absent in production): the caught-mail inbox and the card-authentication step the provider's
 * script would show. The inbox holds every customer's mail, reset links included, so it is for a signed-in
 * administrator only; the card step stays with the buyer, for their own order only, because it stands in for the page
 * the provider shows that buyer.
 */
export function devRouter(deps: { mailInboxUrl: string; paymentsApiUrl: string; orders: OrderService }): Router {
  const router = Router();
  router.get('/mail', requireRole('admin'), async (req, res) => {
    const to = typeof req.query.to === 'string' ? `?to=${encodeURIComponent(req.query.to)}` : '';
    let response: Response;
    try {
      response = await fetch(`${deps.mailInboxUrl}/messages${to}`);
    } catch {
      throw new HttpError(502, 'The mail catcher is not running');
    }
    // Parsed, not cast: only the fields the inbox page shows pass through.
    const parsed = CaughtMailListSchema.safeParse(await response.json());
    if (!parsed.success) throw new HttpError(502, 'The mail catcher answered in a form this page cannot read');
    res.json({ messages: parsed.data.messages });
  });

  router.post('/payments/:intentId/authenticate', async (req, res) => {
    const user = requireUser(res);
    const { outcome } = parseOr400(z.object({ outcome: z.enum(['succeed', 'fail']) }), req.body);
    const order = deps.orders.orderForIntent(user, String(req.params.intentId));
    const response = await fetch(`${deps.paymentsApiUrl}/_test/payment_intents/${encodeURIComponent(String(req.params.intentId))}/authenticate`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ outcome }),
    });
    if (!response.ok) throw new HttpError(409, 'This payment can no longer be authenticated');
    res.json({ order: { number: order.number }, outcome });
  });
  return router;
}
