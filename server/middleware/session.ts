import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import type { Db } from '../db/client';
import type { Auth, Role } from '../services/auth';
import type { CurrentUser, DealerInfo } from '../services/current-user';
import { HttpError } from './errors';

/** Reads the session cookie once per request; routes ask for the user through currentUser(). */
export function loadSession(auth: Auth, db: Db): RequestHandler {
  const dealerOf = db.$client.prepare(
    `SELECT d.id, d.company_name AS companyName, d.status, d.tier, d.credit_limit_cents AS creditLimitCents,
            d.payment_terms_days AS paymentTermsDays, d.delivery_zone AS deliveryZone, d.decline_reason AS declineReason,
            d.address_line1 AS line1, d.city, d.postcode
     FROM dealer_members m JOIN dealer_accounts d ON d.id = m.dealer_account_id WHERE m.user_id = ?`,
  );
  return async (req, res, next) => {
    // Most catalogue requests carry no session cookie: skip the look-up for them.
    if (!req.headers.cookie?.includes('better-auth.session_token')) return next();
    try {
      const result = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
      if (result?.user && !result.user.banned) {
        const role = (result.user.role ?? 'customer') as Role;
        res.locals.user = {
          id: result.user.id,
          email: result.user.email,
          name: result.user.name,
          role,
          dealer: dealerInfo(dealerOf.get(result.user.id) as (Omit<DealerInfo, 'address'> & { line1: string; city: string; postcode: string }) | undefined),
        } satisfies CurrentUser;
      }
      next();
    } catch (err) {
      next(err);
    }
  };
}

function dealerInfo(row: (Omit<DealerInfo, 'address'> & { line1: string; city: string; postcode: string }) | undefined): DealerInfo | null {
  if (!row) return null;
  const { line1, city, postcode, ...rest } = row;
  return { ...rest, address: { line1, city, postcode } };
}

export function currentUser(res: Response): CurrentUser | null {
  return (res.locals.user as CurrentUser | undefined) ?? null;
}

export function requireUser(res: Response): CurrentUser {
  const user = currentUser(res);
  if (!user) throw new HttpError(401, 'Please sign in first');
  return user;
}

/** 401 when signed out, 403 when the role may not do this. */
export function requireRole(...roles: Role[]): RequestHandler {
  return (_req: Request, res: Response, next: NextFunction) => {
    const user = requireUser(res);
    if (!roles.includes(user.role)) throw new HttpError(403, 'Your account cannot do this');
    next();
  };
}

/**
 * Refuses state-changing requests that a browser sent from another site. Browsers send Origin (and
 * Sec-Fetch-Site) on such requests; tools without them are not browsers and carry no ambient cookies by accident.
 */
export function refuseCrossSite(trustedOrigins: string[]): RequestHandler {
  const trusted = new Set(trustedOrigins);
  return (req, _res, next) => {
    if (req.method === 'GET' || req.method === 'HEAD' || req.method === 'OPTIONS') return next();
    const origin = req.get('origin');
    const site = req.get('sec-fetch-site');
    if (site === 'cross-site' || (origin && origin !== 'null' && !trusted.has(origin)) || origin === 'null') {
      throw new HttpError(403, 'Requests from other sites are refused');
    }
    next();
  };
}
