import crypto from 'node:crypto';
import type {} from 'express-session';
import type { Request, RequestHandler } from 'express';
import type { Actor } from '@shared/permissions';
import { forbidden, unauthorized } from '../errors';
import type { User } from '../models';

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
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
  return user ? { id: user.id, role: user.role, banned: user.banned } : null;
}

/** Refuses visitors with 401 and banned members with 403. */
export const requireUser: RequestHandler = (req, _res, next) => {
  const actor = actorOf(req);
  if (!actor) throw unauthorized();
  if (actor.banned) throw forbidden('This account is suspended.');
  next();
};

/** The session's CSRF token, created on first use. */
export function csrfTokenOf(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = crypto.randomBytes(24).toString('base64url');
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
  // refused with 401 by the route itself.
  if (!req.user) return next();
  const expected = req.session?.csrfToken;
  const given = req.get('x-csrf-token');
  if (!expected || !given || given.length !== expected.length || !crypto.timingSafeEqual(Buffer.from(given), Buffer.from(expected))) {
    throw forbidden('Missing or wrong X-CSRF-Token header; fetch /api/session for the current token.');
  }
  next();
};
