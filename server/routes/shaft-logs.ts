import express, { Router, type NextFunction, type Request, type Response } from 'express';
import multer from 'multer';
import { SHAFT_LOG_MAX_BYTES, ShaftLogUploadSchema } from '../../shared/schemas/shaft-logs';
import { HttpError, parseOr400 } from '../middleware/errors';
import { requireUser } from '../middleware/session';
import type { ShaftLogService } from '../services/shaft-logs';

const idOf = (raw: unknown) => (typeof raw === 'string' && /^\d{1,12}$/.test(raw) ? Number(raw) : Number.NaN);
/** The saved check's id from the mount path (merged into this router's params). */
const fitmentIdOf = (req: { params: Record<string, unknown> }) => idOf(req.params.fitmentId);
const TOO_LARGE = `The log is larger than ${SHAFT_LOG_MAX_BYTES / 1_000_000} MB; split the session into shorter logs`;
const TEXT_TYPES = ['text/csv', 'text/plain'];

/**
 * /api/fitments/:fitmentId/shaft-logs — shaft-speed logs on a signed-in user's saved check. Upload as multipart
 * (`file`, `frameCode`, `name`) or as the file itself with Content-Type text/csv (`?frameCode=&name=`).
 */
export function shaftLogsRouter(logs: ShaftLogService): Router {
  const router = Router({ mergeParams: true });
  const multipart = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: SHAFT_LOG_MAX_BYTES, files: 1, fields: 4, fieldSize: 1000 },
    fileFilter: (_req, file, cb) => {
      const named = /\.(csv|txt)$/i.test(file.originalname);
      const typed = /^(text\/(csv|plain)|application\/(vnd\.ms-excel|csv|octet-stream))$/.test(file.mimetype);
      if (named && typed) cb(null, true);
      else cb(new HttpError(415, 'Upload the log as a CSV file (.csv)'));
    },
  });
  const plainText = express.text({ type: TEXT_TYPES, limit: SHAFT_LOG_MAX_BYTES });

  /** Either body form, with its size refused as 413 in the one error shape. */
  const readBody = (req: Request, res: Response, next: NextFunction) => {
    requireUser(res);
    const done = (err: unknown) => {
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new HttpError(413, TOO_LARGE));
        return next(new HttpError(400, 'The upload could not be read: send one file, as “file”'));
      }
      if (typeof err === 'object' && err !== null && 'type' in err && err.type === 'entity.too.large') return next(new HttpError(413, TOO_LARGE));
      return next(err);
    };
    if (req.is(TEXT_TYPES)) plainText(req, res, done);
    else if (req.is('multipart/form-data')) multipart.single('file')(req, res, done);
    else next(new HttpError(415, 'Send the log as multipart form data (file) or as text/csv'));
  };

  router.get('/', (req, res) => {
    const user = requireUser(res);
    res.json({ items: logs.list(user.id, fitmentIdOf(req)) });
  });

  router.get('/sample.csv', (req, res) => {
    const user = requireUser(res);
    const { frameCode } = parseOr400(ShaftLogUploadSchema, { frameCode: req.query.frameCode }, 'Choose a frame for the sample');
    const sample = logs.sample(user.id, fitmentIdOf(req), frameCode);
    res.set({ 'Content-Type': 'text/csv; charset=utf-8', 'Content-Disposition': `attachment; filename="${sample.fileName}"`, 'Cache-Control': 'private, no-store' });
    res.send(sample.csv);
  });

  router.post('/', readBody, (req, res) => {
    const user = requireUser(res);
    const fitmentId = fitmentIdOf(req);
    let text: string;
    let fields: unknown;
    let fileName: string | undefined;
    if (typeof req.body === 'string') {
      text = req.body;
      fields = { frameCode: req.query.frameCode, name: req.query.name };
    } else {
      if (!req.file) throw new HttpError(400, 'Choose a log file to upload', { file: ['choose a log file (.csv)'] });
      text = req.file.buffer.toString('utf8');
      fields = req.body;
      fileName = req.file.originalname;
    }
    const form = parseOr400(ShaftLogUploadSchema, fields, 'Some details of the log need fixing');
    res.status(201).json(logs.upload(user.id, fitmentId, form, { text, ...(fileName ? { fileName } : {}) }));
  });

  router.get('/:logId', (req, res) => {
    const user = requireUser(res);
    res.json(logs.get(user.id, fitmentIdOf(req), idOf(req.params.logId)));
  });

  router.delete('/:logId', (req, res) => {
    const user = requireUser(res);
    logs.remove(user.id, fitmentIdOf(req), idOf(req.params.logId));
    res.status(204).end();
  });
  return router;
}
