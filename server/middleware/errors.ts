import type { ErrorRequestHandler, RequestHandler, Response } from 'express';
import { z } from 'zod';
import { DomainError, type DomainErrorKind } from '../services/errors';

/** An error a route or middleware throws on purpose (sign in first, bad request); the handler below turns it into the one error shape. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fieldErrors?: Record<string, string[]>,
  ) {
    super(message);
  }
}

export const notFound = (message = 'Not found') => new HttpError(404, message);

/** zod issues as field → messages, the shape forms show beside each field. */
export function fieldErrorsOf(error: z.ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function parseOr400<T extends z.ZodType>(schema: T, value: unknown, message = 'Some values are not valid'): z.infer<T> {
  const result = schema.safeParse(value);
  if (!result.success) throw new HttpError(400, message, fieldErrorsOf(result.error));
  return result.data;
}

/** The HTTP status of each kind of refusal a service throws. */
export const STATUS_OF_KIND: Record<DomainErrorKind, number> = {
  invalid: 400,
  'payment-declined': 402,
  'not-allowed': 403,
  'not-found': 404,
  conflict: 409,
  'too-large': 413,
  'unsupported-type': 415,
  'payment-service': 502,
};

function sendError(res: Response, status: number, message: string, fieldErrors?: Record<string, string[]>) {
  res.status(status).json({ error: { message, ...(fieldErrors ? { fieldErrors } : {}) } });
}

export const apiNotFound: RequestHandler = (_req, res) => {
  res.status(404).json({ error: { message: 'No such API route' } });
};

export function createErrorHandler(log: (err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    if (err instanceof DomainError) {
      sendError(res, STATUS_OF_KIND[err.kind], err.message, err.fieldErrors);
      return;
    }
    if (err instanceof HttpError) {
      sendError(res, err.status, err.message, err.fieldErrors);
      return;
    }
    // Body-parser and multer errors carry a status of their own (bad JSON, too large).
    const status = typeof err === 'object' && err !== null && 'status' in err ? Number(err.status) : 500;
    if (status >= 400 && status < 500) {
      res.status(status).json({ error: { message: status === 413 ? 'The upload is too large' : 'The request could not be read' } });
      return;
    }
    log(err);
    res.status(500).json({ error: { message: 'Something went wrong on our side. Please try again.' } });
  };
}
