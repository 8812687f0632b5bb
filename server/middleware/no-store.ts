import type { RequestHandler } from 'express';

/** Catalogue answers that are the same for every signed-out visitor; caches may keep them. */
const PUBLIC_PREFIXES = ['/api/parts', '/api/frames', '/api/fitment/frames'];

const isPublic = (path: string) => PUBLIC_PREFIXES.some((p) => path === p || path.startsWith(`${p}/`));

/**
 * Personal answers (anything for a signed-in visitor or a guest cart, accounts, orders, the office) must not be
 * kept by a browser or a shared cache: `no-store`. A route that sets its own caching for public content keeps it.
 */
export function noStorePersonal(cookieNames: string[]): RequestHandler {
  return (req, res, next) => {
    const cookies = req.headers.cookie ?? '';
    const personal = cookieNames.some((name) => cookies.includes(name)) || !isPublic(req.originalUrl.split('?')[0] ?? '');
    if (personal) res.set('Cache-Control', 'no-store');
    next();
  };
}
