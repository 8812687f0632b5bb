import { Router, type NextFunction, type Request, type Response } from 'express';
import { BENCH_QUEUE_KEYS } from '../../shared/service';
import {
  BenchScanSchema,
  InspectionSchema,
  QuoteSchema,
  RebuildSchema,
  SERVICE_PHOTO_MAX_BYTES,
  SERVICE_PHOTOS_MAX,
  ServiceBookingSchema,
  ServiceDecisionSchema,
  ServiceShipSchema,
} from '../../shared/schemas/service';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireRole, requireUser } from '../middleware/session';
import type { ServiceRequests } from '../services/service-requests';
import { imageUpload, storedImages, storedPath } from '../services/uploads';

const signedIn = (_req: Request, res: Response, next: NextFunction) => {
  requireUser(res);
  next();
};

/** Buyers' service requests: book a unit in, follow it, print its label, decide on the quote, read the invoice. */
export function serviceRouter(deps: { service: ServiceRequests; photosDir: string }): Router {
  const router = Router();
  const upload = imageUpload({ dir: deps.photosDir, field: 'photos', maxBytes: SERVICE_PHOTO_MAX_BYTES, maxFiles: SERVICE_PHOTOS_MAX });
  router.get('/', (req, res) => {
    res.json(deps.service.listOwn(requireUser(res), Number(req.query.page) || 1));
  });
  router.post('/', signedIn, upload, (req, res) => {
    const user = requireUser(res);
    if (user.role !== 'customer' && user.role !== 'dealer') throw new HttpError(403, 'Only buyers book units in for service');
    // A refusal here or in the service removes the photos that came with it (imageUpload).
    const input = parseOr400(ServiceBookingSchema, req.body);
    res.status(201).json(deps.service.book(user, input, storedImages(req)));
  });
  router.get('/photos/:name', (req, res) => {
    const user = requireUser(res);
    const name = String(req.params.name);
    const file = storedPath(deps.photosDir, name);
    if (!file || !deps.service.photoAllowed(user, name)) throw new HttpError(404, 'No such photo');
    res.sendFile(file, { dotfiles: 'allow', headers: { 'Cache-Control': 'private, max-age=3600', 'X-Content-Type-Options': 'nosniff' } });
  });
  router.get('/:reference', (req, res) => {
    res.json(deps.service.get(requireUser(res), String(req.params.reference)));
  });
  router.get('/:reference/label', async (req, res) => {
    res.json(await deps.service.label(requireUser(res), String(req.params.reference)));
  });
  router.get('/:reference/invoice', (req, res) => {
    res.json(deps.service.invoice(requireUser(res), String(req.params.reference)));
  });
  router.post('/:reference/decision', async (req, res) => {
    const user = requireUser(res);
    const input = parseOr400(ServiceDecisionSchema, req.body);
    res.json(await deps.service.decide(user, String(req.params.reference), input));
  });
  return router;
}

/** The Bench (workshop staff and administrators): queue, scan, and each step of a request. */
export function benchRouter(deps: { service: ServiceRequests; photosDir: string }): Router {
  const router = Router();
  router.use(requireRole('workshop', 'admin'));
  const upload = imageUpload({ dir: deps.photosDir, field: 'photos', maxBytes: SERVICE_PHOTO_MAX_BYTES, maxFiles: SERVICE_PHOTOS_MAX });
  const ref = (req: Request) => String(req.params.reference);

  router.get('/queue', (req, res) => {
    const q = String(req.query.queue ?? 'booked');
    const queue = (BENCH_QUEUE_KEYS as readonly string[]).includes(q) ? (q as (typeof BENCH_QUEUE_KEYS)[number]) : 'booked';
    res.json(deps.service.queue(queue, Number(req.query.page) || 1));
  });
  router.post('/scan', (req, res) => {
    const { code } = parseOr400(BenchScanSchema, req.body);
    res.json(deps.service.scan(requireUser(res), code));
  });
  router.get('/requests/:reference', (req, res) => {
    res.json(deps.service.forBench(ref(req)));
  });
  router.post('/requests/:reference/receive', (req, res) => {
    res.json(deps.service.receive(requireUser(res), ref(req)));
  });
  router.post('/requests/:reference/inspect', upload, (req, res) => {
    const input = parseOr400(InspectionSchema, req.body);
    res.json(deps.service.inspect(requireUser(res), ref(req), input, storedImages(req)));
  });
  router.post('/requests/:reference/quote', (req, res) => {
    res.json(deps.service.quote(requireUser(res), ref(req), parseOr400(QuoteSchema, req.body)));
  });
  router.post('/requests/:reference/rebuild', (req, res) => {
    res.json(deps.service.rebuild(requireUser(res), ref(req), parseOr400(RebuildSchema, req.body)));
  });
  router.post('/requests/:reference/ship', (req, res) => {
    res.json(deps.service.ship(requireUser(res), ref(req), parseOr400(ServiceShipSchema, req.body)));
  });
  return router;
}
