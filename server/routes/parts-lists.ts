import { Router } from 'express';
import { AddToListSchema, CreateListSchema, OrderFromListSchema, UpdateListLineSchema, UpdateListSchema } from '../../shared/schemas/parts-lists';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireUser } from '../middleware/session';
import type { PartsListsService } from '../services/parts-lists';

const idOf = (value: unknown) => {
  const id = Number(value);
  if (!Number.isInteger(id) || id <= 0) throw new HttpError(404, 'No such list');
  return id;
};

/** A trade account's shared parts lists (services/parts-lists.ts). */
export function partsListsRouter(lists: PartsListsService): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json(lists.list(requireUser(res)));
  });
  router.post('/', (req, res) => {
    const input = parseOr400(CreateListSchema, req.body, 'The list needs a name');
    res.status(201).json(lists.create(requireUser(res), input.name));
  });
  // Adds a part, the cart or a past order to a list (or to a new one).
  router.post('/add', (req, res) => {
    const input = parseOr400(AddToListSchema, req.body, 'Choose a list and what to add');
    res.status(201).json(lists.add(requireUser(res), input));
  });
  router.get('/:id', (req, res) => {
    res.json(lists.detail(requireUser(res), idOf(req.params.id)));
  });
  router.patch('/:id', (req, res) => {
    const input = parseOr400(UpdateListSchema, req.body, 'The list needs a name');
    res.json(lists.rename(requireUser(res), idOf(req.params.id), input.name));
  });
  router.delete('/:id', (req, res) => {
    lists.remove(requireUser(res), idOf(req.params.id));
    res.status(204).end();
  });
  router.patch('/:id/lines/:lineId', (req, res) => {
    const input = parseOr400(UpdateListLineSchema, req.body, 'The quantity is not valid');
    res.json(lists.setQuantity(requireUser(res), idOf(req.params.id), idOf(req.params.lineId), input.quantity));
  });
  router.delete('/:id/lines/:lineId', (req, res) => {
    res.json(lists.removeLine(requireUser(res), idOf(req.params.id), idOf(req.params.lineId)));
  });
  // The chosen lines at the chosen quantities go into the cart.
  router.post('/:id/order', (req, res) => {
    const input = parseOr400(OrderFromListSchema, req.body, 'Choose the lines to order');
    res.status(201).json(lists.order(requireUser(res), idOf(req.params.id), input));
  });
  return router;
}
