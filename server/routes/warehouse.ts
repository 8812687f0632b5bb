import { Router } from 'express';
import type { Db } from '../db/client';
import { bins } from '../db/schema';
import { AdjustmentSchema, DispatchSchema, GoodsInSchema, PackSchema, PickQueueQuerySchema, PickSchema, ReturnDecisionSchema } from '../../shared/schemas/warehouse';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireRole } from '../middleware/session';
import type { ReturnsService } from '../services/returns';
import type { WarehouseService } from '../services/warehouse';
import type { LabelService } from '../services/labels';
import { resolveScan } from '../services/scan';
import { ScanQuerySchema } from '../../shared/schemas/scan';
import { LabelQuerySchema } from '../../shared/schemas/labels';
import { ORDER_NUMBER_PATTERN } from '../../shared/part-number';

const orderNumber = (raw: unknown) => {
  const n = String(raw).trim().toUpperCase();
  if (!ORDER_NUMBER_PATTERN.test(n)) throw new HttpError(404, `No order ${String(raw).slice(0, 20)}`);
  return n;
};

export function warehouseRouter(deps: { db: Db; warehouse: WarehouseService; returns: ReturnsService; labels: LabelService }): Router {
  const { warehouse, returns } = deps;
  const router = Router();
  router.use(requireRole('warehouse', 'admin'));

  router.get('/pick-queue', (req, res) => {
    res.json(warehouse.pickQueue(parseOr400(PickQueueQuerySchema, req.query, 'Some pick queue options are not valid')));
  });
  router.get('/pick-list', (req, res) => {
    const raw = typeof req.query.orders === 'string' ? req.query.orders : '';
    const numbers = [...new Set(raw.split(',').map((s) => s.trim()).filter(Boolean))];
    if (numbers.length === 0 || numbers.length > 20) throw new HttpError(400, 'Give 1 to 20 order numbers', { orders: ['give 1 to 20 order numbers'] });
    res.json(warehouse.pickList(numbers.map(orderNumber)));
  });
  router.get('/orders/:number/pick-list', (req, res) => {
    res.json(warehouse.pickList([orderNumber(req.params.number)]));
  });
  router.post('/orders/:number/picks', (req, res) => {
    const input = parseOr400(PickSchema, req.body);
    res.json(warehouse.pick(orderNumber(req.params.number), input));
  });
  router.post('/orders/:number/pack', (req, res) => {
    const input = parseOr400(PackSchema, req.body);
    res.json(warehouse.pack(orderNumber(req.params.number), input.cartons, input.weightKg));
  });
  router.post('/orders/:number/dispatch', (req, res) => {
    const input = parseOr400(DispatchSchema, req.body);
    res.json(warehouse.dispatch(orderNumber(req.params.number), input));
  });
  router.post('/goods-in', (req, res) => {
    res.status(201).json(warehouse.goodsIn(parseOr400(GoodsInSchema, req.body)));
  });
  router.post('/adjustments', (req, res) => {
    res.status(201).json(warehouse.adjust(parseOr400(AdjustmentSchema, req.body)));
  });
  router.get('/low-stock', (_req, res) => {
    res.json({ items: warehouse.lowStock() });
  });
  router.get('/stock/:partNumber', (req, res) => {
    res.json(warehouse.stockDetail(String(req.params.partNumber).slice(0, 40)));
  });
  router.get('/bins', (_req, res) => {
    res.json({ items: deps.db.select({ code: bins.code, zone: bins.zone, walkOrder: bins.walkOrder }).from(bins).orderBy(bins.walkOrder).all() });
  });
  // Every Floor scan field asks here what a scanned code is: a part (number, cross-reference, GTIN), a bin, a return.
  router.get('/scan', (req, res) => {
    const q = parseOr400(ScanQuerySchema, req.query, 'That scan could not be read');
    res.json(resolveScan(deps.db, q.code, q.accepts));
  });
  router.get('/labels', async (req, res) => {
    res.json(await deps.labels.sheet(parseOr400(LabelQuerySchema, req.query, 'Some label choices are not valid')));
  });
  router.get('/returns', (req, res) => {
    res.json(returns.listAll(req.query.status === 'all' ? 'all' : 'requested', Number(req.query.page) || 1));
  });
  // The returns desk's scan field: a label's code as a keyboard-wedge scanner types it.
  router.get('/returns/by-code/:code', (req, res) => {
    res.json(returns.byReference(String(req.params.code)));
  });
  router.post('/returns/:id/receive', async (req, res) => {
    const decision = parseOr400(ReturnDecisionSchema, req.body);
    res.json(await returns.decide(Number(req.params.id), decision));
  });
  return router;
}
