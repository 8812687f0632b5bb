import express, { type RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import { fromNodeHeaders } from 'better-auth/node';
import { z } from 'zod';
import type { Db } from '../db/client';
import { sqliteRateLimitStore } from '../db/shared-state';
import type { Auth } from '../services/auth';
import { EMAIL_MAX, PASSWORD_MAX, PersonNameSchema, SignInSchema } from '../../shared/schemas/accounts';
import { NewPasswordSchema, SignUpSchema } from '../../shared/schemas/sign-up';
import { HttpError, parseOr400 } from './errors';

/** Nothing the auth routes take (a name, an address, a password, a token) comes near this. */
export const AUTH_BODY_LIMIT = '10kb';

/** A path inside our own site, where the auth library may send the browser back to. */
const localPath = z.string().max(300).regex(/^\/(?!\/)/, 'must be a path on this site');

/**
 * The auth library's inputs, checked with our own rules before it sees them. Unknown fields are refused, so nobody
 * sets a role or a flag through them; a value of the wrong type is a 400, never a crash inside the library.
 */
const INPUTS: Record<string, z.ZodType> = {
  '/sign-up/email': SignUpSchema.extend({ callbackURL: localPath.optional(), rememberMe: z.boolean().optional() }).strict(),
  '/sign-in/email': SignInSchema.extend({ email: SignInSchema.shape.email.max(EMAIL_MAX), callbackURL: localPath.optional(), rememberMe: z.boolean().optional() }).strict(),
  '/request-password-reset': z.object({ email: z.email('enter a valid e-mail address').max(EMAIL_MAX), redirectTo: localPath.optional() }).strict(),
  '/reset-password': z.object({ newPassword: NewPasswordSchema, token: z.string().min(1).max(200).optional() }).strict(),
  '/change-password': z.object({ currentPassword: z.string().min(1).max(PASSWORD_MAX), newPassword: NewPasswordSchema, revokeOtherSessions: z.boolean().optional() }).strict(),
  '/update-user': z.object({ name: PersonNameSchema.optional(), image: z.string().max(500).nullable().optional() }).strict(),
  '/send-verification-email': z.object({ email: z.email().max(EMAIL_MAX), callbackURL: localPath.optional() }).strict(),
};

/** Reads JSON and form bodies up to the limit; a body of any other type is refused unread. */
export function authBodyLimit(): RequestHandler[] {
  const refuseUnread: RequestHandler = (req, _res, next) => {
    const hasBody = Number(req.headers['content-length'] ?? 0) > 0 || req.headers['transfer-encoding'] !== undefined;
    if (hasBody && !req.readableEnded && req.body === undefined) throw new HttpError(415, 'Send the form as JSON');
    next();
  };
  return [express.json({ limit: AUTH_BODY_LIMIT }), express.urlencoded({ extended: false, limit: AUTH_BODY_LIMIT }), refuseUnread];
}

export function authInputGuard(): RequestHandler {
  return (req, _res, next) => {
    if (req.method !== 'POST') return next();
    const schema = INPUTS[req.path];
    if (schema) req.body = parseOr400(schema, req.body ?? {});
    else if (req.body !== undefined && (typeof req.body !== 'object' || req.body === null || Array.isArray(req.body))) throw new HttpError(400, 'The request could not be read');
    next();
  };
}

/** The limits on guessing, in one place so the answers and the README say the same. */
export interface SignInLimits {
  /** Per client address, every sign-in and reset request. */
  perAddressPerMinute: number;
  /** Per account (the e-mail typed), wrong passwords before sign-in is locked for the rest of the window. */
  failuresPerAccount: number;
  accountWindowMinutes: number;
  /** Per account, reset requests per hour (each sends a mail). */
  resetsPerAccountPerHour: number;
}

export const DEFAULT_SIGNIN_LIMITS: Omit<SignInLimits, 'perAddressPerMinute'> = { failuresPerAccount: 10, accountWindowMinutes: 15, resetsPerAccountPerHour: 5 };

const emailKey = (body: unknown) => {
  const email = typeof body === 'object' && body !== null && 'email' in body && typeof body.email === 'string' ? body.email : '';
  return email.trim().toLowerCase();
};

/**
 * Sign-in and reset limits, counted in the database so every app process counts the same client and the same
 * account together. Per address stops one client guessing many accounts; per account stops many addresses
 * guessing one.
 */
export function signInLimiters(db: Db, limits: SignInLimits): { perAddress: RequestHandler; signInPerAccount: RequestHandler; resetPerAccount: RequestHandler } {
  const perAddress = rateLimit({
    windowMs: 60_000,
    limit: limits.perAddressPerMinute,
    store: sqliteRateLimitStore(db, 'sign-in'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { message: 'Too many sign-in attempts from here. Wait a minute and try again.' } });
    },
  });
  const signInPerAccount = rateLimit({
    windowMs: limits.accountWindowMinutes * 60_000,
    limit: limits.failuresPerAccount,
    // Only wrong passwords count: a person who signs in every day is never locked out.
    skipSuccessfulRequests: true,
    keyGenerator: (req) => emailKey(req.body),
    store: sqliteRateLimitStore(db, 'sign-in-account'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({
        error: {
          message: `Sign-in to this account is paused after ${limits.failuresPerAccount} wrong passwords. Try again in ${limits.accountWindowMinutes} minutes, or reset the password by e-mail.`,
        },
      });
    },
  });
  const resetPerAccount = rateLimit({
    windowMs: 60 * 60_000,
    limit: limits.resetsPerAccountPerHour,
    keyGenerator: (req) => emailKey(req.body),
    store: sqliteRateLimitStore(db, 'reset-account'),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { message: `At most ${limits.resetsPerAccountPerHour} reset links an hour go to one address. Use the latest link, or try again later.` } });
    },
  });
  return { perAddress, signInPerAccount, resetPerAccount };
}

/** Our own words for the two answers that must not tell whether an account exists. */
export const SIGN_UP_ANSWER = 'Thank you. We have sent a message to this address: follow it to finish. If nothing arrives within a few minutes, check the spam folder.';
export const RESET_ANSWER = 'If an account uses this address, a link to choose a new password is on its way to it. The link works for one hour.';

const UNIFORM: Record<string, string> = { '/sign-up/email': SIGN_UP_ANSWER, '/request-password-reset': RESET_ANSWER };

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * Sign-up and reset requests: the library's work runs as usual (its mail goes to the background), then the answer
 * waits until a fixed time after the request arrived and says the same words whether or not the address has an
 * account. Both paths take the same time unless the work itself takes longer than the floor.
 */
export function uniformAnswers(auth: Auth, baseURL: string, floorMs: number): RequestHandler {
  return async (req, res, next) => {
    const words = req.method === 'POST' ? UNIFORM[req.path] : undefined;
    if (!words) return next();
    const started = performance.now();
    try {
      const headers = fromNodeHeaders(req.headers);
      headers.delete('content-length');
      headers.set('content-type', 'application/json');
      const answer = await auth.handler(new Request(new URL(req.originalUrl, baseURL), { method: 'POST', headers, body: JSON.stringify(req.body ?? {}) }));
      const body = await answer.text();
      await sleep(Math.max(0, floorMs - (performance.now() - started)));
      if (answer.ok) {
        res.status(200).json({ status: true, message: words });
        return;
      }
      res.status(answer.status).type('application/json').send(body);
    } catch (err) {
      next(err);
    }
  };
}
