import type { ErrorRequestHandler, RequestHandler } from 'express';
import { z } from 'zod';

/** An error a route throws on purpose; the handler below turns it into the one error shape. */
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

export const apiNotFound: RequestHandler = (_req, res) => {
  res.status(404).json({ error: { message: 'No such API route' } });
};

export function createErrorHandler(log: (err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    if (err instanceof HttpError) {
      res.status(err.status).json({ error: { message: err.message, ...(err.fieldErrors ? { fieldErrors: err.fieldErrors } : {}) } });
      return;
    }
    // Body-parser and multer errors carry a status of their own (bad JSON, too large).
    const status = typeof err === 'object' && err !== null && 'status' in err ? Number((err as { status: unknown }).status) : 500;
    if (status >= 400 && status < 500) {
      res.status(status).json({ error: { message: status === 413 ? 'The upload is too large' : 'The request could not be read' } });
      return;
    }
    log(err);
    res.status(500).json({ error: { message: 'Something went wrong on our side. Please try again.' } });
  };
}
