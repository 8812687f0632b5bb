import type { RequestHandler } from 'express';

type HeaderValue = string | number | readonly string[];

/**
 * A middleware that only sets fixed response headers (helmet with fixed directives: no nonces, nothing read from the
 * request) is run once here against a stand-in response; what it set is then set on every response directly. Helmet
 * otherwise runs its dozen header middlewares one after another on every request, a measurable share of a small
 * API answer. If the middleware does anything else — reads the request, calls back later, fails — this refuses it at
 * start-up rather than serving different headers.
 */
export function fixedHeaders(middleware: RequestHandler): RequestHandler {
  const set = new Map<string, HeaderValue>();
  const removed = new Set<string>();
  let called = false;
  const stand = {
    setHeader(name: string, value: HeaderValue) {
      set.set(name, value);
      removed.delete(name.toLowerCase());
      return stand;
    },
    removeHeader(name: string) {
      for (const key of set.keys()) if (key.toLowerCase() === name.toLowerCase()) set.delete(key);
      removed.add(name.toLowerCase());
    },
  };
  const request = new Proxy(
    {},
    {
      get(_target, property) {
        throw new Error(`fixedHeaders: the middleware read the request (${String(property)}), so its headers are not fixed`);
      },
    },
  );
  middleware(request as never, stand as never, ((err?: unknown) => {
    if (err) throw err instanceof Error ? err : new Error(String(err));
    called = true;
  }) as never);
  if (!called) throw new Error('fixedHeaders: the middleware did not call next at once');
  const headers = [...set];
  const toRemove = [...removed];
  return (_req, res, next) => {
    for (const name of toRemove) res.removeHeader(name);
    for (const [name, value] of headers) res.setHeader(name, value);
    next();
  };
}
