import crypto from 'node:crypto';
import type {} from 'express-session';
import type { Request, RequestHandler } from 'express';
import type { Actor } from '@shared/permissions';
import { forbidden, unauthorized } from '../errors';
import type { User } from '../models';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
    /** The account the CSRF token was issued to (null: a visitor); a sign-in gets a new token. */
    csrfUser?: number | null;
    returnTo?: string;
  }
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport puts the signed-in User model on req.user
    interface User {
      id: number;
    }
  }
}

/** The signed-in person as the policy sees them, or null for a visitor. */
export function actorOf(req: Request): Actor | null {
  const user = req.user as User | undefined;
  return user ? user.asActor() : null;
}

/** Refuses visitors with 401 and banned members with 403. */
export const requireUser: RequestHandler = (req, _res, next) => {
  const actor = actorOf(req);
  if (!actor) throw unauthorized();
  if (actor.banned) throw forbidden('This account is suspended.');
  next();
};

/**
 * The session's CSRF token, created on first use and again whenever the signed-in account
 * changes, so a token seen before sign-in (which survives the session id's regeneration)
 * is worthless after it.
 */
export function csrfTokenOf(req: Request): string {
  const owner = actorOf(req)?.id ?? null;
  if (!req.session.csrfToken || (req.session.csrfUser ?? null) !== owner) {
    req.session.csrfToken = crypto.randomBytes(24).toString('base64url');
    req.session.csrfUser = owner;
  }
  return req.session.csrfToken;
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Every state-changing request authenticated by the session cookie must carry the session's
 * token in `X-CSRF-Token`; a cross-site request is refused whatever it carries.
 */
export const csrfProtection: RequestHandler = (req, _res, next) => {
  if (SAFE_METHODS.has(req.method)) return next();
  if (req.get('sec-fetch-site') === 'cross-site') throw forbidden('Cross-site requests are refused.');
  // Only a request that the session cookie authenticates can be forged; a visitor's write is
  // refused with 401 by the route itself, and an API token (Authorization header) is never
  // attached by a browser on its own.
  if (!req.user || req.authenticatedBy === 'token') return next();
  const expected = (req.session?.csrfUser ?? null) === req.user.id ? req.session?.csrfToken : undefined;
  // Compared as bytes: a non-ASCII header of the right length in characters is longer in bytes.
  const given = Buffer.from(req.get('x-csrf-token') ?? '');
  if (!expected || given.length !== Buffer.byteLength(expected) || !crypto.timingSafeEqual(given, Buffer.from(expected))) {
    throw forbidden('Missing or wrong X-CSRF-Token header; fetch /api/session for the current token.');
  }
  next();
};
