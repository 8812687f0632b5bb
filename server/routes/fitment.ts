import { Router } from 'express';
import { FitmentRequestSchema } from '../../shared/schemas/fitment';
import { SaveFitmentSchema } from '../../shared/schemas/saved-fitments';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireUser } from '../middleware/session';
import type { FitmentService } from '../services/fitment';

/**
 * The request schema's power check is a refinement, which zod runs only once every other field parses; a body
 * missing several fields should hear about power too, in the same answer.
 */
function parseFitmentRequest(body: unknown) {
  try {
    return parseOr400(FitmentRequestSchema, body, 'Some engine details need fixing');
  } catch (err) {
    const given = typeof body === 'object' && body !== null ? (body as Record<string, unknown>) : {};
    if (err instanceof HttpError && err.fieldErrors && given.powerHp === undefined && given.powerKw === undefined) {
      err.fieldErrors.powerHp ??= ['power is required, in hp or kW'];
    }
    throw err;
  }
}

const idOf = (raw: string | undefined) => (raw && /^\d{1,12}$/.test(raw) ? Number(raw) : Number.NaN);

/** POST /api/fitment — the fitment check; GET /api/fitment/frames — the frames' compressor maps for the chart. */
export function fitmentRouter(deps: { fitment: FitmentService }): Router {
  const { fitment } = deps;
  const router = Router();
  router.post('/', (req, res) => {
    const input = parseFitmentRequest(req.body);
    res.json(fitment.check(input));
  });
  router.get('/frames', (_req, res) => {
    res.set('Cache-Control', 'public, max-age=600');
    res.json({ items: fitment.frameMaps() });
  });
  return router;
}

/** /api/fitments — a signed-in user's saved checks; another user's check answers 404, as if it did not exist. */
export function savedFitmentsRouter(deps: { fitment: FitmentService }): Router {
  const { fitment } = deps;
  const router = Router();
  router.get('/', (_req, res) => {
    const user = requireUser(res);
    res.json({ items: fitment.listSaved(user.id) });
  });
  router.get('/:id', (req, res) => {
    const user = requireUser(res);
    res.json(fitment.getSaved(user.id, idOf(req.params.id)));
  });
  router.post('/', (req, res) => {
    const user = requireUser(res);
    const { name, input } = parseOr400(SaveFitmentSchema, req.body, 'The check could not be saved');
    res.status(201).json(fitment.save(user.id, name, input));
  });
  router.delete('/:id', (req, res) => {
    const user = requireUser(res);
    fitment.removeSaved(user.id, idOf(req.params.id));
    res.status(204).end();
  });
  return router;
}
