import type { NextFunction, Request, RequestHandler, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import { eq } from 'drizzle-orm';
import { changeFeedFor } from '../db/change-feed';
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
  // Signed-in requests are answered from a short-lived memory of recent sessions, keyed by the whole signed cookie
  // (so only a cookie the auth library has already accepted can hit). Every entry is dropped as soon as any session,
  // user or trade account changes in the database — sign-out, revocation, a role or ban, an approval — in this
  // process or another (the change feed's `accounts` counter, drizzle/0010), and none outlives its session or a minute.
  const feed = changeFeedFor(db);
  const remembered = new Map<string, { user: CurrentUser; until: number }>();
  let rememberedAt = -1;
  const lookUp = async (req: Request, cookie: string): Promise<CurrentUser | null> => {
    const accounts = feed.current().accounts;
    if (accounts !== rememberedAt) {
      remembered.clear();
      rememberedAt = accounts;
    }
    const now = Date.now();
    const hit = remembered.get(cookie);
    if (hit && hit.until > now) return hit.user;
    const result = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
    if (!result?.user || result.user.banned) return null;
    const user: CurrentUser = {
      id: result.user.id,
      email: result.user.email,
      name: result.user.name,
      role: (result.user.role ?? 'customer') as Role,
      dealer: dealerInfo(dealerOf(result.user.id)),
    };
    // Kept only if nothing moved while the session was being read.
    if (feed.current().accounts === rememberedAt) {
      if (remembered.size >= SESSIONS_REMEMBERED) remembered.delete(remembered.keys().next().value!);
      remembered.set(cookie, { user, until: Math.min(now + SESSION_MEMORY_MS, new Date(result.session.expiresAt).getTime()) });
    }
    return user;
  };
  return async (req, res, next) => {
    // Most catalogue requests carry no session cookie: skip the look-up for them.
    const cookie = SESSION_COOKIE.exec(req.headers.cookie ?? '')?.[1];
    if (!cookie) return next();
    try {
      const user = await lookUp(req, cookie);
      if (user) res.locals.user = user;
      next();
    } catch (err) {
      next(err);
    }
  };
}

/** The auth library's session cookie (with the __Secure- prefix over https); its value is the signed token. */
const SESSION_COOKIE = /(?:^|;\s*)(?:__Secure-)?better-auth\.session_token=([^;]+)/;
const SESSION_MEMORY_MS = 60_000;
const SESSIONS_REMEMBERED = 10_000;

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
