import express, { Router } from 'express';
import type Stripe from 'stripe';
import { HttpError } from '../middleware/errors';
import type { OrderService } from '../services/orders';

/** The payment service's webhooks: the signature is checked over the raw body before anything is parsed. */
export function webhooksRouter(deps: { payments: Stripe; secret: string; orders: OrderService }): Router {
  const router = Router();
  router.post('/payments', express.raw({ type: '*/*', limit: '512kb' }), async (req, res) => {
    const signature = req.get('stripe-signature');
    if (!signature || !Buffer.isBuffer(req.body)) throw new HttpError(400, 'Missing signature');
    let event: Stripe.Event;
    try {
      event = deps.payments.webhooks.constructEvent(req.body, signature, deps.secret);
    } catch {
      throw new HttpError(400, 'Signature does not match');
    }
    const result = await deps.orders.handlePaymentEvent(event);
    res.json({ received: true, duplicate: !result.applied });
  });
  return router;
}
