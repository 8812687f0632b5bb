import { Router } from 'express';
import { z } from 'zod';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireUser } from '../middleware/session';
import type { OrderService } from '../services/orders';

/** Development only: the caught-mail inbox and the card-authentication step the provider's script would show. */
export function devRouter(deps: { mailInboxUrl: string; paymentsApiUrl: string; orders: OrderService }): Router {
  const router = Router();
  router.get('/mail', async (req, res) => {
    const to = typeof req.query.to === 'string' ? `?to=${encodeURIComponent(req.query.to)}` : '';
    let response: Response;
    try {
      response = await fetch(`${deps.mailInboxUrl}/messages${to}`);
    } catch {
      throw new HttpError(502, 'The mail catcher is not running');
    }
    const body = (await response.json()) as { messages: Array<{ id: string; to: string[]; from: string; subject: string; text: string; html: string; date: string }> };
    res.json({
      messages: body.messages.map((m) => ({ id: m.id, to: m.to, from: m.from, subject: m.subject, text: m.text, html: m.html, date: m.date })),
    });
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
