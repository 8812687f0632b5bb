import { Router } from 'express';
import { RETURN_PHOTO_MAX_BYTES, RETURN_PHOTOS_MAX, ReturnRequestSchema } from '../../shared/schemas/warehouse';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireUser } from '../middleware/session';
import type { ReturnsService } from '../services/returns';
import { imageUpload, storedImages, storedPath } from '../services/uploads';

export function returnsRouter(deps: { returns: ReturnsService; photosDir: string }): Router {
  const router = Router();
  const upload = imageUpload({ dir: deps.photosDir, field: 'photos', maxBytes: RETURN_PHOTO_MAX_BYTES, maxFiles: RETURN_PHOTOS_MAX });

  router.get('/', (req, res) => {
    res.json(deps.returns.listOwn(requireUser(res), Number(req.query.page) || 1));
  });
  router.get('/:reference/label', async (req, res) => {
    res.json(await deps.returns.label(requireUser(res), String(req.params.reference)));
  });
  const signedIn = (_req: unknown, res: Parameters<typeof requireUser>[0], next: () => void) => {
    requireUser(res);
    next();
  };
  router.post('/', signedIn, upload, (req, res) => {
    const user = requireUser(res);
    if (user.role !== 'customer' && user.role !== 'dealer') throw new HttpError(403, 'Only buyers return parts');
    // A refusal here or in the service removes the photos that came with it (imageUpload).
    const input = parseOr400(ReturnRequestSchema, req.body);
    res.status(201).json(deps.returns.request(user, input, storedImages(req)));
  });
  router.get('/photos/:name', (req, res) => {
    const user = requireUser(res);
    const name = String(req.params.name);
    const file = storedPath(deps.photosDir, name);
    if (!file || !deps.returns.photoAllowed(user, name)) throw new HttpError(404, 'No such photo');
    res.sendFile(file, { dotfiles: 'allow', headers: { 'Cache-Control': 'private, max-age=3600', 'X-Content-Type-Options': 'nosniff' } });
  });
  return router;
}
