import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import { eq } from 'drizzle-orm';
import type { Db } from '../db/client';
import { dealerAccounts, dealerMembers } from '../db/schema';
import type { Auth, Role } from '../services/auth';
import type { CurrentUser, DealerInfo } from '../services/current-user';
import { HttpError } from './errors';

/** Reads the session cookie once per request; routes ask for the user through currentUser(). */
export function loadSession(auth: Auth, db: Db): RequestHandler {
  const dealerOf = (userId: string) =>
    db
      .select({
        id: dealerAccounts.id,
        companyName: dealerAccounts.companyName,
        status: dealerAccounts.status,
        tier: dealerAccounts.tier,
        creditLimitCents: dealerAccounts.creditLimitCents,
        paymentTermsDays: dealerAccounts.paymentTermsDays,
        deliveryZone: dealerAccounts.deliveryZone,
        declineReason: dealerAccounts.declineReason,
        line1: dealerAccounts.addressLine1,
        city: dealerAccounts.city,
        postcode: dealerAccounts.postcode,
      })
      .from(dealerMembers)
      .innerJoin(dealerAccounts, eq(dealerAccounts.id, dealerMembers.dealerAccountId))
      .where(eq(dealerMembers.userId, userId))
      .get();
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
          dealer: dealerInfo(dealerOf(result.user.id)),
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
