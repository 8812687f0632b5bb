import { Router } from 'express';
import multer from 'multer';
import { SHAFT_LOG_MAX_BYTES } from '../../shared/schemas/shaft-logs';
import { MyUnitsQuerySchema, ServiceIntervalEditSchema, SetApplicationSchema, UnitLogUploadSchema } from '../../shared/schemas/units';
import { BEARINGS } from '../../shared/catalog';
import { APPLICATIONS } from '../../shared/schemas/fitment';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireRole, requireUser } from '../middleware/session';
import type { ServiceRemindersService } from '../services/service-reminders';
import type { UnitHistoriesService } from '../services/unit-histories';

const serialOf = (raw: unknown) => String(raw).slice(0, 40);

/** /api/units — "My units", one unit's history, its use, and shaft-speed logs uploaded for it. */
export function unitsRouter(histories: UnitHistoriesService): Router {
  const router = Router();
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: SHAFT_LOG_MAX_BYTES, files: 1, fields: 4, fieldSize: 1000 },
    fileFilter: (_req, file, cb) => {
      const named = /\.(csv|txt)$/i.test(file.originalname);
      const typed = /^(text\/(csv|plain)|application\/(vnd\.ms-excel|csv|octet-stream))$/.test(file.mimetype);
      if (named && typed) cb(null, true);
      else cb(new HttpError(415, 'Upload the log as a CSV file (.csv)'));
    },
  });

  router.get('/mine', (req, res) => {
    const user = requireUser(res);
    res.json(histories.myUnits(user, parseOr400(MyUnitsQuerySchema, req.query).page));
  });
  router.get('/:serial', (req, res) => {
    const user = requireUser(res);
    res.json(histories.history(user, serialOf(req.params.serial)));
  });
  router.patch('/:serial', (req, res) => {
    const user = requireUser(res);
    const { application } = parseOr400(SetApplicationSchema, req.body, 'Choose how the unit is used');
    res.json(histories.setApplication(user, serialOf(req.params.serial), application));
  });
  router.post(
    '/:serial/logs',
    (req, res, next) => {
      requireUser(res);
      if (!req.is('multipart/form-data')) return next(new HttpError(415, 'Send the log as multipart form data (file)'));
      upload.single('file')(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError) return next(err.code === 'LIMIT_FILE_SIZE' ? new HttpError(413, `The log is larger than ${SHAFT_LOG_MAX_BYTES / 1_000_000} MB; split the session into shorter logs`) : new HttpError(400, 'The upload could not be read: send one file, as “file”'));
        next(err);
      });
    },
    (req, res) => {
      const user = requireUser(res);
      if (!req.file) throw new HttpError(400, 'Choose a log file to upload', { file: ['choose a log file (.csv)'] });
      const form = parseOr400(UnitLogUploadSchema, req.body, 'Some details of the log need fixing');
      const text = req.file.buffer.toString('utf8');
      res.status(201).json(histories.uploadLog(user, serialOf(req.params.serial), form, { text, fileName: req.file.originalname }));
    },
  );
  return router;
}

/** /api/admin/service-intervals — how often units should come in, by bearing and use (administrators). */
export function serviceIntervalsRouter(reminders: ServiceRemindersService): Router {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/', (_req, res) => {
    res.json({ items: reminders.intervals() });
  });
  router.put('/:bearing/:application', (req, res) => {
    const user = requireUser(res);
    const bearing = BEARINGS.find((b) => b === req.params.bearing);
    const application = APPLICATIONS.find((a) => a === req.params.application);
    if (!bearing || !application) throw new HttpError(404, 'No such interval');
    const { months } = parseOr400(ServiceIntervalEditSchema, req.body, 'Check the interval');
    res.json(reminders.setInterval(user.id, bearing, application, months));
  });
  return router;
}
