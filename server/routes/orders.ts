import { Router } from 'express';
import { CheckoutSchema } from '../../shared/schemas/orders';
import { ChangeOrderSchema } from '../../shared/schemas/order-changes';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireUser } from '../middleware/session';
import type { CartService } from '../services/cart';
import type { OrderService } from '../services/orders';
import { cartOwner } from './cart';

export function checkoutRouter(orders: OrderService, cart: CartService): Router {
  const router = Router();
  router.post('/', async (req, res) => {
    const user = requireUser(res);
    if (user.role === 'warehouse' || user.role === 'workshop') throw new HttpError(403, 'Staff accounts do not place orders: sign in with a buyer\'s account');
    const input = parseOr400(CheckoutSchema, req.body, 'Some checkout details are missing or not valid');
    const owner = cartOwner(req, res, cart, false)!;
    const answer = await orders.checkout(user, owner, input);
    // 202: the order exists but its payment is still being confirmed with the provider.
    res.status(answer.outcome === 'confirming' ? 202 : 201).json(answer);
  });
  return router;
}

export function ordersRouter(orders: OrderService): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ items: orders.listOrders(requireUser(res)) });
  });
  router.get('/:number', (req, res) => {
    res.json(orders.orderDetail(requireUser(res), String(req.params.number).slice(0, 20)));
  });
  router.post('/:number/reorder', (req, res) => {
    const user = requireUser(res);
    if (user.role !== 'customer' && user.role !== 'dealer') throw new HttpError(403, 'Only buyers reorder');
    res.status(201).json(orders.reorder(user, String(req.params.number).slice(0, 20)));
  });
  // Changes before picking starts: what may be done now, lowering quantities, cancelling. 409 once picking has begun.
  router.get('/:number/changes', (req, res) => {
    res.json(orders.changesOf(requireUser(res), String(req.params.number).slice(0, 20)));
  });
  router.post('/:number/changes', async (req, res) => {
    const input = parseOr400(ChangeOrderSchema, req.body, 'The change is not valid');
    res.status(201).json(await orders.changeOrder(requireUser(res), String(req.params.number).slice(0, 20), input));
  });
  router.post('/:number/cancel', async (req, res) => {
    res.status(201).json(await orders.cancelOrder(requireUser(res), String(req.params.number).slice(0, 20)));
  });
  return router;
}
