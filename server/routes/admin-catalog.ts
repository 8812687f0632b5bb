import { Router } from 'express';
import multer from 'multer';
import {
  AuditQuerySchema,
  PART_PHOTO_MAX_BYTES,
  PRICE_IMPORT_MAX_BYTES,
  PartFormSchema,
  PartLinksSchema,
  PriceImportAcknowledgeSchema,
  PriceImportApplySchema,
  PriceImportFixSchema,
  PriceImportSettingsSchema,
  SupersedeSchema,
} from '../../shared/schemas/admin-catalog';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireRole, requireUser } from '../middleware/session';
import type { AuditLogReader } from '../services/audit-log';
import type { CatalogAdmin } from '../services/catalog-admin';
import { imageUpload, storedImages } from '../services/uploads';

export function adminCatalogRouter(deps: { admin: CatalogAdmin; audit: AuditLogReader; photosDir: string }): Router {
  const { admin } = deps;
  const router = Router();
  router.use(requireRole('admin'));
  const number = (raw: unknown) => String(raw).slice(0, 40);

  router.get('/parts/:partNumber', (req, res) => {
    res.json(admin.getForm(number(req.params.partNumber)));
  });
  router.post('/parts', (req, res) => {
    res.status(201).json(admin.create(requireUser(res).id, parseOr400(PartFormSchema, req.body)));
  });
  router.put('/parts/:partNumber', (req, res) => {
    res.json(admin.update(requireUser(res).id, number(req.params.partNumber), parseOr400(PartFormSchema, req.body)));
  });
  router.post('/parts/:partNumber/supersede', (req, res) => {
    res.json(admin.supersede(requireUser(res).id, number(req.params.partNumber), parseOr400(SupersedeSchema, req.body).replacedBy));
  });
  router.put('/parts/:partNumber/links', (req, res) => {
    res.json(admin.setLinks(requireUser(res).id, number(req.params.partNumber), parseOr400(PartLinksSchema, req.body).partNumbers));
  });
  router.post('/parts/:partNumber/photos', imageUpload({ dir: deps.photosDir, field: 'photo', maxBytes: PART_PHOTO_MAX_BYTES, maxFiles: 4 }), (req, res) => {
    const photos = storedImages(req);
    if (photos.length === 0) throw new HttpError(400, 'Choose a photo to upload', { photo: ['choose a photo'] });
    res.status(201).json(admin.addPhotos(requireUser(res).id, number(req.params.partNumber), photos.map((p) => p.storedName)));
  });

  const csvUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PRICE_IMPORT_MAX_BYTES, files: 1 } });
  router.post('/price-imports', (req, res, next) => {
    csvUpload.single('file')(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError && err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, `The file is larger than ${PRICE_IMPORT_MAX_BYTES / 1_000_000} MB`));
      if (err) return next(err);
      try {
        const file = req.file;
        if (!file) throw new HttpError(400, 'Choose a CSV file to upload', { file: ['choose a CSV file'] });
        if (!/\.(csv|txt)$/i.test(file.originalname) || !/^(text\/(csv|plain)|application\/(vnd\.ms-excel|csv|octet-stream))$/.test(file.mimetype)) {
          throw new HttpError(415, 'Upload a CSV file (.csv)');
        }
        res.status(201).json(admin.startImport(requireUser(res).id, file.originalname, file.buffer.toString('utf8')));
      } catch (e) {
        next(e);
      }
    });
  });
  router.get('/price-imports', (req, res) => {
    const page = Number(req.query.page ?? 1);
    res.json(admin.history(Number.isInteger(page) && page >= 1 && page <= 100_000 ? page : 1));
  });
  router.get('/price-imports/:id', (req, res) => {
    res.json(admin.viewImport(Number(req.params.id)));
  });
  router.put('/price-imports/:id/rows/:row', (req, res) => {
    res.json(admin.fixRow(Number(req.params.id), Number(req.params.row), parseOr400(PriceImportFixSchema, req.body).input));
  });
  router.delete('/price-imports/:id/rows/:row', (req, res) => {
    res.json(admin.dropRow(Number(req.params.id), Number(req.params.row)));
  });
  router.put('/price-imports/:id/settings', (req, res) => {
    res.json(admin.setThreshold(Number(req.params.id), parseOr400(PriceImportSettingsSchema, req.body).maxChangePct));
  });
  router.post('/price-imports/:id/acknowledge', (req, res) => {
    res.json(admin.acknowledge(Number(req.params.id), parseOr400(PriceImportAcknowledgeSchema, req.body)));
  });
  router.post('/price-imports/:id/apply', (req, res) => {
    const { expectChanges } = parseOr400(PriceImportApplySchema, req.body ?? {});
    res.json(admin.apply(Number(req.params.id), requireUser(res).id, expectChanges));
  });
  router.get('/audit', (req, res) => {
    res.json(deps.audit.list(parseOr400(AuditQuerySchema, req.query)));
  });
  return router;
}
