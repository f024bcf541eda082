import type { RequestHandler } from 'express';
import { atLeast, type Role } from '@shared/permissions';
import { logEvent } from '../logging';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * One `http_request` line per answered request (method, path without its query, status,
 * duration in ms, account id), and an `authz_admin` line for every successful write by a
 * moderator or admin: moderation decisions (with the decision, when the body names one), page
 * protection, merges and role changes alike, whichever route performs them.
 */
export function requestLog(): RequestHandler {
  return (req, res, next) => {
    const started = process.hrtime.bigint();
    res.once('finish', () => {
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      logEvent('http_request', req, { status: res.statusCode, ms: Math.round(ms * 10) / 10 });
      const user = req.user as { id: number; role: Role } | undefined;
      if (user && !SAFE_METHODS.has(req.method) && res.statusCode < 400 && atLeast(user.role, 'moderator')) {
        const body = req.valid?.body as { decision?: unknown } | undefined;
        logEvent('authz_admin', req, { role: user.role, status: res.statusCode, ...(typeof body?.decision === 'string' ? { decision: body.decision } : {}) });
      }
    });
    next();
  };
}

/**
 * Logs how a sign-in round trip ended, from the callback's answer: a session with an account
 * is `authn_login_success`, a redirect to the sign-in page's failure view is `authn_login_fail`.
 * Mount on the OAuth callback path, before the route.
 */
export function signInOutcomeLog(failurePath: string): RequestHandler {
  return (req, res, next) => {
    res.once('finish', () => {
      const location = String(res.getHeader('location') ?? '');
      if (req.user && res.statusCode < 400 && !location.startsWith(failurePath)) logEvent('authn_login_success', req);
      else if (location.startsWith(failurePath) || res.statusCode >= 400) logEvent('authn_login_fail', req, { status: res.statusCode });
    });
    next();
  };
}
