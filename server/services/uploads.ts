import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import multer from 'multer';
import { InvalidError, TooLargeError, UnsupportedTypeError } from './errors';

const IMAGE_TYPES: Record<string, string> = { 'image/jpeg': '.jpg', 'image/png': '.png', 'image/webp': '.webp' };

/** Recognises the three image formats we accept by their first bytes, whatever the upload claims to be. */
export function sniffImage(head: Buffer): string | null {
  if (head.length >= 3 && head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return 'image/jpeg';
  if (head.length >= 8 && head.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return 'image/png';
  if (head.length >= 12 && head.subarray(0, 4).toString('latin1') === 'RIFF' && head.subarray(8, 12).toString('latin1') === 'WEBP') return 'image/webp';
  return null;
}

export interface StoredImage {
  storedName: string;
  mimeType: string;
  bytes: number;
}

/**
 * Image uploads stored outside the web root under names the server makes. Anything that is not a JPEG, PNG or
 * WebP by its content is refused with 415; a file over the limit with 413.
 *
 * Every file written for a request is removed again unless the request succeeds: a refusal for any reason — the
 * upload itself (size, count, type), the fields beside it, or the service that was to keep it — or a request that
 * is cut off leaves nothing on disk. The names are noted as they are made, so a file multer was still writing when
 * it gave up is removed too.
 */
export function imageUpload(options: { dir: string; field: string; maxBytes: number; maxFiles: number }) {
  fs.mkdirSync(options.dir, { recursive: true });
  const written = new WeakMap<Request, string[]>();
  const upload = multer({
    storage: multer.diskStorage({
      destination: options.dir,
      filename: (req, file, cb) => {
        const name = `${crypto.randomBytes(16).toString('hex')}${IMAGE_TYPES[file.mimetype] ?? '.bin'}`;
        written.get(req)?.push(path.join(options.dir, name));
        cb(null, name);
      },
    }),
    limits: { fileSize: options.maxBytes, files: options.maxFiles, fields: 20, fieldSize: 4000 },
    fileFilter: (_req, file, cb) => {
      if (IMAGE_TYPES[file.mimetype]) cb(null, true);
      else cb(new UnsupportedTypeError('Photos must be JPEG, PNG or WebP images'));
    },
  });
  const handler: RequestHandler = (req: Request, res: Response, next: NextFunction) => {
    const paths: string[] = [];
    written.set(req, paths);
    const discard = () => {
      for (const p of paths.splice(0)) fs.rmSync(p, { force: true });
    };
    // Kept only when the answer is a success; 'close' without 'finish' is a request cut off.
    res.once('finish', () => {
      if (res.statusCode >= 300) discard();
    });
    res.once('close', () => {
      if (!res.writableFinished) discard();
    });
    upload.array(options.field, options.maxFiles)(req, res, (err: unknown) => {
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      if (err) {
        discard();
        if (err instanceof multer.MulterError) {
          if (err.code === 'LIMIT_FILE_SIZE') return next(new TooLargeError(`Each photo may be at most ${Math.round(options.maxBytes / 1_000_000)} MB`));
          if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE') return next(new TooLargeError(`At most ${options.maxFiles} photos`));
          return next(new InvalidError('The upload could not be read'));
        }
        return next(err);
      }
      for (const f of files) {
        const fd = fs.openSync(f.path, 'r');
        const head = Buffer.alloc(16);
        fs.readSync(fd, head, 0, 16, 0);
        fs.closeSync(fd);
        if (sniffImage(head) !== f.mimetype) {
          discard();
          return next(new UnsupportedTypeError(`${path.basename(f.originalname).slice(0, 60)} is not a JPEG, PNG or WebP image`));
        }
      }
      next();
    });
  };
  return handler;
}

export function storedImages(req: Request): StoredImage[] {
  return ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({ storedName: f.filename, mimeType: f.mimetype, bytes: f.size }));
}

/** Resolves a stored name inside its folder only; anything else is not found. */
export function storedPath(dir: string, name: string): string | null {
  if (!/^[a-f0-9]{32}\.(jpg|png|webp)$/.test(name)) return null;
  const full = path.join(dir, name);
  return fs.existsSync(full) ? full : null;
}
