import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createErrorHandler, HttpError } from '../../server/middleware/errors';
import {
  ConflictError,
  InvalidError,
  NotAllowedError,
  NotFoundError,
  PaymentDeclinedError,
  PaymentServiceError,
  TooLargeError,
  UnsupportedTypeError,
  type DomainError,
} from '../../server/services/errors';

/** A bare Express app with the real error handler: each route throws one error, as a service or a route would. */
const thrown: Record<string, () => Error> = {
  invalid: () => new InvalidError('No bin Z-99-9', { binCode: ['no bin Z-99-9'] }),
  declined: () => new PaymentDeclinedError('Your card was declined. No payment was taken.'),
  'not-allowed': () => new NotAllowedError('Back-orders are for trade accounts'),
  'not-found': () => new NotFoundError('No such return'),
  conflict: () => new ConflictError('This invoice is already paid'),
  'too-large': () => new TooLargeError('At most 5000 rows per file'),
  unsupported: () => new UnsupportedTypeError('Photos must be JPEG, PNG or WebP images'),
  'payment-service': () => new PaymentServiceError('The payment service could not be reached. No payment was taken.'),
  http: () => new HttpError(401, 'Please sign in first'),
  bug: () => new Error('Reservation mismatch on AWL-10-0201'),
};

let server: Server;
let base = '';
const logged: unknown[] = [];
beforeAll(async () => {
  const app = express();
  app.get('/throw/:name', (req) => {
    throw thrown[String(req.params.name)]!();
  });
  // Multer and the upload checks hand their errors to next() from a callback rather than throwing.
  app.get('/next/:name', (req, _res, next) => next(thrown[String(req.params.name)]!()));
  app.use(createErrorHandler((err) => logged.push(err)));
  server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise<void>((resolve) => server.close(() => resolve()));
});

const answer = async (path: string) => {
  const res = await fetch(`${base}${path}`);
  return { status: res.status, body: (await res.json()) as unknown };
};

describe('the one error handler', () => {
  // The statuses the API has always answered for these refusals (docs/conventions.md, the handbook's error shape).
  it.each([
    ['invalid', 400],
    ['declined', 402],
    ['not-allowed', 403],
    ['not-found', 404],
    ['conflict', 409],
    ['too-large', 413],
    ['unsupported', 415],
    ['payment-service', 502],
  ])('answers a %s domain error with %i and its message, thrown or passed to next()', async (name, status) => {
    const error = thrown[name]!() as DomainError;
    const expected = { error: { message: error.message, ...(error.fieldErrors ? { fieldErrors: error.fieldErrors } : {}) } };
    expect(await answer(`/throw/${name}`)).toEqual({ status, body: expected });
    expect(await answer(`/next/${name}`)).toEqual({ status, body: expected });
  });

  it('keeps field errors beside the message and leaves the key out when there are none', async () => {
    expect((await answer('/throw/invalid')).body).toEqual({ error: { message: 'No bin Z-99-9', fieldErrors: { binCode: ['no bin Z-99-9'] } } });
    expect((await answer('/throw/conflict')).body).toEqual({ error: { message: 'This invoice is already paid' } });
  });

  it('still answers the HTTP errors routes throw, and hides anything else behind a 500 that is logged', async () => {
    expect(await answer('/throw/http')).toEqual({ status: 401, body: { error: { message: 'Please sign in first' } } });
    logged.length = 0;
    expect(await answer('/throw/bug')).toEqual({ status: 500, body: { error: { message: 'Something went wrong on our side. Please try again.' } } });
    expect(logged).toHaveLength(1);
    expect(String(logged[0])).toContain('Reservation mismatch');
  });
});
